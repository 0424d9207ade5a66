// Database version 3: maker's limits, own reading types, current-visit marks and undo copies leave the untyped
// settings and drafts stores for typed stores of their own. Every record is moved; the old entries go.
import type { IDBPDatabase } from 'idb';
import { INSTRUMENT_UNDO_PREFIX, typedSetting, undoCopyFrom, writeSetting } from './marks';
import type { RodsideSchema, UpgradeTx } from './schema';

export async function migrateToTyped(db: IDBPDatabase<RodsideSchema>, tx: UpgradeTx): Promise<void> {
  db.createObjectStore('makerLimits', { keyPath: 'instrumentId' });
  db.createObjectStore('ownTypes', { keyPath: 'id' });
  db.createObjectStore('currentVisits', { keyPath: 'instrumentId' });
  db.createObjectStore('undoCopies', { keyPath: 'instrumentId' });
  for (const rec of await tx.objectStore('settings').getAll()) {
    if (!typedSetting(rec.key)) continue;
    await writeSetting(tx, rec.key, rec.value);
    await tx.objectStore('settings').delete(rec.key);
  }
  for (const rec of await tx.objectStore('drafts').getAll()) {
    if (!rec.key.startsWith(INSTRUMENT_UNDO_PREFIX)) continue;
    const copy = undoCopyFrom(rec.key.slice(INSTRUMENT_UNDO_PREFIX.length), rec.value);
    if (copy) await tx.objectStore('undoCopies').put(copy);
    await tx.objectStore('drafts').delete(rec.key);
  }
}
