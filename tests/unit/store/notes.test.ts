import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { emptyDraft, openStore, validateDraft, type Store } from '../../../src/store';
import { dump, freshName, registerCleanup, testEngine } from './helpers';

registerCleanup();

async function storeWithInstrument(): Promise<{ store: Store; instrumentId: string }> {
  const store = await openStore(freshName(), {}, { engine: testEngine });
  const v = validateDraft({ ...emptyDraft(), name: 'Heron bench', rodFieldRadius: '4.5', rodLength: '150', rfFrequency: '1.0', maxRfAmplitude: '1500', axialEnergy: '5' });
  if (!v.ok) throw new Error('bad profile');
  return { store, instrumentId: (await store.saveInstrument(v.fields)).id };
}

describe('"Note this" is one transaction', () => {
  it('a failure part-way (the reading is refused after the new visit was written) leaves no empty visit and no mark', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const instrument = (await store.getInstrument(instrumentId))!;
    const before = await dump(store);
    // No visit yet, so noting opens one and marks it current; then the RF reading is refused: 1e9 V is far outside
    // the accepted 0 to 20000 V. Inside the one transaction that refusal comes after the visit and the mark were put.
    await expect(store.noteReading(instrument, { typeId: 'rf-amplitude', label: 'RF at m/z 69', value: 1e9, unit: 'V', context: { mz: 69 }, origin: 'calculator' }))
      .rejects.toThrow(/Could not save the reading: .*outside 0 to 20000/);
    expect(await store.listVisits(instrumentId)).toEqual([]);
    expect(await store.currentVisit(instrumentId)).toBeUndefined();
    expect(await dump(store)).toEqual(before);
    store.close();
  });

  it('a success writes the visit, the mark and the judged reading together', async () => {
    const { store, instrumentId } = await storeWithInstrument();
    const instrument = (await store.getInstrument(instrumentId))!;
    const r = await store.noteReading(instrument, { typeId: 'vacuum-high', label: 'Analyser pressure', value: 2e-5, unit: 'mbar', context: { gaugeGas: 'N2' }, origin: 'calculator' });
    expect(r.visit.notes).toMatch(/Opened by “Note this”/);
    expect((await store.currentVisit(instrumentId))?.id).toBe(r.visit.id);
    expect(await store.listReadings(r.visit.id)).toEqual([r.reading]);
    // 2e-5 mbar is 2e-3 Pa (1 mbar = 100 Pa, NIST SP 811 (2008) B.8); the calculator's "N2" means the gauge's own scale.
    expect(r.reading.value).toBeCloseTo(2e-3, 12);
    expect(r.reading.context).toMatchObject({ gaugeGas: 'N2-equivalent', convention: 'mbar' });
    expect((await store.getVisit(r.visit.id))?.updatedAt).toBe(r.visit.updatedAt);
    store.close();
  });
});
