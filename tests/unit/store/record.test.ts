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

describe('note this: as-found and as-left', () => {
  it('keeps a noted value as-found unless told as-left, for catalogue types and plain noted values alike', async () => {
    const { store, instrumentId } = await storeWith();
    const instrument = (await store.getInstrument(instrumentId))!;
    const found = await store.noteReading(instrument, { typeId: 'multiplier-voltage', label: 'Multiplier voltage at tune', value: 1800, unit: 'V', origin: 'entered' });
    expect(found.reading.phase).toBe('as-found');
    const left = await store.noteReading(instrument, { typeId: 'multiplier-voltage', label: 'Multiplier voltage at tune', value: 1750, unit: 'V', origin: 'entered', phase: 'as-left' });
    expect(left.reading).toMatchObject({ phase: 'as-left', typeId: 'multiplier-voltage', note: 'Multiplier voltage at tune' });
    const plain = await store.noteReading(instrument, { label: 'Filament resistance (new filament)', value: 0.4, unit: 'Ω', origin: 'entered', phase: 'as-left' });
    expect(plain.reading).toMatchObject({ phase: 'as-left', typeId: 'noted-value', context: { label: 'Filament resistance (new filament)', unit: 'Ω' } });
    // The as-left value is what a baseline takes from the visit.
    await store.markBaseline(left.visit.id);
    const baseline = await store.getBaseline(instrumentId);
    expect(baseline?.readings.map((r) => r.id).sort()).toEqual([left.reading.id, plain.reading.id].sort());
    store.close();
  });

  it('refuses a phase that is neither as-found nor as-left, naming both', async () => {
    const { store, instrumentId } = await storeWith();
    const instrument = (await store.getInstrument(instrumentId))!;
    const bad = { label: 'Odd', value: 1, unit: 'V', origin: 'entered' as const, phase: 'later' as never };
    await expect(store.noteReading(instrument, bad)).rejects.toThrow(/phase must be as-found or as-left, not “later”/);
    expect(await store.db.count('readings')).toBe(0);
    store.close();
  });
});

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
