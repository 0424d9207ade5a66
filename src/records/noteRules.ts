// "Note this": the rules for recording a value from any screen, as pure functions. The store applies them inside
// one transaction (which visit the value goes to, what reading it becomes).
import { resolveUnit, typeAliases, type ReadingType } from './catalogue';
import type { ReadingContext } from './judge';
import type { VisitFields } from './visits';
import type { Reading, ReadingPhase, Visit } from './types';

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

/** A visit started this recently (and not in the future) still takes noted values: one working day (common practice). */
export const NOTE_RECENT_VISIT_MS = 12 * 3600_000;

/** The reading a note becomes, short of its visit: what the store's addReading takes. */
export interface NotedReading {
  typeId: string;
  phase: ReadingPhase;
  value: number;
  entered: { text: string; unit: string };
  context: ReadingContext;
  note: string;
  origin: Reading['origin'];
}

/** Why a note cannot be recorded, as a sentence naming the value; undefined when it can. */
export function noteProblem(note: NoteInput): string | undefined {
  if (!Number.isFinite(note.value)) return `Could not note “${note.label}”: the value is not a finite number.`;
  const phase = note.phase ?? 'as-found';
  if (phase !== 'as-found' && phase !== 'as-left') return `Could not note “${note.label}”: the phase must be as-found or as-left, not “${String(phase)}”.`;
  return undefined;
}

/**
 * The visit a note goes to when none is marked current: the instrument's newest visit if it started within
 * NOTE_RECENT_VISIT_MS before `now` (never one dated in the future).
 */
export function recentVisitForNote(visits: readonly Visit[], now: Date): Visit | undefined {
  let newest: Visit | undefined;
  for (const v of visits) if (!newest || v.startedAt > newest.startedAt) newest = v;
  if (!newest) return undefined;
  const started = Date.parse(newest.startedAt);
  return now.getTime() - started < NOTE_RECENT_VISIT_MS && started <= now.getTime() ? newest : undefined;
}

/** The visit opened for a note when there is no current or recent one. */
export function noteVisitFields(instrumentId: string, now: Date): VisitFields {
  return {
    instrumentId, startedAt: now.toISOString(), site: '', engineer: '', reason: 'other',
    notes: 'Opened by “Note this”. Fill in the site, engineer and reason.', partsUsed: '',
  };
}

/** Context keys a reading can hold: plain names, up to 40 characters. */
const CONTEXT_KEY = /^[A-Za-z][A-Za-z0-9_-]{0,39}$/;

/** Keep only what a reading can hold: short text or finite numbers under plain keys. */
export function noteContext(raw: Readonly<Record<string, string | number>> | undefined): ReadingContext {
  const context: ReadingContext = {};
  for (const [k, v] of Object.entries(raw ?? {})) {
    if (!CONTEXT_KEY.test(k)) continue;
    if (typeof v === 'number' && Number.isFinite(v)) context[k] = v;
    else if (typeof v === 'string') context[k] = v.slice(0, 200);
  }
  return context;
}

/** A gas name from a calculator: N2 means the gauge's own scale; He, H2 and Ar are corrections; others are "other". */
export function gaugeGasOf(name: string): string {
  return /^n2/i.test(name) ? 'N2-equivalent' : ['He', 'H2', 'Ar'].includes(name) ? name : 'other';
}

/**
 * What a note becomes: a reading of a known type, converted from the unit given (the convention travels with
 * it), or else a "Noted value" keeping its label and unit as they came.
 */
export function notedReading(note: NoteInput, types: readonly ReadingType[]): NotedReading {
  const phase: ReadingPhase = note.phase ?? 'as-found';
  const typeId = note.typeId ? typeAliases[note.typeId] ?? note.typeId : undefined;
  const type = typeId ? types.find((t) => t.id === typeId) : undefined;
  const context = noteContext(note.context);
  if (type && 'gaugeGas' in context) context.gaugeGas = gaugeGasOf(String(context.gaugeGas));
  const unit = type ? resolveUnit(type, note.unit, `${String(context.convention ?? '')} ${note.label}`) : undefined;
  const text = String(Number(note.value.toPrecision(8)));
  const common = { phase, context, note: note.label, origin: note.origin };
  if (type && unit) {
    if (type.units.length > 1) context.convention = unit.label;
    return { ...common, typeId: type.id, value: note.value * unit.factor + (unit.offset ?? 0), entered: { text, unit: unit.label } };
  }
  context.label = note.label.slice(0, 200);
  context.unit = note.unit.slice(0, 200);
  return { ...common, typeId: 'noted-value', value: note.value, entered: { text, unit: note.unit.slice(0, 100) } };
}
