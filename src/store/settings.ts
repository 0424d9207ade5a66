// Settings and drafts by key (typed records reached through their old keys, see marks.ts), and erasing everything.
import type { DraftRecord } from '../records';
import type { Store, StoreContext } from './api';
import { guard } from './errors';
import { nowIso } from './ids';
import { INSTRUMENT_UNDO_PREFIX, readSetting, undoCopyFrom, writeSetting } from './marks';
import type { StoreNames } from 'idb';
import type { RodsideSchema } from './schema';

const settingStores = ['settings', 'makerLimits', 'ownTypes', 'currentVisits'] as const;
/** Every store, for erasing: what Rodside keeps on this device. */
export const allStores: readonly StoreNames<RodsideSchema>[] = [
  'instruments', 'visits', 'readings', 'walks', 'settings', 'drafts', 'makerLimits', 'ownTypes', 'currentVisits', 'undoCopies',
];

type SettingMethods = 'getSetting' | 'setSetting' | 'getDraft' | 'putDraft' | 'clearDraft' | 'eraseAll';

export function settingMethods({ db }: StoreContext): Pick<Store, SettingMethods> {
  return {
    getSetting: async <T,>(key: string) =>
      guard('read a setting', async () => {
        const tx = db.transaction([...settingStores], 'readonly');
        const value = await readSetting(tx, key);
        await tx.done;
        return value as T | undefined;
      }),
    setSetting: (key, value) =>
      guard('save a setting', async () => {
        const tx = db.transaction([...settingStores], 'readwrite');
        await writeSetting(tx, key, value);
        await tx.done;
      }),

    getDraft: async <T,>(key: string) =>
      guard('read a draft', async () => {
        if (!key.startsWith(INSTRUMENT_UNDO_PREFIX)) return (await db.get('drafts', key))?.value as T | undefined;
        const copy = await db.get('undoCopies', key.slice(INSTRUMENT_UNDO_PREFIX.length));
        return (copy ? { profile: copy.profile, bundles: copy.bundles, deletedAt: copy.deletedAt } : undefined) as T | undefined;
      }),
    putDraft: (key, value) =>
      guard('keep a draft', async () => {
        if (!key.startsWith(INSTRUMENT_UNDO_PREFIX)) {
          const rec: DraftRecord = { key, value, updatedAt: nowIso() };
          await db.put('drafts', rec);
          return;
        }
        const id = key.slice(INSTRUMENT_UNDO_PREFIX.length);
        const copy = undoCopyFrom(id, value);
        if (copy) await db.put('undoCopies', copy);
        else await db.delete('undoCopies', id);
      }),
    clearDraft: (key) =>
      guard('clear a draft', () =>
        key.startsWith(INSTRUMENT_UNDO_PREFIX) ? db.delete('undoCopies', key.slice(INSTRUMENT_UNDO_PREFIX.length)) : db.delete('drafts', key)),

    eraseAll: () =>
      guard('erase the data on this device', async () => {
        const tx = db.transaction([...allStores], 'readwrite');
        await Promise.all(allStores.map((n) => tx.objectStore(n).clear()));
        await tx.objectStore('settings').put({ key: 'demoLoaded', value: true });
        await tx.done;
      }),
  };
}
