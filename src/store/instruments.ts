// Instrument profiles: list, read, create or change (validated again here), duplicate.
import { profileRecordProblems, type InstrumentProfile } from '../records';
import type { Store, StoreContext } from './api';
import { guard, StoreError } from './errors';
import { newId, nowIso, stamp } from './ids';

/**
 * Names in alphabetical order, ignoring case and accents ("Élan" with the E's), then exactly. Not localeCompare:
 * its first call loads the browser's collation data, a long task on a phone, on every start.
 */
export function byName(a: string, b: string): number {
  const key = (s: string) => s.normalize('NFD').replace(/[\u0300-\u036f]/g, '').toLowerCase();
  const ka = key(a);
  const kb = key(b);
  if (ka !== kb) return ka < kb ? -1 : 1;
  return a < b ? -1 : a > b ? 1 : 0;
}

type InstrumentMethods = 'listInstruments' | 'getInstrument' | 'saveInstrument' | 'duplicateInstrument';

export function instrumentMethods({ db }: StoreContext): Pick<Store, InstrumentMethods> {
  return {
    listInstruments: () =>
      guard('read instrument profiles', async () => {
        const all = await db.getAll('instruments');
        return all.sort((x, y) => byName(x.name, y.name));
      }),

    getInstrument: (id) => guard('read the instrument profile', () => db.get('instruments', id)),

    saveInstrument: (fields, id) =>
      guard('save the instrument profile', async () => {
        const tx = db.transaction('instruments', 'readwrite');
        const existing = id ? await tx.store.get(id) : undefined;
        if (id && !existing) throw new StoreError(`Could not save: the instrument profile ${id} no longer exists.`);
        const record: InstrumentProfile = { ...fields, ...stamp('inst', existing), ...(existing?.demo ? { demo: true } : {}) };
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
        const copy: InstrumentProfile = { ...source, id: newId('inst'), name: `${source.name} (copy)`.slice(0, 80), createdAt: now, updatedAt: now };
        delete copy.demo;
        await tx.store.put(copy);
        await tx.done;
        return copy;
      }),
  };
}
