// Record integrity: the phase a noted value is kept under, the instrument's open visit, and a deleted
// instrument that can still be restored after a reload.
import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import {
  emptyDraft, emptyVisitDraft, INSTRUMENT_UNDO_WINDOW_MS, openStore, validateDraft, validateVisitDraft, type Store,
} from '../../../src/store';
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

describe('undo of an instrument delete survives a reload', () => {
  async function withRecords() {
    const made = await storeWith(freshName(), 'Kestrel test unit');
    const { store, instrumentId } = made;
    const v = await visitOf(store, instrumentId);
    await store.addReading({ visitId: v.id, typeId: 'multiplier-voltage', phase: 'as-found', value: 1800, entered: { text: '1800', unit: 'V' } });
    await store.addReading({ visitId: v.id, typeId: 'multiplier-voltage', phase: 'as-left', value: 1750, entered: { text: '1750', unit: 'V' } });
    await store.saveWalk({ visitId: v.id, instrumentId, treeId: 'noise', state: { at: 'NU1' }, status: 'in-progress' });
    return { ...made, visitId: v.id };
  }

  it('keeps a copy in the drafts store, and restores everything from it after the database is reopened', async () => {
    const { store, instrumentId, visitId, name } = await withRecords();
    const before = {
      instrument: await store.getInstrument(instrumentId),
      readings: await store.listReadings(visitId),
      walks: await store.listWalks(visitId),
    };
    const removed = await store.deleteInstrument(instrumentId);
    expect(await store.db.count('readings')).toBe(0);
    expect(await store.getDraft(`undo:instrument:${instrumentId}`)).toBeDefined();
    store.close();

    // A reload: a new connection, nothing in memory.
    const again = await openStore(name, {}, { engine: testEngine });
    const offer = await again.deletedInstrument();
    expect(offer).toMatchObject({ profile: { id: instrumentId, name: 'Kestrel test unit' }, visits: 1, readings: 2, walks: 1 });
    await again.restoreInstrument(offer!.profile);
    expect(await again.getInstrument(instrumentId)).toEqual(before.instrument);
    expect(await again.listReadings(visitId)).toEqual(before.readings);
    expect(await again.listWalks(visitId)).toEqual(before.walks);
    expect(removed).toEqual(before.instrument);
    // Restored once: the copy is gone, nothing more is offered.
    expect(await again.getDraft(`undo:instrument:${instrumentId}`)).toBeUndefined();
    expect(await again.deletedInstrument()).toBeUndefined();
    again.close();
  });

  it('offers only the latest deletion: the next delete drops the earlier copy', async () => {
    const { store, instrumentId } = await withRecords();
    const second = await store.duplicateInstrument(instrumentId);
    const first = await store.deleteInstrument(instrumentId);
    await store.deleteInstrument(second.id);
    expect((await store.deletedInstrument())?.profile.id).toBe(second.id);
    expect(await store.getDraft(`undo:instrument:${instrumentId}`)).toBeUndefined();
    // The first one's records are gone for good; putting its profile back brings nothing else with it.
    await store.restoreInstrument(first!);
    expect(await store.getInstrument(instrumentId)).toEqual(first);
    expect(await store.listVisits(instrumentId)).toEqual([]);
    expect((await store.deletedInstrument())?.profile.id).toBe(second.id);
    store.close();
  });

  it('drops the copy once the undo window is over', async () => {
    const { store, instrumentId } = await withRecords();
    await store.deleteInstrument(instrumentId);
    const deletedAt = Date.parse((await store.deletedInstrument())!.deletedAt);
    expect(await store.deletedInstrument(new Date(deletedAt + INSTRUMENT_UNDO_WINDOW_MS - 1000))).toBeDefined();
    expect(await store.deletedInstrument(new Date(deletedAt + INSTRUMENT_UNDO_WINDOW_MS + 1000))).toBeUndefined();
    expect(await store.getDraft(`undo:instrument:${instrumentId}`)).toBeUndefined();
    store.close();
  });

  it('is not offered once an instrument of that id is back, and never goes into a backup', async () => {
    const { store, instrumentId } = await withRecords();
    const removed = await store.deleteInstrument(instrumentId);
    const backup = JSON.parse(await store.exportBackup()) as { data: { drafts: Array<{ key: string }> } };
    expect(backup.data.drafts.map((d) => d.key)).not.toContain(`undo:instrument:${instrumentId}`);
    // The profile alone comes back some other way (here: saved again under the same id).
    await store.db.put('instruments', removed!);
    expect(await store.deletedInstrument()).toBeUndefined();
    expect(await store.getDraft(`undo:instrument:${instrumentId}`)).toBeUndefined();
    store.close();
  });
});
