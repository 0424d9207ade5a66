// Full backup of everything on the device as one JSON document, and an all-or-nothing restore.
//
// Format "rodside-backup", version 1:
//   { format, version, createdAt, schemaVersion, counts, checksum: { algorithm: "SHA-256", of: "data", value },
//     data: { instruments, visits, readings, walks, settings, drafts } }
// The checksum is the SHA-256 of JSON.stringify(data) exactly as written, so a reader re-serialises the
// parsed data and compares; whitespace changes do not matter, any change of content does.
import type { IDBPDatabase } from 'idb';
import {
  draftProblems, instrumentProblems, readingProblems, settingProblems, shown, visitProblems, walkProblems,
} from '../records/validate';
import { abortQuietly } from './errors';
import { allSettings, typedSetting, writeSetting } from './marks';
import type { RodsideSchema } from './schema';
import { DB_VERSION } from './schema';
import { sha256Hex } from './sha256';

export const BACKUP_FORMAT = 'rodside-backup';
export const BACKUP_VERSION = 1;
/** A backup larger than this is refused before parsing (a phone would struggle, and no real record set is near it). */
export const BACKUP_MAX_CHARS = 64 * 1024 * 1024;

export const backupStores = ['instruments', 'visits', 'readings', 'walks', 'settings', 'drafts'] as const;
/** Stores a backup holds as settings records (see marks.ts). */
const typedStores = ['makerLimits', 'ownTypes', 'currentVisits'] as const;
type BackupStore = (typeof backupStores)[number];

const keyOf: Record<BackupStore, 'id' | 'key'> = {
  instruments: 'id', visits: 'id', readings: 'id', walks: 'id', settings: 'key', drafts: 'key',
};

const checkers: Record<BackupStore, (path: string, v: unknown) => string[]> = {
  instruments: instrumentProblems,
  visits: visitProblems,
  readings: readingProblems,
  walks: walkProblems,
  settings: settingProblems,
  drafts: draftProblems,
};

export interface ImportResult {
  added: number;
  updated: number;
  unchanged: number;
}

/** A backup that cannot be restored. The message says what is wrong and where; nothing was written. */
export class BackupError extends Error {
  readonly userMessage: string;
  constructor(message: string) {
    super(message);
    this.name = 'BackupError';
    this.userMessage = `The backup was not restored, and nothing on this device was changed: ${message}`;
  }
}

/** JSON with object keys sorted, undefined members dropped: two records are the same when these agree. */
export function canonicalJson(v: unknown): string {
  if (v === null || typeof v !== 'object') return JSON.stringify(v) ?? 'null';
  if (Array.isArray(v)) return `[${v.map((x) => (x === undefined ? 'null' : canonicalJson(x))).join(',')}]`;
  const keys = Object.keys(v as object).filter((k) => (v as Record<string, unknown>)[k] !== undefined).sort();
  return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson((v as Record<string, unknown>)[k])}`).join(',')}}`;
}

export async function exportBackupText(db: IDBPDatabase<RodsideSchema>, now = new Date()): Promise<string> {
  const tx = db.transaction([...backupStores, ...typedStores], 'readonly');
  const data: Record<BackupStore, unknown[]> = {
    instruments: await tx.objectStore('instruments').getAll(),
    visits: await tx.objectStore('visits').getAll(),
    readings: await tx.objectStore('readings').getAll(),
    walks: await tx.objectStore('walks').getAll(),
    // The typed stores travel as the settings they were before database version 3, so the file format stays.
    settings: await allSettings(tx),
    // The undo copy of a deleted instrument (its own store) stays on this device only: the user deleted it, and a
    // large copy could push the file past the size a backup accepts.
    drafts: await tx.objectStore('drafts').getAll(),
  };
  await tx.done;
  const dataText = JSON.stringify(data);
  const checksum = await sha256Hex(dataText);
  const counts = Object.fromEntries(backupStores.map((s) => [s, data[s].length]));
  const head = {
    format: BACKUP_FORMAT,
    version: BACKUP_VERSION,
    createdAt: now.toISOString(),
    schemaVersion: DB_VERSION,
    counts,
    checksum: { algorithm: 'SHA-256', of: 'data', value: checksum },
  };
  // Written by hand around the data text so the checksummed bytes are exactly those in the file.
  return `${JSON.stringify(head).slice(0, -1)},"data":${dataText}}`;
}

function fail(message: string): never {
  throw new BackupError(message);
}

function isObj(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Parse and check a backup completely, without touching the database. */
export async function parseBackup(text: unknown): Promise<Record<BackupStore, Record<string, unknown>[]>> {
  if (typeof text !== 'string') fail(`expected the text of a backup file, got ${shown(text)}`);
  if (text.length > BACKUP_MAX_CHARS) {
    fail(`the file is ${(text.length / 1048576).toFixed(1)} MB, larger than the ${BACKUP_MAX_CHARS / 1048576} MB a backup may be`);
  }
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch (err) {
    fail(`the file is not valid JSON (${err instanceof Error ? err.message : String(err)}); it may be truncated or damaged`);
  }
  if (!isObj(doc)) fail(`expected a backup object at the top level, got ${shown(doc)}`);
  for (const k of Object.keys(doc)) {
    if (!['format', 'version', 'createdAt', 'schemaVersion', 'counts', 'checksum', 'data'].includes(k)) {
      fail(`unexpected top-level field ${JSON.stringify(k.slice(0, 40))}`);
    }
  }
  if (doc.format !== BACKUP_FORMAT) fail(`format: expected "${BACKUP_FORMAT}", got ${shown(doc.format)}; this is not a Rodside backup`);
  if (doc.version !== BACKUP_VERSION) {
    fail(`version: this Rodside reads backup format version ${BACKUP_VERSION}, the file says ${shown(doc.version)}${typeof doc.version === 'number' && doc.version > BACKUP_VERSION ? ' (made by a newer Rodside: update the app first)' : ''}`);
  }
  if (typeof doc.createdAt !== 'string' || !Number.isFinite(Date.parse(doc.createdAt))) fail(`createdAt: expected an ISO 8601 date, got ${shown(doc.createdAt)}`);
  if (typeof doc.schemaVersion !== 'number' || !Number.isInteger(doc.schemaVersion) || doc.schemaVersion < 1 || doc.schemaVersion > DB_VERSION) {
    fail(`schemaVersion: expected a whole number from 1 to ${DB_VERSION}, got ${shown(doc.schemaVersion)}`);
  }
  const c = doc.checksum;
  if (!isObj(c) || c.algorithm !== 'SHA-256' || c.of !== 'data' || typeof c.value !== 'string' || !/^[0-9a-f]{64}$/.test(c.value)) {
    fail('checksum: expected {"algorithm": "SHA-256", "of": "data", "value": 64 hexadecimal digits}');
  }
  const data = doc.data;
  if (!isObj(data)) fail(`data: expected an object holding ${backupStores.join(', ')}, got ${shown(data)}`);
  for (const k of Object.keys(data)) if (!(backupStores as readonly string[]).includes(k)) fail(`data: unexpected field ${JSON.stringify(k.slice(0, 40))}`);
  const out = {} as Record<BackupStore, Record<string, unknown>[]>;
  const problems: string[] = [];
  for (const s of backupStores) {
    const list = data[s];
    if (!Array.isArray(list)) fail(`data.${s}: expected a list, got ${shown(list)}`);
    const seen = new Map<string, number>();
    list.forEach((rec, i) => {
      if (problems.length >= 5) return;
      const found = checkers[s](`${s}[${i}]`, rec);
      problems.push(...found);
      if (found.length === 0) {
        const key = (rec as Record<string, string>)[keyOf[s]];
        const first = seen.get(key);
        if (first !== undefined) problems.push(`${s}[${i}].${keyOf[s]}: ${shown(key)} appears twice (also at ${s}[${first}])`);
        else seen.set(key, i);
      }
    });
    out[s] = list as Record<string, unknown>[];
  }
  if (problems.length) fail(problems.slice(0, 5).join('; ') + (problems.length > 5 ? '; …' : ''));
  if (isObj(doc.counts)) {
    for (const s of backupStores) {
      if (doc.counts[s] !== undefined && doc.counts[s] !== out[s].length) {
        fail(`counts.${s}: the header says ${shown(doc.counts[s])} records, the file holds ${out[s].length}; it may be truncated or edited`);
      }
    }
  }
  const actual = await sha256Hex(JSON.stringify(data));
  if (actual !== c.value) fail('checksum: the SHA-256 of the data does not match the one recorded at export; the file was changed or damaged after it was made');
  return out;
}

/**
 * Restore a backup: check every record first, then merge by id in ONE read-write transaction over all
 * stores. A record that is already here and identical counts as unchanged; a different one is replaced
 * (updated); a new one is added. Any problem aborts the transaction, so the database stays exactly as it was.
 */
export async function importBackupText(db: IDBPDatabase<RodsideSchema>, text: unknown): Promise<ImportResult> {
  const incoming = await parseBackup(text);
  const tx = db.transaction([...backupStores, ...typedStores], 'readwrite');
  const result: ImportResult = { added: 0, updated: 0, unchanged: 0 };
  try {
    const existing = {} as Record<BackupStore, Map<string, unknown>>;
    for (const s of backupStores) {
      const all = (s === 'settings' ? await allSettings(tx) : await tx.objectStore(s).getAll()) as unknown as Record<string, string>[];
      existing[s] = new Map(all.map((r) => [r[keyOf[s]], r]));
    }
    // Links must hold in the merged result: visits → instruments, readings → visits (same instrument), walks → visits.
    const instrumentIds = new Set([...existing.instruments.keys(), ...incoming.instruments.map((r) => r.id as string)]);
    const visitInstrument = new Map<string, string>();
    for (const [k, v] of existing.visits) visitInstrument.set(k, (v as { instrumentId: string }).instrumentId);
    const problems: string[] = [];
    incoming.visits.forEach((v, i) => {
      const was = existing.visits.get(v.id as string) as { instrumentId?: string } | undefined;
      if (was && was.instrumentId !== v.instrumentId) problems.push(`visits[${i}].instrumentId: the visit ${shown(v.id)} already on this device belongs to another instrument`);
      visitInstrument.set(v.id as string, v.instrumentId as string);
      if (!instrumentIds.has(v.instrumentId as string)) problems.push(`visits[${i}].instrumentId: no instrument ${shown(v.instrumentId)} in the backup or on this device`);
    });
    incoming.readings.forEach((r, i) => {
      const owner = visitInstrument.get(r.visitId as string);
      if (owner === undefined) problems.push(`readings[${i}].visitId: no visit ${shown(r.visitId)} in the backup or on this device`);
      else if (owner !== r.instrumentId) problems.push(`readings[${i}].instrumentId: ${shown(r.instrumentId)} differs from its visit’s instrument ${shown(owner)}`);
    });
    incoming.walks.forEach((w, i) => {
      if (w.visitId !== undefined && !visitInstrument.has(w.visitId as string)) problems.push(`walks[${i}].visitId: no visit ${shown(w.visitId)} in the backup or on this device`);
    });
    if (problems.length) fail(problems.slice(0, 5).join('; ') + (problems.length > 5 ? '; …' : ''));
    const writes: Promise<unknown>[] = [];
    for (const s of backupStores) {
      const store = tx.objectStore(s);
      for (const rec of incoming[s]) {
        const was = existing[s].get(rec[keyOf[s]] as string);
        // Same key order is the usual case (a backup of this device), so the cheap comparison goes first.
        if (was === undefined) result.added++;
        else if (JSON.stringify(was) === JSON.stringify(rec) || canonicalJson(was) === canonicalJson(rec)) { result.unchanged++; continue; }
        else result.updated++;
        if (s === 'settings' && typedSetting(rec.key as string)) writes.push(writeSetting(tx, rec.key as string, rec.value));
        else writes.push(store.put(rec as never));
      }
    }
    await Promise.all(writes);
    await tx.done;
  } catch (err) {
    // Wait for the roll-back to finish before reporting: the error that caused the abort is rethrown below.
    await abortQuietly(tx);
    throw err;
  }
  return result;
}
