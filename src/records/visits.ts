// Visit form rules, user-defined reading types, and the pure part of judging a reading against the
// instrument's baseline. No storage here.
import { catalogue, catalogueType, type BadSide, type ReadingType, type ToleranceRule } from './catalogue';
import { contextMatches, expectationFor, judgeWithLimit, withConventionCheck, type EngineFunctions, type Expectation, type MakerLimit, type ReadingContext } from './judge';
import { parseNumber } from './numberText';
import { LIMITS, shown, visitReasons } from './validate';
import type { ReadingVersion, InstrumentProfile, Reading, Verdict, Visit, VisitReason } from './types';

/** What the visit form holds: text as typed. */
export interface VisitDraft {
  instrumentId: string;
  /** Local date and time as the form gives it ("2026-03-01T09:30") or a full ISO string. */
  startedAt: string;
  site: string;
  engineer: string;
  reason: string;
  notes: string;
  partsUsed: string;
  testEquipment: string;
}

export type VisitFields = Omit<Visit, 'id' | 'createdAt' | 'updatedAt' | 'demo' | 'baseline'>;

export function emptyVisitDraft(instrumentId: string, now = new Date()): VisitDraft {
  return {
    instrumentId, startedAt: now.toISOString().slice(0, 16), site: '', engineer: '', reason: 'preventive',
    notes: '', partsUsed: '', testEquipment: '',
  };
}

export function draftFromVisit(v: Visit): VisitDraft {
  return {
    instrumentId: v.instrumentId, startedAt: v.startedAt, site: v.site, engineer: v.engineer, reason: v.reason,
    notes: v.notes, partsUsed: v.partsUsed, testEquipment: v.testEquipment ?? '',
  };
}

/** Check the visit form. Dates without a zone are read as the device's local time. */
export function validateVisitDraft(d: VisitDraft): { ok: true; fields: VisitFields } | { ok: false; errors: Partial<Record<keyof VisitDraft, string>> } {
  const errors: Partial<Record<keyof VisitDraft, string>> = {};
  const when = Date.parse(d.startedAt);
  if (d.startedAt.trim() === '') errors.startedAt = 'Date and time is empty: enter when the visit started.';
  else if (!Number.isFinite(when)) errors.startedAt = `Date and time “${d.startedAt}” is not a date: use the picker or write 2026-03-01 09:30.`;
  else if (when < Date.UTC(1970, 0, 1) || when > Date.UTC(2200, 0, 1)) errors.startedAt = 'Date and time is out of range: enter a date between 1970 and 2200.';
  if (!d.instrumentId) errors.instrumentId = 'Instrument is not chosen: pick the instrument this visit is for.';
  const text = (k: 'site' | 'engineer' | 'notes' | 'partsUsed' | 'testEquipment', label: string, max: number, required = false) => {
    const v = d[k];
    if (required && v.trim() === '') errors[k] = `${label} is empty: enter 1 to ${max} characters.`;
    else if (v.length > max) errors[k] = `${label} is ${v.length} characters long: keep it to ${max}.`;
  };
  text('site', 'Site', LIMITS.shortText);
  text('engineer', 'Engineer', LIMITS.shortText, true);
  text('notes', 'Notes', LIMITS.longText);
  text('partsUsed', 'Parts used', LIMITS.longText);
  text('testEquipment', 'Test equipment', LIMITS.longText);
  if (!visitReasons.some((r) => r.value === d.reason)) errors.reason = `Reason “${d.reason}” is not one of: ${visitReasons.map((r) => r.label).join('; ')}.`;
  if (Object.keys(errors).length) return { ok: false, errors };
  return {
    ok: true,
    fields: {
      instrumentId: d.instrumentId, startedAt: new Date(when).toISOString(), site: d.site.trim(), engineer: d.engineer.trim(),
      reason: d.reason as VisitReason, notes: d.notes, partsUsed: d.partsUsed,
      ...(d.testEquipment.trim() ? { testEquipment: d.testEquipment } : {}),
    },
  };
}

// ---- User-defined reading types ------------------------------------------------------------------

export const OWN_TYPES_SETTING = 'ownReadingTypes';

export interface OwnTypeDraft {
  label: string;
  unit: string;
  min: string;
  max: string;
  badSide: string;
  toleranceKind: string;
  pass: string;
  borderline: string;
  expectedLow: string;
  expectedHigh: string;
  source: string;
}

export function emptyOwnTypeDraft(): OwnTypeDraft {
  return { label: '', unit: '', min: '', max: '', badSide: 'both', toleranceKind: 'relative', pass: '5', borderline: '10', expectedLow: '', expectedHigh: '', source: '' };
}

function slug(s: string): string {
  return s.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 40) || 'reading';
}

/**
 * Turn the "add your own reading" form into a reading type. Relative tolerances are typed in per cent.
 * The type is judged against the baseline, or against the typed range when there is no baseline.
 */
export function ownTypeFromDraft(d: OwnTypeDraft, takenIds: ReadonlySet<string>): { ok: true; type: ReadingType } | { ok: false; errors: Partial<Record<keyof OwnTypeDraft, string>> } {
  const errors: Partial<Record<keyof OwnTypeDraft, string>> = {};
  const label = d.label.trim();
  const unit = d.unit.trim();
  if (label === '' || label.length > 80) errors.label = 'Name is empty or too long: enter 1 to 80 characters.';
  if (unit === '' || unit.length > 30) errors.unit = 'Unit is empty or too long: enter 1 to 30 characters (for example “L/min”).';
  const n = (k: keyof OwnTypeDraft, label: string, lo: number, hi: number, optional = false): number | undefined => {
    const t = d[k].trim();
    if (t === '' && optional) return undefined;
    const v = parseNumber(t);
    if (v === null || v < lo || v > hi) {
      errors[k] = `${label} “${t}” is not accepted: enter a number between ${lo} and ${hi}.`;
      return undefined;
    }
    return v;
  };
  const min = n('min', 'Lowest plausible value', -1e12, 1e12);
  const max = n('max', 'Highest plausible value', -1e12, 1e12);
  if (min !== undefined && max !== undefined && !(max > min)) errors.max = 'Highest plausible value must be above the lowest.';
  if (!['both', 'high', 'low'].includes(d.badSide)) errors.badSide = 'Which way is bad must be one of: both, too high, too low.';
  if (!['relative', 'absolute'].includes(d.toleranceKind)) errors.toleranceKind = 'Tolerance kind must be per cent or absolute.';
  const rel = d.toleranceKind === 'relative';
  const pass = n('pass', `Pass tolerance${rel ? ' (%)' : ''}`, 0, rel ? 1000 : 1e12);
  const borderline = n('borderline', `Borderline tolerance${rel ? ' (%)' : ''}`, 0, rel ? 1000 : 1e12);
  if (pass !== undefined && borderline !== undefined && borderline < pass) errors.borderline = 'Borderline tolerance must be at least the pass tolerance.';
  const low = n('expectedLow', 'Expected range, low end', -1e12, 1e12, true);
  const high = n('expectedHigh', 'Expected range, high end', -1e12, 1e12, true);
  if (low !== undefined && high !== undefined && high < low) errors.expectedHigh = 'The high end of the expected range must not be below the low end.';
  if (d.source.length > 300) errors.source = 'Source is too long: keep it to 300 characters.';
  if (Object.keys(errors).length) return { ok: false, errors };
  let id = `own-${slug(label)}`;
  for (let i = 2; takenIds.has(id) || catalogueType(id); i++) id = `own-${slug(label)}-${i}`;
  const tolerance: ToleranceRule = rel
    ? { kind: 'relative', pass: pass! / 100, borderline: borderline! / 100 }
    : { kind: 'absolute', pass: pass!, borderline: borderline! };
  const type: ReadingType = {
    id, label, group: 'own', baseUnit: unit, units: [{ id: 'own', label: unit, factor: 1 }], defaultUnit: 'own',
    plausible: { min: min!, max: max! }, badSide: d.badSide as BadSide, baselineTolerance: tolerance,
    ...(low !== undefined || high !== undefined
      ? { generic: [{ low, high, source: d.source.trim() || 'entered by the user' }], genericMargin: tolerance.kind === 'relative' ? { kind: 'relative' as const, pass: 0, borderline: tolerance.borderline } : { kind: 'absolute' as const, pass: 0, borderline: tolerance.borderline } }
      : {}),
    context: [], matchContext: [], trendScale: 'linear', help: 'Added on this device.', own: true,
  };
  return { ok: true, type };
}

/** Check reading types read back from settings (they may come from an imported backup). */
export function ownTypesFrom(value: unknown): ReadingType[] {
  if (!Array.isArray(value)) return [];
  return value.filter((t): t is ReadingType => {
    if (typeof t !== 'object' || t === null) return false;
    const r = t as Partial<ReadingType>;
    return typeof r.id === 'string' && r.id.startsWith('own-') && typeof r.label === 'string' && Array.isArray(r.units) &&
      r.units.length > 0 && r.units.every((u) => typeof u?.factor === 'number' && Number.isFinite(u.factor) && u.factor !== 0) &&
      typeof r.plausible?.min === 'number' && typeof r.plausible?.max === 'number' && typeof r.baselineTolerance?.pass === 'number';
  }).map((t) => ({ ...t, context: t.context ?? [], matchContext: t.matchContext ?? [], own: true }));
}

export function allTypes(own: readonly ReadingType[]): ReadingType[] {
  return [...catalogue, ...own];
}

// ---- Judging a reading ---------------------------------------------------------------------------

export interface BaselineSet {
  visit: Visit;
  readings: readonly Reading[];
}

/** The baseline visit of an instrument: the latest visit marked as baseline. */
export function pickBaselineVisit(visits: readonly Visit[]): Visit | undefined {
  let best: Visit | undefined;
  for (const v of visits) if (v.baseline && (!best || v.startedAt > best.startedAt)) best = v;
  return best;
}

/**
 * The usual expectation for a reading: the instrument's baseline (its as-left value of the same type and
 * matching context), else a calculation, else a generic range. A visit is never compared with itself.
 */
export function expectationOf(
  type: ReadingType, instrument: InstrumentProfile | undefined, visitId: string, context: ReadingContext,
  baseline: BaselineSet | undefined, engine: EngineFunctions | undefined,
): Expectation | undefined {
  let base: { value: number; visitStartedAt: string } | undefined;
  if (baseline && baseline.visit.id !== visitId) {
    let match: Reading | undefined;
    for (const r of baseline.readings) {
      if (r.typeId === type.id && r.phase === 'as-left' && contextMatches(type, r.context, context) && (!match || r.takenAt > match.takenAt)) match = r;
    }
    if (match) base = { value: match.value, visitStartedAt: baseline.visit.startedAt };
  }
  return expectationFor({ type, instrument, context, baseline: base, engine });
}

/** Expected value and verdict for a value (base units), with the instrument's own limit taken into account. */
export function assess(
  type: ReadingType, instrument: InstrumentProfile | undefined, visitId: string, value: number, context: ReadingContext,
  baseline: BaselineSet | undefined, engine: EngineFunctions | undefined, limit?: MakerLimit,
): { expected?: Reading['expected']; verdict?: Verdict } {
  const r = withConventionCheck(type, typeof context.convention === 'string' ? context.convention : undefined, value,
    judgeWithLimit(value, type.baseUnit, expectationOf(type, instrument, visitId, context, baseline, engine), limit));
  if (!r) return {};
  const e = r.expectation;
  const expected: NonNullable<Reading['expected']> = { basis: e.basis, source: e.source, summary: r.judgement.summary };
  if (e.value !== undefined) expected.value = e.value;
  if (e.low !== undefined) expected.low = e.low;
  if (e.high !== undefined) expected.high = e.high;
  return { expected, verdict: r.judgement.verdict };
}

export function describeType(typeId: string, types: readonly ReadingType[]): string {
  return types.find((t) => t.id === typeId)?.label ?? `reading type ${shown(typeId)}`;
}

/**
 * The reading as it will be after an edit: when the value, its unit or its note changes, the version being
 * replaced goes onto the end of its history (value, unit, verdict, note, when it was recorded and when replaced).
 * A change of context only (gauge gas, parked m/z) is re-judged without a history entry of its own.
 */
export function withHistory(was: Reading, next: Pick<Reading, 'value' | 'entered' | 'note'>, now: string): Reading['history'] {
  const changed = next.value !== was.value || next.entered.text !== was.entered.text || next.entered.unit !== was.entered.unit || next.note !== was.note;
  if (!changed) return was.history;
  const version: ReadingVersion = {
    value: was.value, entered: { ...was.entered }, note: was.note,
    ...(was.verdict ? { verdict: was.verdict } : {}),
    recordedAt: was.history?.at(-1)?.replacedAt ?? was.takenAt, replacedAt: now,
  };
  return [...(was.history ?? []), version];
}
