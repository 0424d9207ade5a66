// Record validation shared by the store's own writes and by backup import. Every problem names the record's
// place ("readings[12].value") and says what was expected and what was found.
import { catalogueType } from './catalogue';
import { profileRecordProblems } from './profile';
import type { DraftRecord, InstrumentProfile, Reading, SettingRecord, Visit, WalkRecord } from './types';

export const LIMITS = {
  id: 128,
  shortText: 200,
  longText: 20000,
  readingNote: 5000,
  enteredText: 100,
  contextKeys: 20,
  contextText: 200,
  /** Serialised size of a setting, draft or walk state. */
  jsonValue: 1_000_000,
  jsonDepth: 32,
} as const;

export const visitReasons = [
  { value: 'preventive', label: 'Preventive maintenance' },
  { value: 'installation', label: 'Installation or qualification' },
  { value: 'after-venting-or-cleaning', label: 'After venting or cleaning' },
  { value: 'sensitivity-loss', label: 'Loss of sensitivity' },
  { value: 'failure', label: 'Failure' },
  { value: 'other', label: 'Other' },
] as const;

const phases = ['as-found', 'as-left'];
const verdicts = ['pass', 'borderline', 'fail', 'convention'];
const origins = ['entered', 'calculator', 'walk'];
const walkStatuses = ['in-progress', 'finished', 'abandoned'];
const idPattern = /^[A-Za-z0-9][A-Za-z0-9._:-]*$/;
const isoPattern = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,6})?)?(Z|[+-]\d{2}:\d{2})$/;

/** Show a bad value briefly and safely in a message. */
export function shown(v: unknown): string {
  if (typeof v === 'string') return JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v) + (v.length > 40 ? ` (${v.length} characters)` : '');
  if (typeof v === 'number') return String(v);
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'an array';
  return typeof v === 'object' ? 'an object' : typeof v;
}

type Problems = string[];
type Obj = Record<string, unknown>;

function isObj(v: unknown): v is Obj {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function allowedKeys(p: Problems, path: string, r: Obj, keys: readonly string[]): void {
  for (const k of Object.keys(r)) if (!keys.includes(k)) p.push(`${path}: unexpected field ${JSON.stringify(k.slice(0, 40))}`);
}

function str(p: Problems, path: string, v: unknown, max: number, opts: { optional?: boolean; nonEmpty?: boolean } = {}): void {
  if (v === undefined && opts.optional) return;
  if (typeof v !== 'string') p.push(`${path}: expected text, got ${shown(v)}`);
  else if (v.length > max) p.push(`${path}: text is ${v.length} characters long, more than the ${max} allowed`);
  else if (opts.nonEmpty && v.trim() === '') p.push(`${path}: must not be empty`);
}

function id(p: Problems, path: string, v: unknown, optional = false): void {
  if (v === undefined && optional) return;
  if (typeof v !== 'string' || v.length === 0 || v.length > LIMITS.id || !idPattern.test(v)) {
    p.push(`${path}: expected an identifier of 1 to ${LIMITS.id} letters, digits, '.', '_', ':' or '-', got ${shown(v)}`);
  }
}

/** The identifier fields of a record, each required. */
function ids(p: Problems, path: string, v: Obj, keys: readonly string[]): void {
  for (const k of keys) id(p, `${path}.${k}`, v[k]);
}

function date(p: Problems, path: string, v: unknown, optional = false): void {
  if (v === undefined && optional) return;
  if (typeof v !== 'string' || !isoPattern.test(v) || !Number.isFinite(Date.parse(v))) {
    p.push(`${path}: expected an ISO 8601 date and time such as "2026-03-01T09:30:00.000Z", got ${shown(v)}`);
  }
}

/** The date fields of a record, each required. */
function dates(p: Problems, path: string, v: Obj, keys: readonly string[]): void {
  for (const k of keys) date(p, `${path}.${k}`, v[k]);
}

/** What the user typed, kept beside the value: {text, unit}. */
function enteredAs(p: Problems, path: string, v: unknown): void {
  if (!isObj(v)) { p.push(`${path}: expected {text, unit}, got ${shown(v)}`); return; }
  allowedKeys(p, path, v, ['text', 'unit']);
  str(p, `${path}.text`, v.text, LIMITS.enteredText);
  str(p, `${path}.unit`, v.unit, LIMITS.enteredText);
}

function finite(p: Problems, path: string, v: unknown, optional = false): void {
  if (v === undefined && optional) return;
  if (typeof v !== 'number' || !Number.isFinite(v)) p.push(`${path}: expected a finite number, got ${shown(v)}`);
}

function oneOf(p: Problems, path: string, v: unknown, options: readonly string[], optional = false): void {
  if (v === undefined && optional) return;
  if (typeof v !== 'string' || !options.includes(v)) p.push(`${path}: expected one of ${options.join(', ')}, got ${shown(v)}`);
}

function bool(p: Problems, path: string, v: unknown): void {
  if (v !== undefined && typeof v !== 'boolean') p.push(`${path}: expected true or false, got ${shown(v)}`);
}

/** Plain JSON data only (no NaN, no functions), bounded in depth and size. */
export function jsonValueProblems(path: string, v: unknown): string[] {
  const p: Problems = [];
  const walk = (x: unknown, where: string, depth: number): void => {
    if (p.length) return;
    if (depth > LIMITS.jsonDepth) { p.push(`${where}: nested more than ${LIMITS.jsonDepth} levels deep`); return; }
    // undefined is dropped by JSON (null inside arrays) and compared that way on restore.
    if (x === null || x === undefined || typeof x === 'string' || typeof x === 'boolean') return;
    if (typeof x === 'number') { if (!Number.isFinite(x)) p.push(`${where}: expected a finite number, got ${x}`); return; }
    if (Array.isArray(x)) { x.forEach((y, i) => walk(y, `${where}[${i}]`, depth + 1)); return; }
    if (isObj(x)) { for (const [k, y] of Object.entries(x)) walk(y, `${where}.${k.slice(0, 40)}`, depth + 1); return; }
    p.push(`${where}: expected plain data, got ${typeof x}`);
  };
  walk(v, path, 0);
  if (!p.length) {
    const size = JSON.stringify(v ?? null).length;
    if (size > LIMITS.jsonValue) p.push(`${path}: ${size} characters of data, more than the ${LIMITS.jsonValue} allowed`);
  }
  return p;
}

const instrumentKeys = ['id', 'name', 'kind', 'rodFieldRadius', 'rodLength', 'rfFrequency', 'maxRfAmplitude', 'axialEnergy',
  'readbackConvention', 'multiplierVoltageLimit', 'notes', 'demo', 'createdAt', 'updatedAt'];

export function instrumentProblems(path: string, v: unknown): string[] {
  if (!isObj(v)) return [`${path}: expected an instrument profile object, got ${shown(v)}`];
  const p: Problems = [];
  allowedKeys(p, path, v, instrumentKeys);
  id(p, `${path}.id`, v.id);
  for (const m of profileRecordProblems(v)) if (!m.startsWith('id ')) p.push(`${path}: ${m}`);
  if (isObj(v.readbackConvention)) allowedKeys(p, `${path}.readbackConvention`, v.readbackConvention, ['amplitude', 'reference']);
  if (v.multiplierVoltageLimit !== undefined) {
    finite(p, `${path}.multiplierVoltageLimit`, v.multiplierVoltageLimit);
    if (typeof v.multiplierVoltageLimit === 'number' && !(v.multiplierVoltageLimit > 0 && v.multiplierVoltageLimit <= 10000)) {
      p.push(`${path}.multiplierVoltageLimit: expected 1 to 10000 V, got ${v.multiplierVoltageLimit}`);
    }
  }
  bool(p, `${path}.demo`, v.demo);
  dates(p, path, v, ['createdAt', 'updatedAt']);
  return p;
}

const visitKeys = ['id', 'instrumentId', 'startedAt', 'site', 'engineer', 'reason', 'notes', 'partsUsed', 'testEquipment',
  'baseline', 'demo', 'createdAt', 'updatedAt'];

export function visitProblems(path: string, v: unknown): string[] {
  if (!isObj(v)) return [`${path}: expected a visit object, got ${shown(v)}`];
  const p: Problems = [];
  allowedKeys(p, path, v, visitKeys);
  ids(p, path, v, ['id', 'instrumentId']);
  date(p, `${path}.startedAt`, v.startedAt);
  str(p, `${path}.site`, v.site, LIMITS.shortText);
  str(p, `${path}.engineer`, v.engineer, LIMITS.shortText);
  oneOf(p, `${path}.reason`, v.reason, visitReasons.map((r) => r.value));
  str(p, `${path}.notes`, v.notes, LIMITS.longText);
  str(p, `${path}.partsUsed`, v.partsUsed, LIMITS.longText);
  str(p, `${path}.testEquipment`, v.testEquipment, LIMITS.longText, { optional: true });
  bool(p, `${path}.baseline`, v.baseline);
  bool(p, `${path}.demo`, v.demo);
  dates(p, path, v, ['createdAt', 'updatedAt']);
  return p;
}

const readingKeys = ['id', 'visitId', 'instrumentId', 'typeId', 'phase', 'value', 'entered', 'context', 'expected', 'verdict',
  'note', 'takenAt', 'updatedAt', 'origin', 'demo', 'history'];

/** At most this many earlier versions are kept with one reading. */
export const HISTORY_LIMIT = 200;

export function readingProblems(path: string, v: unknown): string[] {
  if (!isObj(v)) return [`${path}: expected a reading object, got ${shown(v)}`];
  const p: Problems = [];
  allowedKeys(p, path, v, readingKeys);
  ids(p, path, v, ['id', 'visitId', 'instrumentId', 'typeId']);
  oneOf(p, `${path}.phase`, v.phase, phases);
  finite(p, `${path}.value`, v.value);
  if (typeof v.value === 'number' && Number.isFinite(v.value) && typeof v.typeId === 'string') {
    const t = catalogueType(v.typeId);
    if (t && !(v.value >= t.plausible.min * (1 - 1e-12) && v.value <= t.plausible.max * (1 + 1e-12))) {
      p.push(`${path}.value: ${v.value} ${t.baseUnit} is outside the accepted range ${t.plausible.min} to ${t.plausible.max} for ${t.label}`);
    }
  }
  enteredAs(p, `${path}.entered`, v.entered);
  if (v.context !== undefined) {
    if (!isObj(v.context)) p.push(`${path}.context: expected an object, got ${shown(v.context)}`);
    else {
      const keys = Object.keys(v.context);
      if (keys.length > LIMITS.contextKeys) p.push(`${path}.context: ${keys.length} entries, more than the ${LIMITS.contextKeys} allowed`);
      for (const k of keys.slice(0, LIMITS.contextKeys + 1)) {
        const x = v.context[k];
        if (k.length > 40 || !/^[A-Za-z][A-Za-z0-9_-]*$/.test(k)) p.push(`${path}.context: bad key ${JSON.stringify(k.slice(0, 40))}`);
        else if (typeof x === 'number') finite(p, `${path}.context.${k}`, x);
        else str(p, `${path}.context.${k}`, x, LIMITS.contextText);
      }
    }
  }
  if (v.expected !== undefined) {
    const e = v.expected;
    if (!isObj(e)) p.push(`${path}.expected: expected an object, got ${shown(e)}`);
    else {
      allowedKeys(p, `${path}.expected`, e, ['value', 'low', 'high', 'basis', 'source', 'summary']);
      finite(p, `${path}.expected.value`, e.value, true);
      finite(p, `${path}.expected.low`, e.low, true);
      finite(p, `${path}.expected.high`, e.high, true);
      str(p, `${path}.expected.basis`, e.basis, 40);
      str(p, `${path}.expected.source`, e.source, 500, { optional: true });
      str(p, `${path}.expected.summary`, e.summary, 500, { optional: true });
    }
  }
  oneOf(p, `${path}.verdict`, v.verdict, verdicts, true);
  str(p, `${path}.note`, v.note, LIMITS.readingNote);
  date(p, `${path}.takenAt`, v.takenAt);
  date(p, `${path}.updatedAt`, v.updatedAt, true);
  oneOf(p, `${path}.origin`, v.origin, origins);
  bool(p, `${path}.demo`, v.demo);
  if (v.history !== undefined) {
    if (!Array.isArray(v.history)) p.push(`${path}.history: expected a list of earlier versions, got ${shown(v.history)}`);
    else {
      if (v.history.length > HISTORY_LIMIT) p.push(`${path}.history: ${v.history.length} versions, more than the ${HISTORY_LIMIT} allowed`);
      v.history.slice(0, HISTORY_LIMIT + 1).forEach((h: unknown, i: number) => {
        const hp = `${path}.history[${i}]`;
        if (!isObj(h)) { p.push(`${hp}: expected an earlier version, got ${shown(h)}`); return; }
        allowedKeys(p, hp, h, ['value', 'entered', 'verdict', 'note', 'recordedAt', 'replacedAt']);
        finite(p, `${hp}.value`, h.value);
        enteredAs(p, `${hp}.entered`, h.entered);
        oneOf(p, `${hp}.verdict`, h.verdict, verdicts, true);
        str(p, `${hp}.note`, h.note, LIMITS.readingNote);
        dates(p, hp, h, ['recordedAt', 'replacedAt']);
      });
    }
  }
  return p;
}

export function walkProblems(path: string, v: unknown): string[] {
  if (!isObj(v)) return [`${path}: expected a walk object, got ${shown(v)}`];
  const p: Problems = [];
  allowedKeys(p, path, v, ['id', 'visitId', 'instrumentId', 'treeId', 'state', 'status', 'startedAt', 'updatedAt', 'demo']);
  ids(p, path, v, ['id', 'treeId']);
  for (const k of ['visitId', 'instrumentId'] as const) id(p, `${path}.${k}`, v[k], true);
  p.push(...jsonValueProblems(`${path}.state`, v.state));
  oneOf(p, `${path}.status`, v.status, walkStatuses);
  dates(p, path, v, ['startedAt', 'updatedAt']);
  bool(p, `${path}.demo`, v.demo);
  return p;
}

export function settingProblems(path: string, v: unknown): string[] {
  if (!isObj(v)) return [`${path}: expected a setting object, got ${shown(v)}`];
  const p: Problems = [];
  allowedKeys(p, path, v, ['key', 'value']);
  str(p, `${path}.key`, v.key, 100, { nonEmpty: true });
  p.push(...jsonValueProblems(`${path}.value`, v.value));
  return p;
}

export function draftProblems(path: string, v: unknown): string[] {
  if (!isObj(v)) return [`${path}: expected a draft object, got ${shown(v)}`];
  const p: Problems = [];
  allowedKeys(p, path, v, ['key', 'value', 'updatedAt']);
  str(p, `${path}.key`, v.key, 200, { nonEmpty: true });
  p.push(...jsonValueProblems(`${path}.value`, v.value));
  date(p, `${path}.updatedAt`, v.updatedAt);
  return p;
}

