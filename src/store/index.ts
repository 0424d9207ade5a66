// The store: the only module that talks to IndexedDB. Everything the app keeps goes through here. openStore opens
// the database and puts the per-entity modules together behind one Store; the rules they apply live in src/records.
import { deleteDB, openDB } from 'idb';
import { defaultEngine } from '../records';
import type { Store, StoreEvents, StoreOptions } from './api';
import { demoMethods } from './demo';
import { tracked } from './connection';
import { guard } from './errors';
import { instrumentMethods } from './instruments';
import { noteMethods } from './notes';
import { outputMethods } from './outputs';
import { readingMethods } from './readings';
import { readingTypeMethods } from './readingTypes';
import { DB_NAME, DB_VERSION, upgrade, type RodsideSchema } from './schema';
import { settingMethods } from './settings';
import { undoMethods } from './undo';
import { visitMethods } from './visits';
import { walkMethods } from './walks';

// The rules and shapes of records (types, units, numbers, catalogue, judging), for the UI's convenience.
export * from '../records';
export * from './api';
export { StoreError, describeStorageError } from './errors';
export { DB_NAME, DB_VERSION } from './schema';
export { demoInstruments, demoVisits, DEMO_LAB } from './demoData';
export { INSTRUMENT_UNDO_PREFIX } from './marks';
export { BACKUP_FORMAT, BACKUP_VERSION, BackupError, canonicalJson, type ImportResult } from './backup';
export { sha256Hex } from './sha256';
export { defaultEngine };

export async function openStore(name: string = DB_NAME, events: StoreEvents = {}, given: StoreOptions = {}): Promise<Store> {
  const options: StoreOptions = { engine: defaultEngine, ...given };
  const opened = await guard('open the database', () =>
    openDB<RodsideSchema>(name, DB_VERSION, {
      upgrade: (database, oldVersion, _newVersion, tx) => upgrade(database, oldVersion, tx),
      blocked: () => events.onBlocked?.(),
      blocking: (_current, _wanted, event) => {
        // Let the newer tab upgrade; this tab must reload before it writes again.
        (event.target as IDBDatabase).close();
        events.onVersionChange?.();
      },
      terminated: () => events.onVersionChange?.(),
    }),
  );
  const { db, abortRunning } = tracked(opened);
  const ctx = { db, engine: options.engine };
  return {
    name,
    db,
    close: () => db.close(),
    suspend: (until = 'unload') => {
      abortRunning(until === 'cached');
      db.close();
    },
    ...instrumentMethods(ctx),
    ...undoMethods(ctx),
    ...demoMethods(ctx),
    ...settingMethods(ctx),
    ...visitMethods(ctx),
    ...readingMethods(ctx),
    ...readingTypeMethods(ctx),
    ...walkMethods(ctx),
    ...noteMethods(ctx),
    ...outputMethods(ctx),
  };
}

/** Remove a whole database (tests, and the "erase everything on this device" action). */
export async function eraseStore(name: string = DB_NAME): Promise<void> {
  await deleteDB(name);
}
