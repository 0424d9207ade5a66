// The store: the only module that talks to IndexedDB. Everything the app keeps goes through here.
import { deleteDB, openDB, type IDBPDatabase, type IDBPTransaction } from 'idb';
import { exportBackupText, importBackupText, type ImportResult } from './backup';
import { catalogue, resolveUnit, typeAliases, type ReadingType } from '../records/catalogue';
import { readingsCsv } from '../records/csv';
import { demoInstruments, demoReadings, demoVisits, DEMO_LAB } from './demoData';
import { describeStorageError, StoreError } from './errors';
import { newId, nowIso } from './ids';
import {
  checkEntry, checkMakerLimit, defaultEngine, judgeWithLimit, makerLimitsFrom, makerLimitsKey, type EngineFunctions, type Expectation, type Judgement,
  type MakerLimit, type MakerLimitDraft, type ReadingContext,
} from '../records/judge';
import { profileRecordProblems, type ProfileFields } from '../records/profile';
import { readingProblems, visitProblems, walkProblems } from '../records/validate';
import { backupReminder, type BackupReminder } from '../records/reminder';
import { visitReportHtml } from '../records/report';
import { DB_NAME, DB_VERSION, upgrade, type RodsideSchema } from './schema';
import { buildTrend, DEFAULT_MULTIPLIER_LIMIT, seriesOf, type TrendData, type TrendOptions } from '../records/trends';
import type { DraftRecord, InstrumentProfile, Reading, ReadingPhase, Visit, WalkRecord } from '../records/types';
import {
  allTypes, assess, expectationOf, OWN_TYPES_SETTING, ownTypeFromDraft, ownTypesFrom, pickBaselineVisit, type BaselineSet, type OwnTypeDraft,
  type VisitFields,
} from '../records/visits';

export * from '../records';
export { StoreError, describeStorageError } from './errors';
export { DB_NAME, DB_VERSION } from './schema';
export { demoInstruments, demoVisits, DEMO_LAB } from './demoData';
export { BACKUP_FORMAT, BACKUP_VERSION, BackupError, canonicalJson, type ImportResult } from './backup';
export { sha256Hex } from './sha256';

/** What a new reading needs: the value already in base units (use checkEntry on what was typed). */
export interface NewReading {
  visitId: string;
  typeId: string;
  phase: ReadingPhase;
  value: number;
  entered: { text: string; unit: string };
  context?: ReadingContext;
  note?: string;
  takenAt?: string;
  origin?: Reading['origin'];
}

/** A visit with everything hanging off it, as deleteVisit returns it for undo. */
export interface VisitBundle {
  visit: Visit;
  readings: Reading[];
  walks: WalkRecord[];
}

/** Draft key prefix of the copy kept after an instrument is deleted, for undo across a reload. */
export const INSTRUMENT_UNDO_PREFIX = 'undo:instrument:';
/** How long a deleted instrument stays restorable: one hour, long enough for a reload or a slip noticed late. */
export const INSTRUMENT_UNDO_WINDOW_MS = 3600_000;
const undoRange = () => IDBKeyRange.bound(INSTRUMENT_UNDO_PREFIX, `${INSTRUMENT_UNDO_PREFIX}\uffff`);

/** What the drafts store keeps of a deleted instrument. */
interface DeletedInstrumentCopy {
  profile: InstrumentProfile;
  bundles: VisitBundle[];
  deletedAt: string;
}

/** A deleted instrument that can still be restored, with counts of what would come back with it. */
export interface DeletedInstrument {
  profile: InstrumentProfile;
  deletedAt: string;
  visits: number;
  readings: number;
  walks: number;
}

/** A value noted from another screen (the UI's noteThis passes this shape). */
export interface NoteInput {
  typeId?: string;
  label: string;
  value: number;
  unit: string;
  context?: Record<string, string | number>;
  origin: 'calculator' | 'entered';
  /** Before any work (default) or after it, e.g. the re-measurement that closes a corrective step. */
  phase?: ReadingPhase;
}

export interface StoreOptions {
  /** Physics for expected RF and DC values (default: the engine's scan law); injectable for tests. */
  engine?: EngineFunctions;
}

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
  /**
   * Deletes the profile with its visits, readings and walks, and returns it so the caller can offer undo. A copy
   * of everything deleted stays in the drafts store (key undo:instrument:<id>) for INSTRUMENT_UNDO_WINDOW_MS or
   * until the next deletion, so a reload does not lose the undo.
   */
  deleteInstrument(id: string): Promise<InstrumentProfile | undefined>;
  /** Put the profile back, with the visits, readings and walks from its kept copy if there still is one. */
  restoreInstrument(profile: InstrumentProfile): Promise<void>;
  /** The deleted instrument that can still be restored (and what came with it); expired copies are dropped. */
  deletedInstrument(now?: Date): Promise<DeletedInstrument | undefined>;

  /** Load the invented demo scenario if it has never been loaded (or was removed and is asked for again). */
  loadDemo(force?: boolean): Promise<boolean>;
  removeDemo(): Promise<number>;

  getSetting<T>(key: string): Promise<T | undefined>;
  setSetting(key: string, value: unknown): Promise<void>;

  getDraft<T>(key: string): Promise<T | undefined>;
  putDraft(key: string, value: unknown): Promise<void>;
  clearDraft(key: string): Promise<void>;

  // ---- Visits -------------------------------------------------------------------------------------
  /** Visits of one instrument (or all), newest first. */
  listVisits(instrumentId?: string): Promise<Visit[]>;
  getVisit(id: string): Promise<Visit | undefined>;
  /** Create (no id) or update (with id) a visit. Keeps the baseline mark and the demo flag. */
  saveVisit(fields: VisitFields, id?: string): Promise<Visit>;
  /** Delete a visit with its readings and walks in one transaction; returns them for undo. */
  deleteVisit(id: string): Promise<VisitBundle | undefined>;
  restoreVisit(bundle: VisitBundle): Promise<void>;

  // ---- Readings -----------------------------------------------------------------------------------
  /** Readings of a visit, in the order they were taken. */
  listReadings(visitId: string): Promise<Reading[]>;
  /** All readings of an instrument, optionally of one type. */
  listInstrumentReadings(instrumentId: string, typeId?: string): Promise<Reading[]>;
  /** What a value would be judged against, and the verdict, without saving anything (for the form). */
  previewReading(visitId: string, typeId: string, value: number, context: ReadingContext): Promise<{ expectation?: Expectation; judgement?: Judgement }>;
  /** Judge and save a reading, and touch its visit's updatedAt, in ONE transaction. */
  addReading(input: NewReading): Promise<Reading>;
  /** Change a reading (value, unit, context, note, phase); it is judged again. */
  updateReading(id: string, changes: Partial<Pick<NewReading, 'value' | 'entered' | 'context' | 'note' | 'phase'>>): Promise<Reading>;
  deleteReading(id: string): Promise<Reading | undefined>;
  restoreReading(reading: Reading): Promise<void>;

  // ---- Reading types ------------------------------------------------------------------------------
  /** The catalogue plus the user's own types. */
  listReadingTypes(): Promise<ReadingType[]>;
  saveOwnReadingType(draft: OwnTypeDraft): Promise<{ ok: true; type: ReadingType } | { ok: false; errors: Partial<Record<keyof OwnTypeDraft, string>> }>;
  /** Refused (StoreError) while readings of that type exist. */
  deleteOwnReadingType(id: string): Promise<void>;

  // ---- Maker's limits -----------------------------------------------------------------------------
  /** Limits the maker (or site) sets for this instrument, one per reading type, with their source. */
  listMakerLimits(instrumentId: string): Promise<MakerLimit[]>;
  /** Add or replace the limit for a reading type; messages name the field and the accepted range. */
  saveMakerLimit(instrumentId: string, draft: MakerLimitDraft): Promise<{ ok: true; limit: MakerLimit } | { ok: false; errors: Partial<Record<keyof MakerLimitDraft, string>> }>;
  deleteMakerLimit(instrumentId: string, typeId: string): Promise<void>;

  // ---- Baseline -----------------------------------------------------------------------------------
  /** Mark a visit's as-left readings as the instrument's baseline (clears any earlier mark), or unmark it. */
  markBaseline(visitId: string, on?: boolean): Promise<Visit>;
  getBaseline(instrumentId: string): Promise<BaselineSet | undefined>;

  // ---- Trends -------------------------------------------------------------------------------------
  trend(instrumentId: string, typeId: string, options?: TrendOptions): Promise<TrendData>;
  /** The contexts (e.g. parked m/z values) a type was recorded under for an instrument. */
  trendSeries(instrumentId: string, typeId: string): Promise<ReadingContext[]>;

  // ---- Diagnosis walks ----------------------------------------------------------------------------
  /**
   * Create (no id) or update a walk. startedAt is kept from the first save. A walk without a visit is
   * attached to the instrument's open visit (the one "Note this" and the Visits screen use), if there is one.
   */
  saveWalk(walk: Omit<WalkRecord, 'id' | 'startedAt' | 'updatedAt'> & { id?: string; startedAt?: string }): Promise<WalkRecord>;
  getWalk(id: string): Promise<WalkRecord | undefined>;
  listWalks(visitId: string): Promise<WalkRecord[]>;
  /** The most recently updated walk still in progress (optionally for one visit or instrument). */
  latestInProgressWalk(filter?: { visitId?: string; instrumentId?: string }): Promise<WalkRecord | undefined>;

  /** The visit that "Note this" and the Visits screen treat as open for an instrument. */
  setCurrentVisit(instrumentId: string, visitId: string | null): Promise<void>;
  /**
   * The instrument's open visit: the one marked by setCurrentVisit, only while that visit still exists and
   * belongs to this instrument (a stale or foreign mark gives undefined).
   */
  currentVisit(instrumentId: string): Promise<Visit | undefined>;
  /**
   * Record a value from any screen in the instrument's current visit: the visit marked current, else one
   * started in the last 12 hours, else a new visit opened for it. Values of a catalogue type are converted
   * from the unit given; anything else is kept as a "Noted value" with its label and unit.
   */
  noteReading(instrument: InstrumentProfile, note: NoteInput): Promise<{ visitLabel: string; reading: Reading; visit: Visit }>;

  // ---- Backup and reports -------------------------------------------------------------------------
  /** Everything on the device as one JSON document (format "rodside-backup", version 1, SHA-256 checksum). */
  exportBackup(): Promise<string>;
  /** Check a backup completely, then merge it by id in one transaction; on any problem nothing changes. */
  importBackup(text: string): Promise<ImportResult>;
  /** Remember that a backup was saved or shared (for the reminder). */
  noteBackupSaved(at?: Date): Promise<void>;
  backupStatus(now?: Date): Promise<BackupReminder>;
  /** Readings as CSV (UTF-8 with BOM), for one visit, one instrument, or everything. */
  readingsCsv(filter?: { visitId?: string; instrumentId?: string }): Promise<string>;
  /** A standalone printable HTML record of one visit. */
  visitReport(visitId: string, now?: Date): Promise<string>;
  /**
   * Erase every record on this device in one transaction (instruments, visits, readings, walks, settings,
   * drafts). The demo is marked as seen so it does not come back on the next start.
   */
  eraseAll(): Promise<void>;

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


export async function openStore(name: string = DB_NAME, events: StoreEvents = {}, given: StoreOptions = {}): Promise<Store> {
  const options: StoreOptions = { engine: defaultEngine, ...given };
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


  type Tx = IDBPTransaction<RodsideSchema, ('visits' | 'readings' | 'walks' | 'instruments' | 'drafts')[], 'readwrite'>;
  async function deleteVisitIn(tx: Tx, visit: Visit): Promise<VisitBundle> {
    const readings = await tx.objectStore('readings').index('byVisit').getAll(visit.id);
    const walks = await tx.objectStore('walks').index('byVisit').getAll(visit.id);
    for (const r of readings) await tx.objectStore('readings').delete(r.id);
    for (const w of walks) await tx.objectStore('walks').delete(w.id);
    await tx.objectStore('visits').delete(visit.id);
    return { visit, readings, walks };
  }
  async function putBundle(tx: Tx, b: VisitBundle): Promise<void> {
    await tx.objectStore('visits').put(b.visit);
    for (const r of b.readings) await tx.objectStore('readings').put(r);
    for (const w of b.walks) await tx.objectStore('walks').put(w);
  }

  type JudgeTx = IDBPTransaction<RodsideSchema, ('visits' | 'instruments' | 'readings' | 'settings')[], IDBTransactionMode>;
  /** Everything needed to judge a reading of `typeId` on `visitId`, read inside the caller's transaction. */
  async function judgingContext(tx: JudgeTx, visitId: string, typeId: string) {
    const visit = await tx.objectStore('visits').get(visitId);
    if (!visit) throw new StoreError('Could not save the reading: its visit no longer exists.');
    const instrument = await tx.objectStore('instruments').get(visit.instrumentId);
    const own = ownTypesFrom((await tx.objectStore('settings').get(OWN_TYPES_SETTING))?.value);
    const type = allTypes(own).find((t) => t.id === typeId);
    if (!type) throw new StoreError(`Could not save the reading: the reading type ${typeId} is not known here.`);
    const baselineVisit = pickBaselineVisit(await tx.objectStore('visits').index('byInstrument').getAll(visit.instrumentId));
    const baseline = baselineVisit
      ? { visit: baselineVisit, readings: (await tx.objectStore('readings').index('byVisit').getAll(baselineVisit.id)).filter((r) => r.typeId === typeId) }
      : undefined;
    const limit = makerLimitsFrom((await tx.objectStore('settings').get(makerLimitsKey(visit.instrumentId)))?.value).find((l) => l.typeId === typeId);
    return { visit, instrument, type, baseline, limit };
  }

  function checkReading(r: Reading, type: ReadingType): void {
    const problems = readingProblems('reading', r);
    if (!(r.value >= type.plausible.min && r.value <= type.plausible.max)) problems.push(`value ${r.value} ${type.baseUnit} is outside ${type.plausible.min} to ${type.plausible.max}`);
    if (problems.length) throw new StoreError(`Could not save the reading: ${problems.join('; ')}.`);
  }

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
        // Its visits, readings and walks go with it (a visit without its instrument cannot be restored from a
        // backup). A copy of all of it is kept in the drafts store, in the same transaction, so undo works even
        // after a reload; the previous deletion's copy goes now (one undo at a time).
        const tx = db.transaction(['instruments', 'visits', 'readings', 'walks', 'drafts'], 'readwrite');
        const existing = await tx.objectStore('instruments').get(id);
        if (existing) {
          const visits = await tx.objectStore('visits').index('byInstrument').getAll(id);
          const bundles: VisitBundle[] = [];
          for (const v of visits) bundles.push(await deleteVisitIn(tx, v));
          await tx.objectStore('instruments').delete(id);
          await tx.objectStore('drafts').delete(undoRange());
          const now = nowIso();
          const copy: DeletedInstrumentCopy = { profile: existing, bundles, deletedAt: now };
          await tx.objectStore('drafts').put({ key: `${INSTRUMENT_UNDO_PREFIX}${id}`, value: copy, updatedAt: now });
        }
        await tx.done;
        return existing;
      }),

    restoreInstrument: (profile) =>
      guard('restore the instrument profile', async () => {
        const tx = db.transaction(['instruments', 'visits', 'readings', 'walks', 'drafts'], 'readwrite');
        const key = `${INSTRUMENT_UNDO_PREFIX}${profile.id}`;
        const copy = (await tx.objectStore('drafts').get(key))?.value as DeletedInstrumentCopy | undefined;
        await tx.objectStore('instruments').put(profile);
        for (const b of copy?.bundles ?? []) await putBundle(tx, b);
        await tx.objectStore('drafts').delete(key);
        await tx.done;
      }),

    deletedInstrument: (now = new Date()) =>
      guard('read the deleted instrument', async () => {
        const tx = db.transaction(['drafts', 'instruments'], 'readwrite');
        let found: DeletedInstrument | undefined;
        for (const rec of await tx.objectStore('drafts').getAll(undoRange())) {
          const copy = rec.value as Partial<DeletedInstrumentCopy> | undefined;
          const at = Date.parse(copy?.deletedAt ?? '');
          const live = !!copy?.profile && Array.isArray(copy.bundles) && Number.isFinite(at) && now.getTime() - at <= INSTRUMENT_UNDO_WINDOW_MS;
          // An instrument of that id made again since (e.g. from a backup) makes the copy moot: never overwrite it.
          const back = live ? await tx.objectStore('instruments').get(copy.profile!.id) : undefined;
          if (!live || back) {
            await tx.objectStore('drafts').delete(rec.key);
            continue;
          }
          const bundles = copy.bundles as VisitBundle[];
          found = {
            profile: copy.profile!,
            deletedAt: copy.deletedAt!,
            visits: bundles.length,
            readings: bundles.reduce((n, b) => n + b.readings.length, 0),
            walks: bundles.reduce((n, b) => n + b.walks.length, 0),
          };
        }
        await tx.done;
        return found;
      }),

    loadDemo: (force = false) =>
      guard('load the demo instruments', async () => {
        const tx = db.transaction(['instruments', 'settings', 'visits', 'readings'], 'readwrite');
        const flag = await tx.objectStore('settings').get('demoLoaded');
        if (flag && !force) {
          await tx.done;
          return false;
        }
        for (const p of demoInstruments) {
          if (!(await tx.objectStore('instruments').get(p.id))) await tx.objectStore('instruments').put({ ...p });
        }
        // Demo readings are judged by the same rules as real ones, in date order so the baseline applies.
        const visits = [...demoVisits].sort((a, b) => (a.startedAt < b.startedAt ? -1 : 1));
        for (const v of visits) if (!(await tx.objectStore('visits').get(v.id))) await tx.objectStore('visits').put({ ...v });
        const done = new Map<string, Reading[]>();
        for (const v of visits) {
          const instrument = demoInstruments.find((i) => i.id === v.instrumentId);
          const baselineVisit = pickBaselineVisit(visits.filter((x) => x.instrumentId === v.instrumentId && x.startedAt <= v.startedAt));
          const baseline = baselineVisit ? { visit: baselineVisit, readings: done.get(baselineVisit.id) ?? [] } : undefined;
          const list: Reading[] = [];
          for (const seed of demoReadings.filter((r) => r.visitId === v.id)) {
            const type = catalogue.find((t) => t.id === seed.typeId)!;
            const entry = checkEntry(type, seed.text, seed.unitId, seed.context ?? {});
            if (!entry.ok) throw new StoreError(`Demo data is inconsistent (${Object.values(entry.errors).join(' ')}).`);
            const unit = type.units.find((u) => u.id === seed.unitId)!;
            const verdict = assess(type, instrument, v.id, entry.value, entry.context, baseline, options.engine);
            const r: Reading = {
              id: `demo-rdg-${v.id.replace(/^demo-visit-/, '')}-${seed.phase}-${seed.typeId}${seed.context?.mz ? `-${seed.context.mz}` : ''}`,
              visitId: v.id, instrumentId: v.instrumentId, typeId: type.id, phase: seed.phase, value: entry.value,
              entered: { text: seed.text, unit: unit.label }, context: entry.context, ...verdict,
              note: seed.note ?? '', takenAt: seed.takenAt ?? new Date(Date.parse(v.startedAt) + (seed.phase === 'as-left' ? 5 : 1) * 3600_000).toISOString(),
              origin: 'entered', demo: true,
            };
            list.push(r);
            if (!(await tx.objectStore('readings').get(r.id))) await tx.objectStore('readings').put(r);
          }
          done.set(v.id, list);
        }
        await tx.objectStore('settings').put({ key: 'demoLoaded', value: true });
        await tx.done;
        return true;
      }),

    removeDemo: () =>
      guard('remove the demo data', async () => {
        // Demo visits, readings and walks go too; real records on demo instruments are kept only if their
        // instrument stays, so a demo instrument's own visits are removed with it.
        const tx = db.transaction(['instruments', 'visits', 'readings', 'walks'], 'readwrite');
        let removed = 0;
        const demoIds = new Set<string>();
        let cursor = await tx.objectStore('instruments').openCursor();
        while (cursor) {
          if (cursor.value.demo) {
            demoIds.add(cursor.value.id);
            await cursor.delete();
            removed++;
          }
          cursor = await cursor.continue();
        }
        let vc = await tx.objectStore('visits').openCursor();
        while (vc) {
          if (vc.value.demo || demoIds.has(vc.value.instrumentId)) {
            await deleteVisitIn(tx, vc.value);
          }
          vc = await vc.continue();
        }
        let rc = await tx.objectStore('readings').openCursor();
        while (rc) {
          if (rc.value.demo) await rc.delete();
          rc = await rc.continue();
        }
        let wc = await tx.objectStore('walks').openCursor();
        while (wc) {
          if (wc.value.demo) await wc.delete();
          wc = await wc.continue();
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

    // ---- Visits ---------------------------------------------------------------------------------
    listVisits: (instrumentId) =>
      guard('read the visits', async () => {
        const list = instrumentId ? await db.getAllFromIndex('visits', 'byInstrument', instrumentId) : await db.getAll('visits');
        return list.sort((a, b) => (a.startedAt < b.startedAt ? 1 : a.startedAt > b.startedAt ? -1 : 0));
      }),

    getVisit: (id) => guard('read the visit', () => db.get('visits', id)),

    saveVisit: (fields, id) =>
      guard('save the visit', async () => {
        const tx = db.transaction(['visits', 'instruments'], 'readwrite');
        const existing = id ? await tx.objectStore('visits').get(id) : undefined;
        if (id && !existing) throw new StoreError(`Could not save: the visit ${id} no longer exists.`);
        if (!(await tx.objectStore('instruments').get(fields.instrumentId))) {
          throw new StoreError('Could not save the visit: its instrument profile no longer exists.');
        }
        if (existing && existing.instrumentId !== fields.instrumentId) {
          throw new StoreError('Could not save the visit: a visit cannot move to another instrument (its readings belong to the first).');
        }
        const now = nowIso();
        const record: Visit = {
          ...fields,
          id: existing?.id ?? newId('visit'),
          createdAt: existing?.createdAt ?? now,
          updatedAt: now,
          ...(existing?.baseline ? { baseline: true } : {}),
          ...(existing?.demo ? { demo: true } : {}),
        };
        const problems = visitProblems('visit', record);
        if (problems.length) throw new StoreError(`Could not save the visit: ${problems.join('; ')}.`);
        await tx.objectStore('visits').put(record);
        await tx.done;
        return record;
      }),

    deleteVisit: (id) =>
      guard('delete the visit', async () => {
        const tx = db.transaction(['visits', 'readings', 'walks'], 'readwrite');
        const v = await tx.objectStore('visits').get(id);
        const bundle = v ? await deleteVisitIn(tx, v) : undefined;
        await tx.done;
        return bundle;
      }),

    restoreVisit: (bundle) =>
      guard('restore the visit', async () => {
        const tx = db.transaction(['visits', 'readings', 'walks'], 'readwrite');
        await putBundle(tx, bundle);
        await tx.done;
      }),

    // ---- Readings -------------------------------------------------------------------------------
    listReadings: (visitId) =>
      guard('read the readings', async () => {
        const list = await db.getAllFromIndex('readings', 'byVisit', visitId);
        return list.sort((a, b) => (a.takenAt < b.takenAt ? -1 : a.takenAt > b.takenAt ? 1 : 0));
      }),

    listInstrumentReadings: (instrumentId, typeId) =>
      guard('read the readings', async () => {
        if (typeId) return db.getAllFromIndex('readings', 'byInstrumentType', [instrumentId, typeId]);
        const range = IDBKeyRange.bound([instrumentId, ''], [instrumentId, '\uffff']);
        return db.getAllFromIndex('readings', 'byInstrumentType', range);
      }),

    previewReading: (visitId, typeId, value, context) =>
      guard('work out the expected value', async () => {
        const tx = db.transaction(['visits', 'instruments', 'readings', 'settings'], 'readonly');
        const ctx = await judgingContext(tx, visitId, typeId);
        await tx.done;
        const r = judgeWithLimit(value, ctx.type.baseUnit, expectationOf(ctx.type, ctx.instrument, visitId, context, ctx.baseline, options.engine), ctx.limit);
        return r ?? {};
      }),

    addReading: (input) =>
      guard('save the reading', async () => {
        const tx = db.transaction(['visits', 'instruments', 'readings', 'settings'], 'readwrite');
        const ctx = await judgingContext(tx, input.visitId, input.typeId);
        const now = nowIso();
        const judged = assess(ctx.type, ctx.instrument, input.visitId, input.value, input.context ?? {}, ctx.baseline, options.engine, ctx.limit);
        const reading: Reading = {
          id: newId('rdg'),
          visitId: input.visitId,
          instrumentId: ctx.visit.instrumentId,
          typeId: input.typeId,
          phase: input.phase,
          value: input.value,
          entered: input.entered,
          ...(input.context && Object.keys(input.context).length ? { context: input.context } : {}),
          ...judged,
          note: input.note ?? '',
          takenAt: input.takenAt ?? now,
          origin: input.origin ?? 'entered',
          ...(ctx.visit.demo ? { demo: true } : {}),
        };
        checkReading(reading, ctx.type);
        await tx.objectStore('readings').put(reading);
        await tx.objectStore('visits').put({ ...ctx.visit, updatedAt: now });
        await tx.done;
        return reading;
      }),

    updateReading: (id, changes) =>
      guard('save the reading', async () => {
        const tx = db.transaction(['visits', 'instruments', 'readings', 'settings'], 'readwrite');
        const was = await tx.objectStore('readings').get(id);
        if (!was) throw new StoreError(`Could not save: the reading ${id} no longer exists.`);
        const ctx = await judgingContext(tx, was.visitId, was.typeId);
        const now = nowIso();
        const next: Reading = { ...was, ...changes, updatedAt: now };
        if (changes.context && Object.keys(changes.context).length === 0) delete next.context;
        delete next.expected;
        delete next.verdict;
        Object.assign(next, assess(ctx.type, ctx.instrument, was.visitId, next.value, next.context ?? {}, ctx.baseline, options.engine, ctx.limit));
        checkReading(next, ctx.type);
        await tx.objectStore('readings').put(next);
        await tx.objectStore('visits').put({ ...ctx.visit, updatedAt: now });
        await tx.done;
        return next;
      }),

    deleteReading: (id) =>
      guard('delete the reading', async () => {
        const tx = db.transaction(['readings', 'visits'], 'readwrite');
        const was = await tx.objectStore('readings').get(id);
        if (was) {
          await tx.objectStore('readings').delete(id);
          const v = await tx.objectStore('visits').get(was.visitId);
          if (v) await tx.objectStore('visits').put({ ...v, updatedAt: nowIso() });
        }
        await tx.done;
        return was;
      }),

    restoreReading: (reading) =>
      guard('restore the reading', async () => {
        const tx = db.transaction(['readings', 'visits'], 'readwrite');
        const v = await tx.objectStore('visits').get(reading.visitId);
        if (!v) throw new StoreError('Could not restore the reading: its visit no longer exists.');
        await tx.objectStore('readings').put(reading);
        await tx.objectStore('visits').put({ ...v, updatedAt: nowIso() });
        await tx.done;
      }),

    // ---- Reading types --------------------------------------------------------------------------
    listReadingTypes: () => guard('read the reading types', async () => allTypes(ownTypesFrom((await db.get('settings', OWN_TYPES_SETTING))?.value))),

    saveOwnReadingType: (draft) =>
      guard('save the reading type', async () => {
        const tx = db.transaction('settings', 'readwrite');
        const own = ownTypesFrom((await tx.store.get(OWN_TYPES_SETTING))?.value);
        const r = ownTypeFromDraft(draft, new Set(own.map((t) => t.id)));
        if (r.ok) await tx.store.put({ key: OWN_TYPES_SETTING, value: [...own, r.type] });
        await tx.done;
        return r;
      }),

    deleteOwnReadingType: (id) =>
      guard('delete the reading type', async () => {
        const tx = db.transaction(['settings', 'readings'], 'readwrite');
        const own = ownTypesFrom((await tx.objectStore('settings').get(OWN_TYPES_SETTING))?.value);
        let cursor = await tx.objectStore('readings').openCursor();
        let used = 0;
        while (cursor) {
          if (cursor.value.typeId === id) used++;
          cursor = await cursor.continue();
        }
        if (used) throw new StoreError(`Could not delete the reading type: ${used} reading${used === 1 ? '' : 's'} use it. Delete those first.`);
        await tx.objectStore('settings').put({ key: OWN_TYPES_SETTING, value: own.filter((t) => t.id !== id) });
        await tx.done;
      }),


    // ---- Maker's limits -------------------------------------------------------------------------
    listMakerLimits: (instrumentId) =>
      guard('read the instrument’s limits', async () => makerLimitsFrom((await db.get('settings', makerLimitsKey(instrumentId)))?.value)),

    saveMakerLimit: (instrumentId, draft) =>
      guard('save the instrument’s limit', async () => {
        const types = await store.listReadingTypes();
        const r = checkMakerLimit(types.find((t) => t.id === draft.typeId), draft);
        if (!r.ok) return r;
        const tx = db.transaction(['settings', 'instruments'], 'readwrite');
        if (!(await tx.objectStore('instruments').get(instrumentId))) throw new StoreError('Could not save the limit: the instrument profile no longer exists.');
        const list = makerLimitsFrom((await tx.objectStore('settings').get(makerLimitsKey(instrumentId)))?.value).filter((l) => l.typeId !== r.limit.typeId);
        await tx.objectStore('settings').put({ key: makerLimitsKey(instrumentId), value: [...list, r.limit] });
        await tx.done;
        return r;
      }),

    deleteMakerLimit: (instrumentId, typeId) =>
      guard('delete the instrument’s limit', async () => {
        const tx = db.transaction('settings', 'readwrite');
        const list = makerLimitsFrom((await tx.store.get(makerLimitsKey(instrumentId)))?.value);
        await tx.store.put({ key: makerLimitsKey(instrumentId), value: list.filter((l) => l.typeId !== typeId) });
        await tx.done;
      }),

    // ---- Baseline -------------------------------------------------------------------------------
    markBaseline: (visitId, on = true) =>
      guard('mark the baseline', async () => {
        const tx = db.transaction('visits', 'readwrite');
        const v = await tx.store.get(visitId);
        if (!v) throw new StoreError(`Could not mark the baseline: the visit ${visitId} no longer exists.`);
        const now = nowIso();
        if (on) {
          // One baseline per instrument: later readings compare with this visit's as-left values.
          for (const other of await tx.store.index('byInstrument').getAll(v.instrumentId)) {
            if (other.baseline && other.id !== visitId) {
              const next = { ...other, updatedAt: now };
              delete next.baseline;
              await tx.store.put(next);
            }
          }
        }
        const next: Visit = { ...v, updatedAt: now };
        if (on) next.baseline = true;
        else delete next.baseline;
        await tx.store.put(next);
        await tx.done;
        return next;
      }),

    getBaseline: (instrumentId) =>
      guard('read the baseline', async () => {
        const tx = db.transaction(['visits', 'readings'], 'readonly');
        const visit = pickBaselineVisit(await tx.objectStore('visits').index('byInstrument').getAll(instrumentId));
        const readings = visit ? (await tx.objectStore('readings').index('byVisit').getAll(visit.id)).filter((r) => r.phase === 'as-left') : [];
        await tx.done;
        return visit ? { visit, readings } : undefined;
      }),

    // ---- Trends ---------------------------------------------------------------------------------
    trend: (instrumentId, typeId, opts = {}) =>
      guard('compute the trend', async () => {
        const tx = db.transaction(['visits', 'readings', 'instruments', 'settings'], 'readonly');
        const [visits, readings, instrument, own] = await Promise.all([
          tx.objectStore('visits').index('byInstrument').getAll(instrumentId),
          tx.objectStore('readings').index('byInstrumentType').getAll([instrumentId, typeId]),
          tx.objectStore('instruments').get(instrumentId),
          tx.objectStore('settings').get(OWN_TYPES_SETTING),
        ]);
        await tx.done;
        const type = allTypes(ownTypesFrom(own?.value)).find((t) => t.id === typeId);
        if (!type) throw new StoreError(`Could not compute the trend: the reading type ${typeId} is not known here.`);
        return buildTrend(type, visits, readings, { limit: instrument?.multiplierVoltageLimit ?? DEFAULT_MULTIPLIER_LIMIT, ...opts });
      }),

    trendSeries: (instrumentId, typeId) =>
      guard('read the readings', async () => {
        const type = (await store.listReadingTypes()).find((t) => t.id === typeId);
        if (!type) return [];
        return seriesOf(type, await db.getAllFromIndex('readings', 'byInstrumentType', [instrumentId, typeId]));
      }),

    // ---- Walks ----------------------------------------------------------------------------------
    saveWalk: (walk) =>
      guard('keep the diagnosis walk', async () => {
        const tx = db.transaction(['walks', 'visits', 'settings'], 'readwrite');
        const was = walk.id ? await tx.objectStore('walks').get(walk.id) : undefined;
        const now = nowIso();
        // A walk belongs to a visit: the one given, the one it already had, else the instrument's open visit.
        let visitId = walk.visitId ?? was?.visitId;
        if (!visitId && walk.instrumentId) {
          const current = (await tx.objectStore('settings').get(`currentVisit:${walk.instrumentId}`))?.value;
          const v = typeof current === 'string' ? await tx.objectStore('visits').get(current) : undefined;
          if (v && v.instrumentId === walk.instrumentId) visitId = v.id;
        }
        const record: WalkRecord = {
          ...walk,
          id: walk.id ?? newId('walk'),
          ...(visitId ? { visitId } : {}),
          startedAt: was?.startedAt ?? walk.startedAt ?? now,
          updatedAt: now,
        };
        if (record.visitId === undefined) delete record.visitId;
        const problems = walkProblems('walk', record);
        if (problems.length) throw new StoreError(`Could not keep the diagnosis walk: ${problems.join('; ')}.`);
        await tx.objectStore('walks').put(record);
        await tx.done;
        return record;
      }),

    getWalk: (id) => guard('read the diagnosis walk', () => db.get('walks', id)),

    listWalks: (visitId) =>
      guard('read the diagnosis walks', async () =>
        (await db.getAllFromIndex('walks', 'byVisit', visitId)).sort((a, b) => (a.startedAt < b.startedAt ? -1 : 1))),

    latestInProgressWalk: (filter = {}) =>
      guard('read the diagnosis walks', async () => {
        const all = filter.visitId ? await db.getAllFromIndex('walks', 'byVisit', filter.visitId) : await db.getAll('walks');
        let best: WalkRecord | undefined;
        for (const w of all) {
          if (w.status !== 'in-progress') continue;
          if (filter.instrumentId && w.instrumentId !== filter.instrumentId) continue;
          if (!best || w.updatedAt > best.updatedAt) best = w;
        }
        return best;
      }),


    setCurrentVisit: (instrumentId, visitId) =>
      guard('remember the open visit', async () => {
        if (visitId === null) await db.delete('settings', `currentVisit:${instrumentId}`);
        else await db.put('settings', { key: `currentVisit:${instrumentId}`, value: visitId });
      }),

    currentVisit: (instrumentId) =>
      guard('read the open visit', async () => {
        const tx = db.transaction(['settings', 'visits'], 'readonly');
        const id = (await tx.objectStore('settings').get(`currentVisit:${instrumentId}`))?.value;
        const v = typeof id === 'string' ? await tx.objectStore('visits').get(id) : undefined;
        await tx.done;
        return v && v.instrumentId === instrumentId ? v : undefined;
      }),

    noteReading: (instrument, note) =>
      guard('note the value', async () => {
        if (!Number.isFinite(note.value)) throw new StoreError(`Could not note “${note.label}”: the value is not a finite number.`);
        const phase: ReadingPhase = note.phase ?? 'as-found';
        if (phase !== 'as-found' && phase !== 'as-left') throw new StoreError(`Could not note “${note.label}”: the phase must be as-found or as-left, not “${String(phase)}”.`);
        const now = new Date();
        let visit: Visit | undefined = await store.currentVisit(instrument.id);
        if (!visit) {
          const recent = (await store.listVisits(instrument.id))[0];
          if (recent && now.getTime() - Date.parse(recent.startedAt) < 12 * 3600_000 && Date.parse(recent.startedAt) <= now.getTime()) visit = recent;
        }
        if (!visit) {
          visit = await store.saveVisit({
            instrumentId: instrument.id, startedAt: now.toISOString(), site: '', engineer: '', reason: 'other',
            notes: 'Opened by “Note this”. Fill in the site, engineer and reason.', partsUsed: '',
          });
        }
        await store.setCurrentVisit(instrument.id, visit.id);
        const types = await store.listReadingTypes();
        const typeId = note.typeId ? typeAliases[note.typeId] ?? note.typeId : undefined;
        const type = typeId ? types.find((t) => t.id === typeId) : undefined;
        const context: ReadingContext = {};
        for (const [k, v] of Object.entries(note.context ?? {})) {
          // Keep only what a reading can hold: short text or finite numbers under plain keys.
          if (!/^[A-Za-z][A-Za-z0-9_-]{0,39}$/.test(k)) continue;
          if (typeof v === 'number' && Number.isFinite(v)) context[k] = v;
          else if (typeof v === 'string') context[k] = v.slice(0, 200);
        }
        if (type && 'gaugeGas' in context) {
          // A gas name from a calculator: N2 means the gauge's own scale; others mean corrected for that gas.
          const g = String(context.gaugeGas);
          context.gaugeGas = /^n2/i.test(g) ? 'N2-equivalent' : ['He', 'H2', 'Ar'].includes(g) ? g : 'other';
        }
        const unit = type ? resolveUnit(type, note.unit, `${String(context.convention ?? '')} ${note.label}`) : undefined;
        if (type && unit && type.units.length > 1) context.convention = unit.label;
        let reading: Reading;
        const text = String(Number(note.value.toPrecision(8)));
        if (type && unit) {
          reading = await store.addReading({
            visitId: visit.id, typeId: type.id, phase, value: note.value * unit.factor + (unit.offset ?? 0),
            entered: { text, unit: unit.label }, context, note: note.label, origin: note.origin,
          });
        } else {
          context.label = note.label.slice(0, 200);
          context.unit = note.unit.slice(0, 200);
          reading = await store.addReading({
            visitId: visit.id, typeId: 'noted-value', phase, value: note.value,
            entered: { text, unit: note.unit.slice(0, 100) }, context, note: note.label, origin: note.origin,
          });
        }
        return { visitLabel: `the visit of ${visit.startedAt.slice(0, 10)}`, reading, visit: (await db.get('visits', visit.id))! };
      }),

    // ---- Backup and reports ---------------------------------------------------------------------
    exportBackup: () => guard('export the backup', () => exportBackupText(db)),

    importBackup: async (text) => {
      try {
        return await importBackupText(db, text);
      } catch (err) {
        // Problems with the file keep their exact message; storage failures get the usual wording.
        if (err instanceof Error && err.name === 'BackupError') throw err;
        throw describeStorageError('restore the backup', err);
      }
    },

    noteBackupSaved: (at = new Date()) => guard('remember the backup', async () => void (await db.put('settings', { key: 'lastBackupAt', value: at.toISOString() }))),

    backupStatus: (now = new Date()) =>
      guard('check the backup date', async () => {
        const last = (await db.get('settings', 'lastBackupAt'))?.value;
        const count = (await db.count('visits')) + (await db.count('instruments'));
        return backupReminder(typeof last === 'string' ? last : undefined, now, count > 0);
      }),

    readingsCsv: (filter = {}) =>
      guard('export the readings', async () => {
        const [instruments, types] = await Promise.all([db.getAll('instruments'), store.listReadingTypes()]);
        let visits: Visit[];
        let readings: Reading[];
        if (filter.visitId) {
          const v = await db.get('visits', filter.visitId);
          visits = v ? [v] : [];
          readings = await db.getAllFromIndex('readings', 'byVisit', filter.visitId);
        } else if (filter.instrumentId) {
          visits = await db.getAllFromIndex('visits', 'byInstrument', filter.instrumentId);
          readings = await store.listInstrumentReadings(filter.instrumentId);
        } else {
          visits = await db.getAll('visits');
          readings = await db.getAll('readings');
        }
        return readingsCsv(instruments, visits, readings, (id) => types.find((t) => t.id === id));
      }),

    eraseAll: () =>
      guard('erase the data on this device', async () => {
        const names = ['instruments', 'visits', 'readings', 'walks', 'settings', 'drafts'] as const;
        const tx = db.transaction([...names], 'readwrite');
        await Promise.all(names.map((n) => tx.objectStore(n).clear()));
        await tx.objectStore('settings').put({ key: 'demoLoaded', value: true });
        await tx.done;
      }),

    visitReport: (visitId, now = new Date()) =>
      guard('make the visit report', async () => {
        const visit = await db.get('visits', visitId);
        if (!visit) throw new StoreError(`Could not make the report: the visit ${visitId} no longer exists.`);
        const instrument = await db.get('instruments', visit.instrumentId);
        if (!instrument) throw new StoreError('Could not make the report: the visit’s instrument profile no longer exists.');
        const [readings, walks, types] = await Promise.all([store.listReadings(visitId), store.listWalks(visitId), store.listReadingTypes()]);
        return visitReportHtml({
          lab: instrument.demo ? DEMO_LAB : undefined, instrument, visit, readings, walks,
          typeOf: (id) => types.find((t) => t.id === id), generatedAt: now,
        });
      }),
  };
  return store;
}

/** Remove a whole database (tests, and the "erase everything on this device" action). */
export async function eraseStore(name: string = DB_NAME): Promise<void> {
  await deleteDB(name);
}
