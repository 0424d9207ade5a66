// The typed stores of version 3 (maker's limits, own reading types, current-visit marks, undo copies), and the
// key-and-value view of them that settings, drafts and the backup file still speak: `makerLimits:<instrument>`,
// `ownReadingTypes` and `currentVisit:<instrument>` settings, `undo:instrument:<id>` drafts. Values coming in that
// way are checked as the typed stores require; anything malformed is dropped, as reading it always dropped it.
import type { IDBPTransaction, StoreNames } from 'idb';
import { makerLimitsFrom, OWN_TYPES_SETTING, ownTypesFrom, type MakerLimit, type ReadingType, type SettingRecord } from '../records';
import type { RodsideSchema, UndoCopyRecord } from './schema';

type Names = StoreNames<RodsideSchema>;
// Transactions are typed over every store: idb's types do not let a transaction over more stores stand in for one
// over fewer, so each helper says in words which stores it needs.
type Tx<M extends IDBTransactionMode = IDBTransactionMode> = IDBPTransaction<RodsideSchema, Names[], M>;
/** Writes happen in ordinary transactions and during an upgrade. */
type WriteMode = 'readwrite' | 'versionchange';

export const MAKER_LIMITS_PREFIX = 'makerLimits:';
export const CURRENT_VISIT_PREFIX = 'currentVisit:';
/** Draft key prefix of the copy kept after an instrument is deleted, for undo across a reload. */
export const INSTRUMENT_UNDO_PREFIX = 'undo:instrument:';

export async function currentVisitIdIn(tx: Tx, instrumentId: string): Promise<string | undefined> {
  return (await tx.objectStore('currentVisits').get(instrumentId))?.visitId;
}

export async function setCurrentVisitIn(tx: Tx<WriteMode>, instrumentId: string, visitId: string | null): Promise<void> {
  if (visitId === null) await tx.objectStore('currentVisits').delete(instrumentId);
  else await tx.objectStore('currentVisits').put({ instrumentId, visitId });
}

/** The user's own reading types, in the order they were added. */
export async function ownTypesIn(tx: Tx): Promise<ReadingType[]> {
  const records = (await tx.objectStore('ownTypes').getAll()).sort((a, b) => a.order - b.order);
  return ownTypesFrom(records.map((r) => r.type));
}

/** Replace the user's own reading types with `types` (checked; their order kept). */
export async function putOwnTypesIn(tx: Tx<WriteMode>, types: unknown): Promise<void> {
  await tx.objectStore('ownTypes').clear();
  let order = 0;
  for (const type of ownTypesFrom(types)) await tx.objectStore('ownTypes').put({ id: type.id, order: order++, type });
}

export async function makerLimitsIn(tx: Tx, instrumentId: string): Promise<MakerLimit[]> {
  return makerLimitsFrom((await tx.objectStore('makerLimits').get(instrumentId))?.limits);
}

export async function putMakerLimitsIn(tx: Tx<WriteMode>, instrumentId: string, limits: unknown): Promise<void> {
  await tx.objectStore('makerLimits').put({ instrumentId, limits: makerLimitsFrom(limits) });
}

/** Which typed store a setting key belongs to, if any. */
export function typedSetting(key: string): { store: 'makerLimits' | 'currentVisits'; id: string } | { store: 'ownTypes' } | undefined {
  if (key === OWN_TYPES_SETTING) return { store: 'ownTypes' };
  if (key.startsWith(MAKER_LIMITS_PREFIX)) return { store: 'makerLimits', id: key.slice(MAKER_LIMITS_PREFIX.length) };
  if (key.startsWith(CURRENT_VISIT_PREFIX)) return { store: 'currentVisits', id: key.slice(CURRENT_VISIT_PREFIX.length) };
  return undefined;
}

/** Over settings, makerLimits, ownTypes and currentVisits. */
type SettingTx<M extends IDBTransactionMode> = Tx<M>;

/** A setting's value by key, wherever it is kept. */
export async function readSetting(tx: SettingTx<IDBTransactionMode>, key: string): Promise<unknown> {
  const typed = typedSetting(key);
  if (!typed) return (await tx.objectStore('settings').get(key))?.value;
  if (typed.store === 'ownTypes') return (await tx.objectStore('ownTypes').count()) ? ownTypesIn(tx) : undefined;
  if (typed.store === 'makerLimits') return (await tx.objectStore('makerLimits').get(typed.id))?.limits;
  return currentVisitIdIn(tx, typed.id);
}

/** Keep a setting by key, wherever it belongs. A current-visit mark that is not a visit id clears the mark. */
export async function writeSetting(tx: SettingTx<WriteMode>, key: string, value: unknown): Promise<void> {
  const typed = typedSetting(key);
  if (!typed) await tx.objectStore('settings').put({ key, value });
  else if (typed.store === 'ownTypes') await putOwnTypesIn(tx, value);
  else if (typed.store === 'makerLimits') await putMakerLimitsIn(tx, typed.id, value);
  else await setCurrentVisitIn(tx, typed.id, typeof value === 'string' ? value : null);
}

/** Every setting as a key-and-value record (the typed stores included), in key order: what a backup holds. */
export async function allSettings(tx: SettingTx<IDBTransactionMode>): Promise<SettingRecord[]> {
  const out: SettingRecord[] = await tx.objectStore('settings').getAll();
  for (const r of await tx.objectStore('makerLimits').getAll()) out.push({ key: `${MAKER_LIMITS_PREFIX}${r.instrumentId}`, value: r.limits });
  for (const r of await tx.objectStore('currentVisits').getAll()) out.push({ key: `${CURRENT_VISIT_PREFIX}${r.instrumentId}`, value: r.visitId });
  if (await tx.objectStore('ownTypes').count()) out.push({ key: OWN_TYPES_SETTING, value: await ownTypesIn(tx) });
  return out.sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
}

/** An undo copy given as a draft value, if it has the shape one needs. */
export function undoCopyFrom(instrumentId: string, value: unknown): UndoCopyRecord | undefined {
  const v = value as Partial<UndoCopyRecord> | null;
  if (typeof v !== 'object' || v === null || typeof v.profile !== 'object' || !Array.isArray(v.bundles) || typeof v.deletedAt !== 'string') return undefined;
  return { instrumentId, profile: v.profile, bundles: v.bundles, deletedAt: v.deletedAt };
}
