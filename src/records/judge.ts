// Reading entry checks, expected values and verdicts. Pure functions: no storage, no DOM.
import { LEAK_BANDS } from '../engine/leak';
import { dcForMass, rfForMass } from '../engine/scanLaw';
import type { BadSide, ReadingType, ToleranceRule } from './catalogue';
import { unitOf } from './catalogue';
import { airBandSource, judgeAirSignature } from './checks';
import { parseNumber } from './numberText';
import { checkTyped, prefixesAllowed, type EntrySpec } from './numberEntry';
import type { InstrumentProfile, Verdict } from './types';
import { formatNumber } from './numberText';
import { fromBase, rfUnitId, toBase, type UnitDef } from './units';
import { dcConventionSuspects, dcFormWords, factorWords, rfConventionSuspects, rfFormWords } from './conventions';
import { RF_FORMS, type DcForm, type RfForm } from '../engine/voltageConventions';

export type ReadingContext = Record<string, string | number>;

/**
 * Physics the store borrows from the engine. Injected so the store can be tested (and can run) without it.
 * rfForMass: RF amplitude, V zero-to-peak one rod to ground, for m/z (u), field radius r0 (m), frequency (Hz)
 * and Mathieu q (default: the apex of the first stability region).
 */
export interface EngineFunctions {
  rfForMass(args: { mz: number; r0: number; frequency: number; q?: number }): number;
  /** DC on one rod pair to ground at the apex; when absent the store uses U = 0.16784·V (apex U/V, Dawson 1976). */
  dcForMass?(args: { mz: number; r0: number; frequency: number }): number;
  /**
   * Isotope ratio M+1/M (per cent) of an ion formula, and the ion's monoisotopic m/z (charge +1). Throws on a formula
   * it cannot read. Given by the UI from the spectrum module; without it a calibrant isotope ratio is judged against
   * its baseline only.
   */
  isotopeM1?(formula: string): { mz: number; percent: number };
}

/** Apex U/V of the first stability region, a/(2q) = 0.23699/(2·0.70600) (Dawson, Quadrupole Mass Spectrometry and Its Applications, 1976). */
export const APEX_DC_TO_RF = 0.16784;

export type ExpectationBasis = 'baseline' | 'maker limit' | 'calculated' | 'set value' | 'published' | 'generic' | 'air signature';

export interface Expectation {
  /** A single expected value, base units. */
  value?: number;
  /** Or a range, base units. */
  low?: number;
  high?: number;
  basis: ExpectationBasis;
  /** Where it comes from, in words, with the class of the source. */
  source: string;
  tolerance: ToleranceRule;
  badSide: BadSide;
  /** The air band of the leak tools (low–high is the band): inside it is an air signature, so the verdict runs the other way. */
  airSignature?: { argonPercent?: number };
  /** A maker's or engineer's limit entered for the instrument replaces this expectation. */
  yieldsToLimit?: boolean;
}

export interface Judgement {
  verdict: Verdict;
  /** The deviation in the tolerance's own measure (fraction, base units, or factor). 0 inside a range. */
  deviation: number;
  summary: string;
}

export const verdictWords: Record<Verdict, { word: string; symbol: string }> = {
  pass: { word: 'pass', symbol: '✓' },
  borderline: { word: 'borderline', symbol: '△' },
  fail: { word: 'fail', symbol: '✗' },
  convention: { word: 'check the convention', symbol: '⇄' },
};

function measure(rule: ToleranceRule, x: number, ref: number): number {
  switch (rule.kind) {
    case 'absolute':
      return Math.abs(x - ref);
    case 'relative':
      if (ref === 0) return x === 0 ? 0 : Infinity;
      return Math.abs(x - ref) / Math.abs(ref);
    case 'factor':
      // A ratio needs both positive; zero or negative against a positive reference is off the scale.
      if (x <= 0 || ref <= 0) return x === ref ? 1 : Infinity;
      return Math.max(x / ref, ref / x);
  }
}

function grade(rule: ToleranceRule, dev: number): Verdict {
  if (dev <= rule.pass) return 'pass';
  if (dev <= rule.borderline) return 'borderline';
  return 'fail';
}

const basisWords: Record<ExpectationBasis, string> = {
  baseline: 'the baseline value',
  'maker limit': 'the maker’s limit',
  calculated: 'the calculated value',
  'set value': 'the set value',
  published: 'the published value',
  generic: 'the generic value',
  'air signature': 'the air band',
};

function describe(rule: ToleranceRule, dev: number, unit: string): string {
  if (!Number.isFinite(dev)) return 'off the scale';
  switch (rule.kind) {
    case 'absolute':
      return `off by ${formatNumber(dev, 3)}${unit ? ` ${unit}` : ''}`;
    case 'relative':
      return `off by ${formatNumber(dev * 100, 3)} %`;
    case 'factor':
      return `off by a factor ${formatNumber(dev, 3)}`;
  }
}

/**
 * Judge a value (base units) against an expectation. Pure and total: every finite input gets a verdict.
 * `unit` (the base unit) only makes the summary read better for absolute tolerances.
 */
export function judge(x: number, e: Expectation, unit = ''): Judgement {
  if (!Number.isFinite(x)) return { verdict: 'fail', deviation: Infinity, summary: 'not a finite number' };
  if (e.airSignature) return judgeAirSignature(x, e.airSignature.argonPercent);
  if (e.value !== undefined) {
    const ref = e.value;
    if ((e.badSide === 'high' && x <= ref) || (e.badSide === 'low' && x >= ref)) {
      return { verdict: 'pass', deviation: 0, summary: `on the good side of ${basisWords[e.basis]}` };
    }
    const dev = measure(e.tolerance, x, ref);
    const verdict = grade(e.tolerance, dev);
    return { verdict, deviation: dev, summary: `${describe(e.tolerance, dev, unit)} from ${basisWords[e.basis]}` };
  }
  const below = e.low !== undefined && x < e.low;
  const above = e.high !== undefined && x > e.high;
  if (!below && !above) return { verdict: 'pass', deviation: 0, summary: `inside the ${e.basis} range` };
  if ((below && e.badSide === 'high') || (above && e.badSide === 'low')) {
    return { verdict: 'pass', deviation: 0, summary: `outside the ${e.basis} range on the good side` };
  }
  const bound = below ? e.low! : e.high!;
  const dev = measure(e.tolerance, x, bound);
  const verdict = grade(e.tolerance, dev);
  return { verdict, deviation: dev, summary: `${below ? 'below' : 'above'} the ${e.basis} range, ${describe(e.tolerance, dev, unit)}` };
}

export interface ExpectationInput {
  type: ReadingType;
  instrument?: InstrumentProfile;
  context: ReadingContext;
  /** The matching as-left reading of the instrument's baseline visit, if any. */
  baseline?: { value: number; visitStartedAt: string };
  engine?: EngineFunctions;
}

function num(v: unknown): number | undefined {
  return typeof v === 'number' && Number.isFinite(v) ? v : undefined;
}

/** The engine refuses inputs outside its ranges by throwing; here that just means "no calculated value". */
function safely(f: () => number): number | undefined {
  try {
    const v = f();
    return Number.isFinite(v) ? v : undefined;
  } catch {
    return undefined;
  }
}

/** The calculated expectation of a type, or undefined when its inputs are missing. */
function calculated(inp: ExpectationInput): Expectation | undefined {
  const { type, instrument, context, engine } = inp;
  const tolerance = type.computedTolerance;
  if (!type.computed || !tolerance) return undefined;
  const source = type.computedSource ?? 'calculated';
  const mz = num(context.mz);
  switch (type.computed) {
    case 'rf-amplitude': {
      if (!engine || !instrument || mz === undefined) return undefined;
      const v = safely(() => engine.rfForMass({ mz, r0: instrument.rodFieldRadius, frequency: instrument.rfFrequency }));
      return v !== undefined ? { value: v, basis: 'calculated', source, tolerance, badSide: type.badSide } : undefined;
    }
    case 'dc-amplitude': {
      if (!engine || !instrument || mz === undefined) return undefined;
      const args = { mz, r0: instrument.rodFieldRadius, frequency: instrument.rfFrequency };
      const u = safely(() => (engine.dcForMass ? engine.dcForMass(args) : APEX_DC_TO_RF * engine.rfForMass(args)));
      return u !== undefined ? { value: u, basis: 'calculated', source, tolerance, badSide: type.badSide } : undefined;
    }
    case 'rf-frequency':
      if (!instrument) return undefined;
      return { value: instrument.rfFrequency, basis: 'calculated', source, tolerance, badSide: type.badSide };
    case 'setpoint': {
      const s = num(context.setpoint);
      return s === undefined ? undefined : { value: s, basis: 'set value', source, tolerance, badSide: type.badSide };
    }
    case 'isotope-formula': {
      const formula = typeof context.formula === 'string' ? context.formula.trim() : '';
      if (!engine?.isotopeM1 || !formula || mz === undefined) return undefined;
      let got: { mz: number; percent: number };
      try {
        got = engine.isotopeM1(formula);
      } catch {
        return undefined;
      }
      // The formula must be the ion the engineer named: its monoisotopic m/z within half a unit of the typed m/z.
      if (!(Math.abs(got.mz - mz) <= 0.5) || !Number.isFinite(got.percent)) return undefined;
      return { value: got.percent, basis: 'calculated', source: `${source}; ${formula}+ at m/z ${formatNumber(got.mz, 6)}`, tolerance, badSide: type.badSide, yieldsToLimit: true };
    }
  }
}

/** The air band of the leak tools for a 28:32 ratio, with the argon of the same scan when it was given. */
function airSignatureExpectation(type: ReadingType, context: ReadingContext): Expectation {
  const argonPercent = num(context.argonPercent);
  return {
    low: LEAK_BANDS.airCore.low, high: LEAK_BANDS.airCore.high, basis: 'air signature', source: airBandSource(),
    tolerance: { kind: 'absolute', pass: 0, borderline: 0 }, badSide: type.badSide,
    airSignature: argonPercent !== undefined ? { argonPercent } : {}, yieldsToLimit: true,
  };
}

/**
 * Where the expected value comes from, best first: the instrument's own baseline, then a calculation
 * (engine, profile, set value or published ratio), then a generic range for the instrument kind.
 * Returns undefined when nothing applies: the reading is recorded without a verdict.
 */
export function expectationFor(inp: ExpectationInput): Expectation | undefined {
  const { type, instrument, baseline } = inp;
  // Air is judged by its signature, never by how far a ratio moved from the baseline's.
  if (type.computed === 'air-signature') return airSignatureExpectation(type, inp.context);
  if (baseline && Number.isFinite(baseline.value)) {
    return {
      value: baseline.value, basis: 'baseline', tolerance: type.baselineTolerance, badSide: type.badSide,
      source: `the instrument’s baseline (as-left, visit of ${baseline.visitStartedAt.slice(0, 10)})`,
      ...(type.limitWins ? { yieldsToLimit: true } : {}),
    };
  }
  const c = calculated(inp);
  if (c) return c;
  const generic = type.generic?.find((g) =>
    (!g.kinds || (instrument && g.kinds.includes(instrument.kind))) &&
    Object.entries(g.when ?? {}).every(([k, v]) => String(inp.context[k] ?? '') === v));
  if (generic) {
    return {
      low: generic.low, high: generic.high, basis: 'generic', source: generic.source, badSide: type.badSide,
      tolerance: type.genericMargin ?? { kind: 'relative', pass: 0, borderline: 0.1 },
    };
  }
  return undefined;
}

/** Readings are comparable when the type's match keys agree (same parked m/z, same gauge gas…). */
export function contextMatches(type: ReadingType, a: ReadingContext | undefined, b: ReadingContext | undefined): boolean {
  return type.matchContext.every((k) => String(a?.[k] ?? '') === String(b?.[k] ?? ''));
}

function rangeText(type: ReadingType, unitId: string): string {
  const unit = unitOf(type, unitId)!;
  const a = fromBase(unit, type.plausible.min);
  const b = fromBase(unit, type.plausible.max);
  return `between ${formatNumber(Math.min(a, b))} and ${formatNumber(Math.max(a, b))} ${unit.label}`;
}

/** The entry spec of a reading's value typed in `unit`: its label and plausible range in that unit (the one number-entry rule). */
export function typeSpec(type: ReadingType, unit: UnitDef): EntrySpec {
  const a = fromBase(unit, type.plausible.min);
  const b = fromBase(unit, type.plausible.max);
  return { label: type.label, unit: unit.label, min: Math.min(a, b), max: Math.max(a, b), prefixes: prefixesAllowed(unit.label) };
}

export type EntryResult =
  | { ok: true; value: number; context: ReadingContext; unitId: string }
  | { ok: false; errors: Record<string, string> };

/**
 * Check what the user typed for a reading: the value (in the chosen unit) and its context fields.
 * Messages name the field and the accepted range in the unit the user chose.
 * Context numbers marked with the reading's own unit ("Set value") are converted to base units too.
 */
export function checkEntry(type: ReadingType, text: string, unitId: string, contextText: Record<string, string>): EntryResult {
  const errors: Record<string, string> = {};
  const unit = unitOf(type, unitId);
  let value = NaN;
  if (!unit) {
    errors.unit = `Unit “${unitId}” is not one of: ${type.units.map((u) => u.label).join('; ')}.`;
  } else {
    const r = checkTyped(text, typeSpec(type, unit));
    if (r.ok) value = toBase(unit, r.value);
    else errors.value = r.message;
  }
  const context: ReadingContext = {};
  for (const f of type.context) {
    const raw = (contextText[f.key] ?? (f.defaultValue !== undefined ? String(f.defaultValue) : '')).trim();
    if (raw === '') {
      if (f.required) errors[f.key] = `${f.label} is empty: ${f.kind === 'choice' ? 'choose one' : `enter a value between ${f.min} and ${f.max}${f.unit ? ` ${f.unit}` : ''}`}.`;
      continue;
    }
    if (f.kind === 'choice') {
      if (!f.choices?.some((c) => c.value === raw)) errors[f.key] = `${f.label} “${raw}” is not one of: ${f.choices?.map((c) => c.label).join('; ')}.`;
      else context[f.key] = raw;
    } else if (f.kind === 'number') {
      const n = parseNumber(raw);
      // A set value is typed in the same unit as the reading.
      const sameUnit = f.key === 'setpoint' && unit;
      const lo = sameUnit ? fromBase(unit, f.min ?? -Infinity) : f.min ?? -Infinity;
      const hi = sameUnit ? fromBase(unit, f.max ?? Infinity) : f.max ?? Infinity;
      const shownUnit = sameUnit ? unit.label : f.unit ?? '';
      const rangeWords = `enter a value between ${formatNumber(Math.min(lo, hi))} and ${formatNumber(Math.max(lo, hi))}${shownUnit ? ` ${shownUnit}` : ''}`;
      if (n === null) errors[f.key] = `${f.label} “${raw}” is not a number: ${rangeWords}.`;
      else if (n < Math.min(lo, hi) || n > Math.max(lo, hi)) errors[f.key] = `${f.label} ${raw} is out of range: ${rangeWords}.`;
      else context[f.key] = sameUnit ? toBase(unit, n) : n;
    } else {
      if (raw.length > 200) errors[f.key] = `${f.label} is ${raw.length} characters long: keep it to 200.`;
      else context[f.key] = raw;
    }
  }
  if (Object.keys(errors).length) return { ok: false, errors };
  // The convention travels with the value: "V peak-to-peak, one rod to ground" and so on.
  if (unit && type.units.length > 1) context.convention = unit.label;
  return { ok: true, value, context, unitId };
}

// ---- Instrument-specific limits --------------------------------------------------------------------

/**
 * A limit the instrument's maker (or the site) sets for a reading type, entered by the user with its source.
 * Base units. It applies to every reading of the type on that instrument, whatever the context.
 */
export interface MakerLimit {
  typeId: string;
  low?: number;
  high?: number;
  source: string;
  /**
   * Only for readings whose context has these values (for example one calibrant ion pair: { mz: '502', referenceMz: '69' });
   * absent, the limit applies to every reading of the type.
   */
  match?: Record<string, string>;
}

/** The limit for a reading: the most specific one whose `match` agrees with the reading's context. */
export function limitFor(limits: readonly MakerLimit[], typeId: string, context: ReadingContext): MakerLimit | undefined {
  let best: MakerLimit | undefined;
  for (const l of limits) {
    if (l.typeId !== typeId) continue;
    const m = Object.entries(l.match ?? {});
    if (!m.every(([k, v]) => String(context[k] ?? '') === v)) continue;
    if (!best || m.length > Object.keys(best.match ?? {}).length) best = l;
  }
  return best;
}

/** Whether two limits take the same place (same type, same ions): saving one replaces the other. */
export function sameLimitSlot(a: Pick<MakerLimit, 'typeId' | 'match'>, b: Pick<MakerLimit, 'typeId' | 'match'>): boolean {
  const key = (l: Pick<MakerLimit, 'typeId' | 'match'>) => `${l.typeId}|${Object.entries(l.match ?? {}).sort(([x], [y]) => (x < y ? -1 : 1)).map(([k, v]) => `${k}=${v}`).join('&')}`;
  return key(a) === key(b);
}

/** The ions a limit is for, in words ("m/z 502 as % of m/z 69"), or '' for every reading of its type. */
export function limitMatchText(limit: Pick<MakerLimit, 'match'>): string {
  const m = limit.match ?? {};
  if (m.mz === undefined) return '';
  return m.referenceMz !== undefined ? `m/z ${m.mz} as % of m/z ${m.referenceMz}` : `m/z ${m.mz}`;
}

/** A maker's limit is hard: inside passes, outside fails, no borderline band. */
export function limitExpectation(limit: MakerLimit): Expectation {
  return {
    low: limit.low, high: limit.high, basis: 'maker limit', source: `maker’s limit${limit.match ? ` for ${limitMatchText(limit)}` : ''}: ${limit.source}`,
    tolerance: { kind: 'absolute', pass: 0, borderline: 0 }, badSide: 'both',
  };
}

const rank: Record<Verdict, number> = { pass: 0, borderline: 1, convention: 2, fail: 3 };

/**
 * Combine the usual expectation with the instrument's own limit. A maker's limit replaces a generic range
 * (the maker knows the instrument better), and replaces any expectation marked `yieldsToLimit` (the background-gas and
 * calibrant checks: the limit entered for the instrument wins); against other baselines or calculations the worse
 * verdict wins, so a reading inside its drift tolerance but outside the maker's limit still fails.
 */
export function judgeWithLimit(
  value: number, unit: string, primary: Expectation | undefined, limit: MakerLimit | undefined,
): { expectation: Expectation; judgement: Judgement } | undefined {
  const fromLimit = limit ? { expectation: limitExpectation(limit), judgement: judge(value, limitExpectation(limit), unit) } : undefined;
  if (!primary || primary.basis === 'generic' || primary.yieldsToLimit) return fromLimit ?? (primary ? { expectation: primary, judgement: judge(value, primary, unit) } : undefined);
  const usual = { expectation: primary, judgement: judge(value, primary, unit) };
  if (!fromLimit) return usual;
  return rank[fromLimit.judgement.verdict] > rank[usual.judgement.verdict] ? fromLimit : usual;
}

/** Limits read back from settings (they may come from an imported backup): keep only well-formed ones. */
export function makerLimitsFrom(value: unknown): MakerLimit[] {
  if (!Array.isArray(value)) return [];
  return value.filter((l): l is MakerLimit => {
    if (typeof l !== 'object' || l === null) return false;
    const r = l as Record<string, unknown>;
    const okNum = (x: unknown) => x === undefined || (typeof x === 'number' && Number.isFinite(x));
    const okMatch = r.match === undefined || (typeof r.match === 'object' && r.match !== null && !Array.isArray(r.match) &&
      Object.values(r.match).every((v) => typeof v === 'string'));
    return okMatch && typeof r.typeId === 'string' && typeof r.source === 'string' && okNum(r.low) && okNum(r.high) &&
      (r.low !== undefined || r.high !== undefined) && !(typeof r.low === 'number' && typeof r.high === 'number' && r.high < r.low);
  });
}

export function makerLimitsKey(instrumentId: string): string {
  return `makerLimits:${instrumentId}`;
}

export interface MakerLimitDraft {
  typeId: string;
  unitId: string;
  low: string;
  high: string;
  source: string;
  /** Optional: the ions the limit is for (types matched by m/z, such as the calibrant ratios), as typed. */
  mz?: string;
  referenceMz?: string;
}

/** Check the "maker's limit" form; values are typed in the chosen unit and stored in base units. */
export function checkMakerLimit(type: ReadingType | undefined, d: MakerLimitDraft): { ok: true; limit: MakerLimit } | { ok: false; errors: Partial<Record<keyof MakerLimitDraft, string>> } {
  const errors: Partial<Record<keyof MakerLimitDraft, string>> = {};
  if (!type) return { ok: false, errors: { typeId: 'Reading is not chosen: pick the reading the limit is for.' } };
  const unit = unitOf(type, d.unitId);
  if (!unit) return { ok: false, errors: { unitId: `Unit “${d.unitId}” is not one of: ${type.units.map((u) => u.label).join('; ')}.` } };
  const read = (k: 'low' | 'high', label: string): number | undefined => {
    const t = d[k].trim();
    if (t === '') return undefined;
    const v = parseNumber(t);
    if (v === null) { errors[k] = `${label} “${t}” is not a number: ${rangeText(type, unit.id).replace(/^between/, 'enter a value between')}.`; return undefined; }
    const base = toBase(unit, v);
    if (!(base >= type.plausible.min * (1 - 1e-12) && base <= type.plausible.max * (1 + 1e-12))) {
      errors[k] = `${label} ${t} ${unit.label} is out of range: enter a value ${rangeText(type, unit.id)}.`;
      return undefined;
    }
    return base;
  };
  const low = read('low', 'Lowest allowed');
  const high = read('high', 'Highest allowed');
  if (d.low.trim() === '' && d.high.trim() === '') errors.high = 'Enter the lowest allowed value, the highest, or both.';
  if (low !== undefined && high !== undefined && high < low) errors.high = 'Highest allowed must not be below the lowest allowed.';
  if (d.source.trim() === '') errors.source = 'Source is empty: say where the limit comes from (for example the maker’s site-preparation guide, section and edition).';
  else if (d.source.length > 300) errors.source = `Source is ${d.source.length} characters long: keep it to 300.`;
  const match: Record<string, string> = {};
  for (const k of ['mz', 'referenceMz'] as const) {
    const t = (d[k] ?? '').trim();
    if (t === '') continue;
    const label = k === 'mz' ? 'For ion m/z' : 'As % of m/z';
    const v = parseNumber(t);
    if (!type.matchContext.includes(k)) errors[k] = `${label} does not apply to ${type.label}: leave it empty.`;
    else if (v === null || v < 1 || v > 5000) errors[k] = `${label} “${t}” is not accepted: enter a value between 1 and 5000 u.`;
    else match[k] = String(v);
  }
  if (match.referenceMz !== undefined && match.mz === undefined) errors.mz = 'For ion m/z is empty: say which ion the limit is for, or leave both empty.';
  if (Object.keys(errors).length) return { ok: false, errors };
  return {
    ok: true,
    limit: {
      typeId: type.id, ...(low !== undefined ? { low } : {}), ...(high !== undefined ? { high } : {}), source: d.source.trim(),
      ...(Object.keys(match).length ? { match } : {}),
    },
  };
}

/** The engine's scan law: V and U at the apex of the first stability region, per rod to ground. */
export const defaultEngine: EngineFunctions = { rfForMass, dcForMass };

// ---- Convention slips --------------------------------------------------------------------------------

const rfFormByUnit = new Map<string, RfForm>(RF_FORMS.map((f) => [rfUnitId(f), f]));
const dcFormByUnit: Record<string, DcForm> = { 'V-rod': 'perRod', 'V-pairs': 'betweenPairs' };

/**
 * A reading of RF or DC amplitude that does not match its single expected value, but would pass if it had been
 * taken in another read-back convention, is judged 'convention' (check the convention) instead of fail or
 * borderline, and the summary says which convention would pass. `unitText` is the unit id or label it was typed
 * in (the reading's context.convention keeps the label). Other readings come back unchanged.
 */
export function withConventionCheck(
  type: ReadingType, unitText: string | undefined, value: number,
  r: { expectation: Expectation; judgement: Judgement } | undefined,
): { expectation: Expectation; judgement: Judgement } | undefined {
  if (!r || !unitText || (r.judgement.verdict !== 'fail' && r.judgement.verdict !== 'borderline')) return r;
  if (r.expectation.value === undefined || r.expectation.basis === 'maker limit') return r;
  const unit = type.units.find((u) => u.id === unitText || u.label === unitText);
  if (!unit) return r;
  const typed = fromBase(unit, value);
  const passes = (v: number) => judge(toBase(unit, v), r.expectation, type.baseUnit).verdict === 'pass';
  let alt: { words: string; valueInChosen: number; factor: number } | undefined;
  if (type.id === 'rf-amplitude' && rfFormByUnit.has(unit.id)) {
    const s = rfConventionSuspects(typed, rfFormByUnit.get(unit.id)!, passes)[0];
    if (s) alt = { words: rfFormWords[s.form], valueInChosen: s.valueInChosen, factor: s.factor };
  } else if (type.id === 'dc-amplitude' && dcFormByUnit[unit.id]) {
    const s = dcConventionSuspects(typed, dcFormByUnit[unit.id], passes)[0];
    if (s) alt = { words: dcFormWords[s.form], valueInChosen: s.valueInChosen, factor: s.factor };
  }
  if (!alt) return r;
  return {
    expectation: r.expectation,
    judgement: {
      verdict: 'convention', deviation: r.judgement.deviation,
      summary: `${r.judgement.summary}; off by a convention factor of ${factorWords(Math.max(alt.factor, 1 / alt.factor))}: read as ${alt.words} it would pass (${formatNumber(alt.valueInChosen)} ${unit.label}). Check the convention`,
    },
  };
}
