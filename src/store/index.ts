// The store: the only module that talks to IndexedDB. Everything the app keeps goes through here.
import { deleteDB, openDB, type IDBPDatabase } from 'idb';
import { demoInstruments } from './demo';
import { describeStorageError, StoreError } from './errors';
import { newId, nowIso } from './ids';
import { profileRecordProblems, type ProfileFields } from './profile';
import { DB_NAME, DB_VERSION, upgrade, type RodsideSchema } from './schema';
import type { DraftRecord, InstrumentProfile } from './types';

export * from './types';
export * from './profile';
export { StoreError, describeStorageError } from './errors';
export { DB_NAME, DB_VERSION } from './schema';
export { demoInstruments, DEMO_LAB } from './demo';

export interface StoreEvents {
  /** Another tab holds an older connection open and our upgrade waits for it. */
  onBlocked?: () => void;
  /** A newer version wants to upgrade the database: we close, and this tab should reload. */
  onVersionChange?: () => void;
}

export interface Store {
  readonly name: string;
  close(): void;

  listInstruments(): Promise<InstrumentProfile[]>;
  getInstrument(id: string): Promise<InstrumentProfile | undefined>;
  /** Create (no id) or update (with id) a profile. Validated again here: the database never holds a bad profile. */
  saveInstrument(fields: ProfileFields, id?: string): Promise<InstrumentProfile>;
  duplicateInstrument(id: string): Promise<InstrumentProfile>;
  /** Deletes and returns the profile so the caller can offer undo via restoreInstrument. */
  deleteInstrument(id: string): Promise<InstrumentProfile | undefined>;
  restoreInstrument(profile: InstrumentProfile): Promise<void>;

  /** Load the invented demo scenario if it has never been loaded (or was removed and is asked for again). */
  loadDemo(force?: boolean): Promise<boolean>;
  removeDemo(): Promise<number>;

  getSetting<T>(key: string): Promise<T | undefined>;
  setSetting(key: string, value: unknown): Promise<void>;

  getDraft<T>(key: string): Promise<T | undefined>;
  putDraft(key: string, value: unknown): Promise<void>;
  clearDraft(key: string): Promise<void>;

  /** The underlying database, for sibling modules inside src/store only. */
  readonly db: IDBPDatabase<RodsideSchema>;
}

async function guard<T>(action: string, fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (err) {
    throw describeStorageError(action, err);
  }
}

export async function openStore(name: string = DB_NAME, events: StoreEvents = {}): Promise<Store> {
  const db = await guard('open the database', () =>
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
  const store: Store = {
    name,
    db,
    close: () => db.close(),

    listInstruments: () =>
      guard('read instrument profiles', async () => {
        const all = await db.getAll('instruments');
        return all.sort((x, y) => x.name.localeCompare(y.name));
      }),

    getInstrument: (id) => guard('read the instrument profile', () => db.get('instruments', id)),

    saveInstrument: (fields, id) =>
      guard('save the instrument profile', async () => {
        const tx = db.transaction('instruments', 'readwrite');
        const existing = id ? await tx.store.get(id) : undefined;
        if (id && !existing) throw new StoreError(`Could not save: the instrument profile ${id} no longer exists.`);
        const now = nowIso();
        const record: InstrumentProfile = {
          ...fields,
          id: existing?.id ?? newId('inst'),
          createdAt: existing?.createdAt ?? now,
          updatedAt: now,
          ...(existing?.demo ? { demo: true } : {}),
        };
        const problems = profileRecordProblems(record);
        if (problems.length) throw new StoreError(`Could not save the instrument profile: ${problems.join('; ')}.`);
        await tx.store.put(record);
        await tx.done;
        return record;
      }),

    duplicateInstrument: (id) =>
      guard('duplicate the instrument profile', async () => {
        const tx = db.transaction('instruments', 'readwrite');
        const source = await tx.store.get(id);
        if (!source) throw new StoreError(`Could not duplicate: the instrument profile ${id} no longer exists.`);
        const now = nowIso();
        const copyName = `${source.name} (copy)`.slice(0, 80);
        const copy: InstrumentProfile = { ...source, id: newId('inst'), name: copyName, createdAt: now, updatedAt: now };
        delete copy.demo;
        await tx.store.put(copy);
        await tx.done;
        return copy;
      }),

    deleteInstrument: (id) =>
      guard('delete the instrument profile', async () => {
        const tx = db.transaction('instruments', 'readwrite');
        const existing = await tx.store.get(id);
        if (existing) await tx.store.delete(id);
        await tx.done;
        return existing;
      }),

    restoreInstrument: (profile) =>
      guard('restore the instrument profile', async () => {
        await db.put('instruments', profile);
      }),

    loadDemo: (force = false) =>
      guard('load the demo instruments', async () => {
        const tx = db.transaction(['instruments', 'settings'], 'readwrite');
        const flag = await tx.objectStore('settings').get('demoLoaded');
        if (flag && !force) {
          await tx.done;
          return false;
        }
        for (const p of demoInstruments) {
          if (!(await tx.objectStore('instruments').get(p.id))) await tx.objectStore('instruments').put({ ...p });
        }
        await tx.objectStore('settings').put({ key: 'demoLoaded', value: true });
        await tx.done;
        return true;
      }),

    removeDemo: () =>
      guard('remove the demo data', async () => {
        const tx = db.transaction('instruments', 'readwrite');
        let removed = 0;
        let cursor = await tx.store.openCursor();
        while (cursor) {
          if (cursor.value.demo) {
            await cursor.delete();
            removed++;
          }
          cursor = await cursor.continue();
        }
        await tx.done;
        return removed;
      }),

    getSetting: async <T,>(key: string) =>
      guard('read a setting', async () => (await db.get('settings', key))?.value as T | undefined),
    setSetting: (key, value) => guard('save a setting', async () => void (await db.put('settings', { key, value }))),

    getDraft: async <T,>(key: string) =>
      guard('read a draft', async () => (await db.get('drafts', key))?.value as T | undefined),
    putDraft: (key, value) =>
      guard('keep a draft', async () => {
        const rec: DraftRecord = { key, value, updatedAt: nowIso() };
        await db.put('drafts', rec);
      }),
    clearDraft: (key) => guard('clear a draft', () => db.delete('drafts', key)),
  };
  return store;
}

/** Remove a whole database (tests, and the "erase everything on this device" action). */
export async function eraseStore(name: string = DB_NAME): Promise<void> {
  await deleteDB(name);
}
