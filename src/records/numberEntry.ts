// The one number-entry rule: read what was typed (exponent, ×10ⁿ, typographic minus, a unit prefix where the
// unit allows one), check it against the field's plausible range, and say what is wrong in the engineer's words:
// the field's label and the limit in the unit on screen. Pure; the visit log, the walk and the leak check use it.
import { formatNumber, readNumber } from './numberText';
import { UNITS } from './units';
import { InputRangeError } from '../engine/validate';

/** What a field accepts: its label, the unit shown beside it, and its plausible range in that unit. */
export interface EntrySpec {
  label: string;
  /** The unit on screen ('' when the field has none, e.g. heights in any one unit). */
  unit: string;
  min: number;
  max: number;
  /** The minimum itself is refused (a pressure must be more than 0). */
  minExclusive?: boolean;
  /** Accept a trailing µ (or u), m or k prefix: true only where the unit takes SI prefixes (V, A, Hz, Ω…). */
  prefixes?: boolean;
}

export type EntryCheck = { ok: true; value: number } | { ok: false; message: string; problem: 'empty' | 'not-a-number' | 'out-of-range' };

/** Units whose value may be typed with an SI prefix (2.5k V = 2500 V). Pressures and m/z take none. */
const PREFIXABLE = new Set(['V', 'A', 'Hz', 'Ω', 's', 'W', 'counts', 'counts/s']);

export function prefixesAllowed(unit: string): boolean {
  return PREFIXABLE.has(unit);
}

const PREFIX: Record<string, number> = { µ: 1e-6, μ: 1e-6, u: 1e-6, m: 1e-3, k: 1e3 };

/**
 * Read typed text as a number: what readNumber takes, plus "2.5×10^-5", "2.5 x10-5", a typographic minus (−)
 * and, where `prefixes`, one trailing µ/u/m/k ("500m" = 0.5).
 */
export function readTyped(text: string, prefixes = false): ReturnType<typeof readNumber> {
  let factor = 1;
  let t = text.trim().replace(/\s+/g, '').replace(/[−–]/g, '-');
  if (prefixes && t.length > 1) {
    const last = t.slice(-1);
    if (PREFIX[last] !== undefined && /[\d.]$/.test(t.slice(0, -1))) {
      factor = PREFIX[last];
      t = t.slice(0, -1);
    }
  }
  const r = readNumber(t, (c) => c.replace(/[×x*·]10\^?/i, 'e'));
  return 'value' in r ? { value: r.value * factor } : r;
}

function lower(spec: EntrySpec): string {
  return `${spec.minExclusive ? 'more than' : 'at least'} ${formatNumber(spec.min)}`;
}

function withUnit(spec: EntrySpec, s: string): string {
  return spec.unit ? `${s} ${spec.unit}` : s;
}

/** The accepted range in words, e.g. "more than 0 and at most 1200 mbar". */
export function rangeWords(spec: EntrySpec): string {
  const lo = Number.isFinite(spec.min);
  const hi = Number.isFinite(spec.max);
  if (lo && hi) {
    if (!spec.minExclusive) return withUnit(spec, `between ${formatNumber(spec.min)} and ${formatNumber(spec.max)}`);
    return withUnit(spec, `${lower(spec)} and at most ${formatNumber(spec.max)}`);
  }
  if (lo) return withUnit(spec, lower(spec));
  if (hi) return withUnit(spec, `at most ${formatNumber(spec.max)}`);
  return 'a number';
}

/** Capitalise the first letter so a label can start a sentence. */
function sentence(label: string): string {
  return label.charAt(0).toUpperCase() + label.slice(1);
}

/** Check a typed number against a field's spec; the message names the field and its limit in the unit on screen. */
export function checkTyped(text: string, spec: EntrySpec): EntryCheck {
  const r = readTyped(text, spec.prefixes ?? false);
  const name = sentence(spec.label);
  if ('problem' in r) {
    if (r.problem === 'empty') return { ok: false, problem: 'empty', message: `${name} is empty: enter a value ${rangeWords(spec)}.` };
    if (r.problem === 'not-a-number') {
      return { ok: false, problem: 'not-a-number', message: `${name} must be a number ${rangeWords(spec)}, written like 2.5 or 2.5e-5${spec.prefixes ? ' (µ, m or k allowed)' : ''}; “${text.trim()}” is not a number.` };
    }
    return { ok: false, problem: 'out-of-range', message: `${name} must be ${rangeWords(spec)}; “${text.trim()}” is too large to be a reading.` };
  }
  const v = r.value;
  const tooLow = spec.minExclusive ? v <= spec.min : v < spec.min * (1 + (spec.min < 0 ? 1e-12 : -1e-12));
  const tooHigh = v > spec.max * (1 + (spec.max < 0 ? -1e-12 : 1e-12));
  if (tooLow || tooHigh) {
    return { ok: false, problem: 'out-of-range', message: `${name} must be ${rangeWords(spec)}; ${withUnit(spec, formatNumber(v))} is ${tooLow ? 'below' : 'above'} that.` };
  }
  return { ok: true, value: v };
}

// ---- Plausible ranges by kind of quantity ----------------------------------------------------------

/** A plausible range in an SI unit with its source or class. */
export interface PlausibleRange {
  min: number;
  max: number;
  minExclusive?: boolean;
  source: string;
}

/**
 * Plausible ranges by SI unit, for a measured value that has no reading type of its own. Physical limits
 * (a pressure is positive, a resistance is not negative) or the span of the instruments Rodside serves.
 */
export const PLAUSIBLE_BY_SI: Readonly<Record<string, PlausibleRange>> = {
  Pa: { min: 0, minExclusive: true, max: 1.2e5, source: 'physical: an absolute pressure is positive; a vacuum system reads at most a little above one standard atmosphere, 101 325 Pa (ISO 2533:1975)' },
  V: { min: -1e5, max: 1e5, source: 'class: mass-spectrometer supplies stay within ±100 kV (common practice)' },
  A: { min: 0, max: 10, source: 'class: source and detector currents, magnitude below 10 A (common practice)' },
  'Ω': { min: 0, max: 1e15, source: 'physical: a resistance is not negative; 10¹⁵ Ω is beyond insulation meters (common practice)' },
  Hz: { min: 0, minExclusive: true, max: 1e9, source: 'physical: a frequency is positive; quadrupole RF is below 1 GHz (common practice)' },
  u: { min: 0, max: 1e5, source: 'class: m/z and widths of the instruments served, below 100 000 u (common practice)' },
  '1': { min: 0, max: 1e9, source: 'physical: a ratio of peak heights is not negative' },
  'm³/s': { min: 0, max: 1, source: 'physical: a flow is not negative; 1 m³/s is far beyond any inlet (common practice)' },
  'm³': { min: 0, minExclusive: true, max: 100, source: 'physical: a volume is positive; 100 m³ is beyond any vacuum chamber served (common practice)' },
  counts: { min: 0, max: 1e18, source: 'physical: counts are not negative' },
  'counts/s': { min: 0, max: 1e12, source: 'physical: a count rate is not negative; 10¹² /s is beyond any pulse-counting detector (common practice)' },
  s: { min: 0, max: 1e9, source: 'physical: an elapsed time is not negative' },
  '°C': { min: -273.15, max: 2000, source: 'physical: not below absolute zero; 2000 °C is beyond any source or heater (common practice)' },
  K: { min: 0, max: 2273.15, source: 'physical: not below absolute zero' },
  eV: { min: 0, max: 1e5, source: 'class: ion energies below 100 keV (common practice)' },
  'Pa·m³/s': { min: 0, max: 1e5, source: 'physical: a leak throughput into vacuum is not negative' },
};

/** Percent shares and percent ratios (RSD, share of baseline, M+1/M): not negative, below 10 000 %. */
const PERCENT: PlausibleRange = { min: 0, max: 1e4, source: 'physical: a share or a relative deviation is not negative; 10 000 % is a typing slip' };

/**
 * The entry spec of a field measured in `unit` (a symbol of the unit table), from the plausible range of its
 * kind of quantity, converted into that unit. `override` (in SI) replaces the class range, e.g. a reading type's own.
 */
export function specForUnit(label: string, unit: string, override?: PlausibleRange): EntrySpec & { source: string } {
  const info = UNITS[unit];
  const range = override ?? (unit === '%' ? undefined : info ? PLAUSIBLE_BY_SI[info.si] : undefined);
  if (unit === '%' && !override) return { label, unit, ...PERCENT, prefixes: false };
  if (!info || !range) return { label, unit, min: -Infinity, max: Infinity, source: 'no range known for this unit', prefixes: false };
  const f = info.factor;
  return {
    label, unit,
    min: range.min / f, max: range.max / f,
    ...(range.minExclusive ? { minExclusive: true } : {}),
    prefixes: prefixesAllowed(unit),
    source: range.source,
  };
}

/**
 * The entry spec of a measured value typed in `unit`: the reading type's own plausible range where the value is
 * recorded as a catalogue type of the same kind of quantity, else the range of its kind of quantity.
 */
export function specForMeasure(
  label: string, unit: string, type?: { baseUnit: string; plausible: { min: number; max: number; source?: string } },
): EntrySpec & { source: string } {
  const u = UNITS[unit];
  if (type && u) {
    // RF and DC types keep volts in a named convention; a ratio type is dimensionless.
    const base = type.baseUnit.startsWith('V (') ? 'V' : type.baseUnit === 'ratio' ? '1' : type.baseUnit;
    const b = UNITS[base];
    if (b && b.si === u.si) {
      const positiveOnly = type.plausible.min > 0;
      return specForUnit(label, unit, {
        min: type.plausible.min * b.factor, max: type.plausible.max * b.factor,
        ...(u.si === 'Pa' && !positiveOnly ? { minExclusive: true } : {}),
        source: type.plausible.source ?? 'the reading type’s range',
      });
    }
  }
  return specForUnit(label, unit);
}

/** A peak height in any one unit (counts/s, A, arbitrary): not negative, and far below 10¹⁵ in any of them. */
export const PEAK_HEIGHT_RANGE: PlausibleRange = {
  min: 0, max: 1e15,
  source: 'physical: a peak height is not negative; 10¹⁵ is beyond any detector output in counts/s, A or arbitrary units (common practice)',
};

/** The entry spec of a peak height in any one unit. */
export function peakHeightSpec(label: string): EntrySpec {
  return { label, unit: '', min: PEAK_HEIGHT_RANGE.min, max: PEAK_HEIGHT_RANGE.max, prefixes: false };
}

// ---- Engine refusals in the engineer's words ---------------------------------------------------------

/** How an engine input is named and shown on screen: its label and the unit it is typed in (per SI unit). */
export interface EngineFieldWords {
  label: string;
  unit: string;
  /** Screen value = SI value × perSi (1e3 for mm from m). */
  perSi?: number;
}

/**
 * The one table from the engine's input names to the words on screen. An engine field name never reaches the
 * screen: a name missing here is shown as "This value".
 */
export const ENGINE_FIELD_WORDS: Readonly<Record<string, EngineFieldWords>> = {
  mz: { label: 'm/z', unit: 'u' },
  setMz: { label: 'Set m/z', unit: 'u' },
  passedMz: { label: 'm/z passed', unit: 'u' },
  mzStart: { label: 'Start m/z', unit: 'u' },
  mzEnd: { label: 'End m/z', unit: 'u' },
  referenceMz: { label: 'Reference m/z', unit: 'u' },
  rf: { label: 'RF amplitude', unit: 'V' },
  maxRf: { label: 'Largest RF of the supply', unit: 'V' },
  dc: { label: 'DC', unit: 'V' },
  value: { label: 'The value', unit: 'V' },
  r0: { label: 'Field radius r0', unit: 'mm', perSi: 1e3 },
  rodLength: { label: 'Rod length', unit: 'mm', perSi: 1e3 },
  frequency: { label: 'RF frequency', unit: 'MHz', perSi: 1e-6 },
  width: { label: 'Peak width', unit: 'u' },
  resolution: { label: 'Resolution', unit: '' },
  ratio: { label: 'U/V ratio', unit: '' },
  pressure: { label: 'Pressure', unit: 'mbar', perSi: 1e-2 },
  indicated: { label: 'Gauge reading', unit: '' },
  axialEnergy: { label: 'Ion axial energy', unit: 'eV' },
  transverseEnergy: { label: 'Transverse energy', unit: 'eV' },
  beamRadius: { label: 'Beam radius at entry', unit: 'mm', perSi: 1e3 },
  temperature: { label: 'Temperature', unit: 'K' },
  q: { label: 'Mathieu q', unit: '' },
  a: { label: 'Mathieu a', unit: '' },
};

/**
 * An engine refusal (field name, value and numeric range) in plain words: the field's label and its limit in
 * the unit on screen, e.g. "Rod length must be more than 0 mm; -5 mm is below that."
 */
export function engineErrorWords(err: { field: string; value: unknown; spec?: { min?: number; max?: number; minExclusive?: boolean; maxExclusive?: boolean; integer?: boolean } }): string {
  const base = err.field.replace(/\[\d+\].*$/, '');
  const w = ENGINE_FIELD_WORDS[base] ?? ENGINE_FIELD_WORDS[err.field];
  const label = w?.label ?? 'This value';
  const k = w?.perSi ?? 1;
  const spec: EntrySpec = {
    label, unit: w?.unit ?? '',
    min: err.spec?.min !== undefined ? err.spec.min * k : -Infinity,
    max: err.spec?.max !== undefined ? err.spec.max * k : Infinity,
    ...(err.spec?.minExclusive ? { minExclusive: true } : {}),
  };
  const v = typeof err.value === 'number' && Number.isFinite(err.value) ? err.value * k : undefined;
  if (!err.spec) return v === undefined ? `${label} is not accepted here.` : `${label} ${withUnit(spec, formatNumber(v))} is not accepted here.`;
  if (v === undefined) return `${label} must be a number ${rangeWords(spec)}.`;
  const low = spec.minExclusive ? v <= spec.min : v < spec.min;
  const high = err.spec?.maxExclusive ? v >= spec.max : v > spec.max;
  const what = withUnit(spec, formatNumber(v));
  if (err.spec?.integer && Number.isInteger(v) === false && !low && !high) return `${label} must be a whole number; ${what} is not.`;
  return `${label} must be ${rangeWords(spec)}; ${what} is ${low ? 'below' : high ? 'above' : 'outside'} that.`;
}

/** Any thrown problem in words for the screen: an engine refusal restated by engineErrorWords, else its message. */
export function errorWords(err: unknown): string {
  if (err instanceof InputRangeError) return engineErrorWords(err);
  return err instanceof Error ? err.message : String(err);
}

// ---- Lists of numbers ------------------------------------------------------------------------------

/** The one rule for lists of numbers, in words for the field hint. */
export const LIST_RULE_WORDS =
  'Separate values with a semicolon or a space. A comma also separates values, except between digits with one or two digits after it: 219,5 is 219.5; 69,219 is two values.';

/**
 * Split a typed list of numbers by the one list rule: semicolons and whitespace always separate; a comma directly
 * between digits with exactly one or two digits after it (up to the next separator) is a decimal comma ("219,5",
 * "219,25"); any other comma separates ("69,219,502", "69, 219"). Returns the items as typed, decimal commas
 * turned into points.
 */
export function splitNumberList(text: string): string[] {
  const marked = text.replace(/(\d),(\d{1,2})(?=$|[\s;,])/g, '$1.$2');
  return marked.split(/[;,\s]+/).map((s) => s.trim()).filter(Boolean);
}
