// Database version 3 from a populated version 2: maker's limits, own reading types, current-visit marks and undo
// copies move from the settings and drafts stores to typed stores, and nothing is lost on the way.
import 'fake-indexeddb/auto';
import { openDB } from 'idb';
import { describe, expect, it } from 'vitest';
import { demoInstruments, demoVisits, emptyOwnTypeDraft, openStore, ownTypeFromDraft, type ReadingType } from '../../../src/store';
import { freshName, registerCleanup, testEngine } from './helpers';

registerCleanup();

/** A database exactly as version 2 of the schema built it. */
async function version2(name: string) {
  return openDB(name, 2, {
    upgrade(db) {
      db.createObjectStore('instruments', { keyPath: 'id' }).createIndex('byName', 'name');
      db.createObjectStore('settings', { keyPath: 'key' });
      const visits = db.createObjectStore('visits', { keyPath: 'id' });
      visits.createIndex('byInstrument', 'instrumentId');
      visits.createIndex('byStart', 'startedAt');
      const readings = db.createObjectStore('readings', { keyPath: 'id' });
      readings.createIndex('byVisit', 'visitId');
      readings.createIndex('byInstrumentType', ['instrumentId', 'typeId']);
      db.createObjectStore('walks', { keyPath: 'id' }).createIndex('byVisit', 'visitId');
      db.createObjectStore('drafts', { keyPath: 'key' });
    },
  });
}

function ownType(label: string, taken: Set<string>): ReadingType {
  const r = ownTypeFromDraft({ ...emptyOwnTypeDraft(), label, unit: 'L/min', min: '0', max: '100' }, taken);
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  taken.add(r.type.id);
  return r.type;
}

describe('migration from schema version 2 to 3', () => {
  it('moves every typed record out of settings and drafts, keeps the rest, and reads them back the same', async () => {
    const name = freshName();
    const [kestrel, heron] = demoInstruments;
    const visit = demoVisits.find((v) => v.instrumentId === kestrel.id)!;
    const taken = new Set<string>();
    // Added in this order; "Zeta" sorts after "Alpha" by id but was added first, and stays first.
    const types = [ownType('Zeta chiller flow', taken), ownType('Alpha purge flow', taken)];
    const limit = { typeId: 'multiplier-voltage', high: 2800, source: 'site rule 4.2' };
    const undoCopy = { profile: heron, bundles: [], deletedAt: new Date().toISOString() };
    const v2 = await version2(name);
    await v2.put('instruments', kestrel);
    await v2.put('visits', visit);
    await v2.put('settings', { key: 'theme', value: 'dark' });
    await v2.put('settings', { key: 'ownReadingTypes', value: types });
    await v2.put('settings', { key: `makerLimits:${kestrel.id}`, value: [limit] });
    await v2.put('settings', { key: `currentVisit:${kestrel.id}`, value: visit.id });
    await v2.put('drafts', { key: `undo:instrument:${heron.id}`, value: undoCopy, updatedAt: undoCopy.deletedAt });
    await v2.put('drafts', { key: 'visit-form:new', value: { site: 'half typed' }, updatedAt: undoCopy.deletedAt });
    v2.close();

    const store = await openStore(name, {}, { engine: testEngine });
    expect(store.db.version).toBe(3);
    // Read back through the store, as before.
    expect((await store.listReadingTypes()).filter((t) => t.own).map((t) => t.label)).toEqual(['Zeta chiller flow', 'Alpha purge flow']);
    expect(await store.listMakerLimits(kestrel.id)).toEqual([limit]);
    expect((await store.currentVisit(kestrel.id))?.id).toBe(visit.id);
    expect(await store.deletedInstrument()).toMatchObject({ profile: { id: heron.id }, visits: 0 });
    expect(await store.getSetting('theme')).toBe('dark');
    expect(await store.getDraft('visit-form:new')).toEqual({ site: 'half typed' });
    // Kept in the typed stores now, and gone from the untyped ones.
    expect(await store.db.get('makerLimits', kestrel.id)).toEqual({ instrumentId: kestrel.id, limits: [limit] });
    expect(await store.db.get('currentVisits', kestrel.id)).toEqual({ instrumentId: kestrel.id, visitId: visit.id });
    expect((await store.db.getAll('ownTypes')).map((r) => r.order)).toEqual([1, 0]);
    expect(await store.db.get('undoCopies', heron.id)).toMatchObject({ instrumentId: heron.id, profile: heron });
    expect((await store.db.getAll('settings')).map((s) => s.key)).toEqual(['theme']);
    expect((await store.db.getAll('drafts')).map((d) => d.key)).toEqual(['visit-form:new']);
    // The backup file still carries them as the settings they were (format version 1 is unchanged).
    const backup = JSON.parse(await store.exportBackup()) as { data: { settings: { key: string; value: unknown }[] } };
    expect(backup.data.settings.map((s) => s.key)).toEqual([`currentVisit:${kestrel.id}`, `makerLimits:${kestrel.id}`, 'ownReadingTypes', 'theme']);
    expect(backup.data.settings.find((s) => s.key === 'ownReadingTypes')?.value).toEqual(types.map((t) => ({ ...t, own: true })));
    store.close();
  });

  it('a backup made before version 3 restores into the typed stores', async () => {
    const store = await openStore(freshName(), {}, { engine: testEngine });
    await store.loadDemo();
    const [kestrel] = demoInstruments;
    const limit = { typeId: 'multiplier-voltage', low: 1000, source: 'maker guide, table 3' };
    const doc = JSON.parse(await store.exportBackup());
    doc.data.settings.push({ key: `makerLimits:${kestrel.id}`, value: [limit] });
    doc.counts.settings += 1;
    doc.checksum.value = await (await import('../../../src/store')).sha256Hex(JSON.stringify(doc.data));
    const text = JSON.stringify(doc);
    expect(await store.importBackup(text)).toMatchObject({ added: 1 });
    expect(await store.listMakerLimits(kestrel.id)).toEqual([limit]);
    expect((await store.importBackup(text)).updated).toBe(0);
    store.close();
  });
});
