// Record integrity: the phase a noted value is kept under, the instrument's open visit, and a deleted
// instrument that can still be restored after a reload.
import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { emptyDraft, emptyVisitDraft, openStore, validateDraft, validateVisitDraft, type Store } from '../../../src/store';
import { freshName, registerCleanup, testEngine } from './helpers';

registerCleanup();

async function storeWith(name = freshName(), instrumentName = 'Bench unit'): Promise<{ store: Store; instrumentId: string; name: string }> {
  const store = await openStore(name, {}, { engine: testEngine });
  const v = validateDraft({ ...emptyDraft(), name: instrumentName, rodFieldRadius: '4.5', rodLength: '150', rfFrequency: '1.0', maxRfAmplitude: '1500', axialEnergy: '5' });
  if (!v.ok) throw new Error('bad profile');
  const inst = await store.saveInstrument(v.fields);
  return { store, instrumentId: inst.id, name };
}

async function visitOf(store: Store, instrumentId: string, startedAt = '2026-03-01T09:30:00.000Z') {
  const d = validateVisitDraft({ ...emptyVisitDraft(instrumentId), startedAt, engineer: 'Field engineer', site: 'Room 1' });
  if (!d.ok) throw new Error(JSON.stringify(d.errors));
  return store.saveVisit(d.fields);
}

describe('the instrument’s open visit', () => {
  it('is the visit marked current, only while it exists and belongs to that instrument', async () => {
    const { store, instrumentId } = await storeWith();
    const other = await store.duplicateInstrument(instrumentId);
    expect(await store.currentVisit(instrumentId)).toBeUndefined();
    const v = await visitOf(store, instrumentId);
    await store.setCurrentVisit(instrumentId, v.id);
    expect((await store.currentVisit(instrumentId))?.id).toBe(v.id);
    // A mark that points at another instrument's visit does not count.
    await store.setCurrentVisit(other.id, v.id);
    expect(await store.currentVisit(other.id)).toBeUndefined();
    // Cleared, or pointing at a deleted visit: none.
    await store.deleteVisit(v.id);
    expect(await store.currentVisit(instrumentId)).toBeUndefined();
    await store.setCurrentVisit(instrumentId, null);
    expect(await store.currentVisit(instrumentId)).toBeUndefined();
    // A setting of the wrong shape is ignored, never thrown.
    await store.setSetting(`currentVisit:${instrumentId}`, { id: v.id });
    expect(await store.currentVisit(instrumentId)).toBeUndefined();
    store.close();
  });

  it('is where "Note this" writes', async () => {
    const { store, instrumentId } = await storeWith();
    const instrument = (await store.getInstrument(instrumentId))!;
    // Older than 12 hours, so only the current mark can lead a note here.
    const v = await visitOf(store, instrumentId, '2025-01-01T09:00:00.000Z');
    await store.setCurrentVisit(instrumentId, v.id);
    const r = await store.noteReading(instrument, { label: 'x', value: 1, unit: 'V', origin: 'entered' });
    expect(r.visit.id).toBe(v.id);
    expect((await store.currentVisit(instrumentId))?.id).toBe(v.id);
    store.close();
  });
});
