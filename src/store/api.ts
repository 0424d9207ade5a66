// The store's public face: what openStore returns, and the shapes its methods take and give.
import type { IDBPDatabase } from 'idb';
import type {
  BackupReminder, BaselineSet, EngineFunctions, Expectation, InstrumentProfile, Judgement, MakerLimit, MakerLimitDraft, NoteInput,
  OwnTypeDraft, ProfileFields, Reading, ReadingContext, ReadingPhase, ReadingType, TrendData, TrendOptions, Visit, VisitFields, WalkRecord,
} from '../records';
import type { ImportResult } from './backup';
import type { RodsideSchema } from './schema';

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

/** How long a deleted instrument stays restorable: one hour, long enough for a reload or a slip noticed late. */
export const INSTRUMENT_UNDO_WINDOW_MS = 3600_000;

/** A deleted instrument that can still be restored, with counts of what would come back with it. */
export interface DeletedInstrument {
  profile: InstrumentProfile;
  deletedAt: string;
  visits: number;
  readings: number;
  walks: number;
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
  /**
   * The page is put away (pagehide): close the connection so that nothing another page needs stays held.
   * - 'unload': the page is going for good; running reads are aborted, running writes finish first.
   * - 'cached': the page is kept frozen in the back/forward cache, where nothing it started can finish; every
   *   running transaction is aborted (a write in flight was not saved and says so when the page is shown again).
   * Open a new store when the page is shown again.
   */
  suspend(until?: 'unload' | 'cached'): void;

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

  /**
   * Loads the invented demo scenario if it has never been loaded (or was removed and is asked for again, `force`).
   * Writes the demo instruments, then the demo visits with their readings (each judged in a task of its own);
   * true when this call loaded it. `onInstruments` is called once the instruments are written, so a first screen
   * can show them while the visits follow.
   */
  loadDemo(force?: boolean, onInstruments?: () => void): Promise<boolean>;
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
  /** Removes the limit of that type (and, when given, for those ions only). */
  deleteMakerLimit(instrumentId: string, typeId: string, match?: Record<string, string>): Promise<void>;

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


/** What every store module works on: the open database and the physics used for judging. */
export interface StoreContext {
  db: IDBPDatabase<RodsideSchema>;
  engine?: EngineFunctions;
}
