// Record shapes kept on the device. SI units inside records; the UI converts for display.
import type { AmplitudeForm, AmplitudeReference, ReadbackConvention } from '../engine/voltageConventions';

export type { AmplitudeForm, AmplitudeReference, ReadbackConvention };

export type InstrumentKind = 'gc-ms-single' | 'gc-ms-triple' | 'lc-ms-single' | 'lc-ms-triple' | 'rga';

export interface InstrumentProfile {
  id: string;
  name: string;
  kind: InstrumentKind;
  /** Field radius r0, m. */
  rodFieldRadius: number;
  /** Rod length, m. */
  rodLength: number;
  /** RF frequency f, Hz. */
  rfFrequency: number;
  /** Largest RF amplitude the supply can give, V zero-to-peak, one rod to ground. */
  maxRfAmplitude: number;
  /** Typical ion axial energy, eV (per unit charge: the rod offset the ions fall through). */
  axialEnergy: number;
  readbackConvention: ReadbackConvention;
  notes: string;
  /** Largest multiplier voltage the detector supply gives, V (for the end-of-life projection). */
  multiplierVoltageLimit?: number;
  /** Part of the invented demo scenario; removable as a group. */
  demo?: boolean;
  createdAt: string;
  updatedAt: string;
}

export interface SettingRecord {
  key: string;
  value: unknown;
}

export type VisitReason = 'preventive' | 'installation' | 'after-venting-or-cleaning' | 'sensitivity-loss' | 'failure' | 'other';

export interface Visit {
  id: string;
  instrumentId: string;
  /** Start of the visit, ISO 8601. */
  startedAt: string;
  site: string;
  engineer: string;
  reason: VisitReason;
  notes: string;
  partsUsed: string;
  /** Test equipment used: ID, rating, calibration due date (traceability). */
  testEquipment?: string;
  /** When set, this visit's as-left readings are the instrument's baseline. */
  baseline?: boolean;
  demo?: boolean;
  createdAt: string;
  updatedAt: string;
}

export type ReadingPhase = 'as-found' | 'as-left';
/**
 * 'convention': off by a read-back convention factor (2, √2, 2√2, 4, or 2 between one rod and the pairs) and
 * matching once read in another convention: check how the reading was taken before calling it a failure.
 */
export type Verdict = 'pass' | 'borderline' | 'fail' | 'convention';

export interface Reading {
  id: string;
  visitId: string;
  instrumentId: string;
  /** Reading type from the catalogue (or a user-defined type id). */
  typeId: string;
  phase: ReadingPhase;
  /** Value in the type's base unit. */
  value: number;
  /** What the user typed and in which unit, kept verbatim for the record. */
  entered: { text: string; unit: string };
  /** Parked m/z, gauge gas, convention and similar context for the value. */
  context?: Record<string, string | number>;
  /** What the value was judged against (base units), where that came from, and how far off it was. */
  expected?: { value?: number; low?: number; high?: number; basis: string; source?: string; summary?: string };
  verdict?: Verdict;
  note: string;
  takenAt: string;
  updatedAt?: string;
  /**
   * Earlier versions of the reading, oldest first (the audit trail): each value as it was typed, with its unit,
   * verdict and note, when it had been recorded and when it was replaced. Absent on readings never changed.
   */
  history?: ReadingVersion[];
  /** Where the reading came from: typed in, noted from a calculator, or taken during a diagnosis walk. */
  origin: 'entered' | 'calculator' | 'walk';
  demo?: boolean;
}

/** One earlier version of an edited reading. */
export interface ReadingVersion {
  value: number;
  entered: { text: string; unit: string };
  verdict?: Verdict;
  note: string;
  /** When this version had been recorded (the reading's takenAt, or the time of the edit that made it). */
  recordedAt: string;
  /** When it was replaced. */
  replacedAt: string;
}

export interface WalkRecord {
  id: string;
  visitId?: string;
  instrumentId?: string;
  treeId: string;
  /** Serialisable walker state (src/diagnose). */
  state: unknown;
  status: 'in-progress' | 'finished' | 'abandoned';
  startedAt: string;
  updatedAt: string;
  demo?: boolean;
}

/** Unsaved form input, kept so a reload or crash never loses what was typed. */
export interface DraftRecord {
  key: string;
  value: unknown;
  updatedAt: string;
}
