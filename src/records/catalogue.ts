// The readings catalogue: what an engineer records on a service visit, in which units, what counts as
// plausible input, where the expected value comes from and how far a reading may stray from it.
// Pure data plus small helpers. Ranges marked [cp] are common practice, [mem] from memory (unverified);
// a maker's own limit for an instrument always wins over these generic defaults.
import type { InstrumentKind } from './types';
import {
  currentUnits, dcUnits, frequencyUnits, massUnits, percentUnits, pressureUnits, ratioUnits, rfAmplitudeUnits,
  temperatureUnits, voltageUnits, type UnitDef,
} from './units';

/**
 * How far a reading may stray from a single expected value.
 * - relative: |x − e| / |e|, as fractions (0.02 = 2 %)
 * - absolute: |x − e| in base units
 * - factor: max(x/e, e/x), for quantities that span decades (pressures)
 */
export interface ToleranceRule {
  kind: 'relative' | 'absolute' | 'factor';
  pass: number;
  borderline: number;
}

/** Which way of straying is bad: both ways, only too high (a pressure), or only too low (a sensitivity). */
export type BadSide = 'both' | 'high' | 'low';

/** A generic plausible operating range, used only when nothing better (baseline, calculation, set point) exists. */
export interface GenericRange {
  /** Instrument kinds it applies to; absent means all. */
  kinds?: InstrumentKind[];
  low?: number;
  high?: number;
  /** Where the numbers come from, with their class. */
  source: string;
  /** Context the range assumes (e.g. an N2-equivalent gauge reading); it does not apply otherwise. */
  when?: Readonly<Record<string, string>>;
}

export interface ContextField {
  key: string;
  label: string;
  kind: 'number' | 'choice' | 'text';
  unit?: string;
  min?: number;
  max?: number;
  choices?: readonly { value: string; label: string }[];
  required?: boolean;
  defaultValue?: string | number;
  help?: string;
}

/** How a type's expected value is calculated when the instrument has no baseline for it. */
export type ComputedExpectation = 'rf-amplitude' | 'dc-amplitude' | 'rf-frequency' | 'setpoint' | 'air-signature' | 'isotope-formula';

export interface ReadingType {
  id: string;
  label: string;
  group: 'vacuum' | 'source' | 'analyser' | 'detector' | 'performance' | 'leak-check' | 'own' | 'earlier';
  baseUnit: string;
  units: readonly UnitDef[];
  defaultUnit: string;
  /**
   * Input sanity limits in base units: outside these the value is refused where it is typed, as a slip.
   * `source` says where the limits come from, or their class (physical limit, instrument class).
   */
  plausible: { min: number; max: number; source?: string };
  badSide: BadSide;
  /** Allowed deviation from the instrument's baseline. */
  baselineTolerance: ToleranceRule;
  computed?: ComputedExpectation;
  /** Allowed deviation from the computed expectation. */
  computedTolerance?: ToleranceRule;
  /** Where the computed expectation and its tolerance come from. */
  computedSource?: string;
  generic?: readonly GenericRange[];
  /** How far outside a generic range is still borderline, as a fraction of the crossed bound. */
  genericMargin?: ToleranceRule;
  context: readonly ContextField[];
  /** Context keys that must match for two readings to be compared (baseline, trend). */
  matchContext: readonly string[];
  trendScale: 'linear' | 'log';
  help: string;
  /** Added by the user on this device. */
  own?: boolean;
  /** A maker's or engineer's limit entered for the instrument replaces the usual check (not just the generic range). */
  limitWins?: boolean;
}

const gaugeGasWords = {
  'N2-equivalent': 'N2-equivalent (as the gauge shows)',
  He: 'corrected for helium',
  H2: 'corrected for hydrogen',
  Ar: 'corrected for argon',
  other: 'corrected for another gas (say which in the note)',
} as const;

/** How a gauge reading was taken: the gauge's own N2 scale, or corrected for a gas. */
export const gaugeGasChoices: readonly { value: keyof typeof gaugeGasWords; label: string }[] =
  (Object.keys(gaugeGasWords) as (keyof typeof gaugeGasWords)[]).map((value) => ({ value, label: gaugeGasWords[value] }));

const gaugeGas: ContextField = {
  key: 'gaugeGas', label: 'Gauge reading', kind: 'choice', choices: gaugeGasChoices, required: true,
  defaultValue: 'N2-equivalent',
  help: 'Ion and Pirani gauges read in N2-equivalent unless corrected; helium reads about 5.6 times low on an ion gauge.',
};

const parkedMz: ContextField = {
  key: 'mz', label: 'Parked m/z', kind: 'number', unit: 'u', min: 1, max: 5000, required: true,
  help: 'The m/z the analyser was parked at while the voltage was read.',
};

const ionMz = (label: string): ContextField => ({
  key: 'mz', label, kind: 'number', unit: 'u', min: 1, max: 5000, required: true,
});

const setpoint = (unit: string, min: number, max: number): ContextField => ({
  key: 'setpoint', label: 'Set value', kind: 'number', unit, min, max,
  help: 'The value the instrument was set to, in the same unit as the reading; the reading is judged against it.',
});

/** Tolerance rules in one call each: relative (fractions), absolute (base units), or a factor either way. */
const rel = (pass: number, borderline: number): ToleranceRule => ({ kind: 'relative', pass, borderline });
const abs = (pass: number, borderline: number): ToleranceRule => ({ kind: 'absolute', pass, borderline });
const times = (pass: number, borderline: number): ToleranceRule => ({ kind: 'factor', pass, borderline });

/** A calculated expectation with its tolerance and its source, as one spread. */
const against = (computed: ComputedExpectation, computedTolerance: ToleranceRule, computedSource: string) =>
  ({ computed, computedTolerance, computedSource });

const gcKinds: InstrumentKind[] = ['gc-ms-single', 'gc-ms-triple'];
const lcKinds: InstrumentKind[] = ['lc-ms-single', 'lc-ms-triple'];

/** An earlier-design background peak as a percentage of a reference ion: read and shown, judged against the baseline only. */
function earlierLeakPeak(mz: number, gas: string, help: string): ReadingType {
  return {
    id: `leak-${gas}-${mz}`, label: `Earlier design: ${gas}, m/z ${mz} as % of a reference ion`, group: 'earlier', baseUnit: '%', units: percentUnits,
    defaultUnit: 'percent', plausible: { min: 0, max: 10000, source: 'physical: an intensity share is not negative; 100 times the reference ion is a typing slip' }, badSide: 'high',
    baselineTolerance: times(1.5, 3),
    context: [{ key: 'referenceMz', label: 'Relative to m/z', kind: 'number', unit: 'u', min: 1, max: 5000, required: true }],
    matchContext: ['referenceMz'], trendScale: 'log',
    help,
  };
}

/** An earlier-design background ratio with no context: read, shown and trended against the baseline only. */
function earlierRatio(id: string, label: string, baseUnit: string, units: readonly UnitDef[], help: string): ReadingType {
  return {
    id, label, group: 'earlier', baseUnit, units, defaultUnit: units[0].id, badSide: 'both',
    plausible: { min: 0, max: 10000, source: 'physical: a ratio of peak heights is not negative' },
    baselineTolerance: rel(0.25, 0.5), context: [], matchContext: [], trendScale: 'linear', help,
  };
}

export const catalogue: readonly ReadingType[] = [
  {
    id: 'vacuum-high', label: 'High vacuum (analyser)', group: 'vacuum', baseUnit: 'Pa', units: pressureUnits,
    defaultUnit: 'mbar', plausible: { min: 1e-10, max: 1.2e5, source: 'class: ion gauges read down to about 1e-10 Pa (extreme high vacuum, ISO 3529-1:2019 ranges); at most a little above one standard atmosphere, 101 325 Pa (ISO 2533:1975)' }, badSide: 'high',
    // A doubling of analyser pressure at the same gas load is worth a look; ×3 points to a leak or pump fault [cp].
    baselineTolerance: times(1.5, 3),
    generic: [
      { kinds: gcKinds, low: 5e-6 * (101325 / 760), high: 5e-5 * (101325 / 760),
        source: 'EI GC-MS with about 1 mL/min helium, N2-equivalent: 5e-6 to 5e-5 Torr (common practice)', when: { gaugeGas: 'N2-equivalent' } },
      { kinds: ['rga'], high: 1e-2, source: 'RGA operation: below 1e-4 mbar (common practice)', when: { gaugeGas: 'N2-equivalent' } },
    ],
    genericMargin: times(1, 2),
    context: [gaugeGas], matchContext: ['gaugeGas'], trendScale: 'log',
    help: 'Ion-gauge read-back at the analyser. State whether it is the N2-equivalent indication.',
  },
  {
    id: 'vacuum-fore', label: 'Fore-vacuum', group: 'vacuum', baseUnit: 'Pa', units: pressureUnits,
    defaultUnit: 'mbar', plausible: { min: 1e-6, max: 1.2e5, source: 'class: Pirani and capacitance gauges read down to about 1e-6 Pa at best (common practice); at most a little above one standard atmosphere (ISO 2533:1975)' }, badSide: 'high',
    baselineTolerance: times(1.5, 3),
    generic: [
      { kinds: [...gcKinds, 'rga'], low: 1e-2 * 100, high: 1e-1 * 100, source: 'GC-MS fore-vacuum about 1e-2 to 1e-1 mbar (from memory)', when: { gaugeGas: 'N2-equivalent' } },
      { kinds: lcKinds, low: 1 * 100, high: 10 * 100, source: 'API first stage about 1 to 10 mbar (from memory)', when: { gaugeGas: 'N2-equivalent' } },
    ],
    genericMargin: times(1, 3),
    context: [gaugeGas], matchContext: ['gaugeGas'], trendScale: 'log',
    help: 'Pirani or thermocouple gauge between the turbo and the rough pump.',
  },
  {
    id: 'rf-amplitude', label: 'RF amplitude at a parked m/z', group: 'analyser', baseUnit: 'V (zero-to-peak, one rod to ground)',
    units: rfAmplitudeUnits, defaultUnit: 'V0p-rod', plausible: { min: 0, max: 20000, source: 'class: quadrupole RF supplies give at most a few kV zero-to-peak per rod; 20 kV covers every convention (common practice)' }, badSide: 'both',
    // Proportionality V ∝ m/z should hold within about ±1 % (V ∝ m/z at fixed f and r0: Dawson, Quadrupole Mass Spectrometry and Its Applications, 1976; the ±1 % is common practice).
    baselineTolerance: rel(0.01, 0.02),
    // The instrument's operating point sits a little below the apex q and its r0 and f are nominal: 3 % and 6 %
    // allow for that (common practice) while still catching a factor-of-2 convention slip.
    ...against('rf-amplitude', rel(0.03, 0.06), 'calculated from the profile’s r0 and f at the apex q = 0.706 (Mathieu stability, Dawson 1976)'),
    context: [parkedMz], matchContext: ['mz'], trendScale: 'linear',
    help: 'Read at the RF monitor point or with a rated low-capacitance probe. Say which convention the figure uses.',
  },
  {
    id: 'dc-amplitude', label: 'DC at a parked m/z', group: 'analyser', baseUnit: 'V (one rod pair to ground)',
    units: dcUnits, defaultUnit: 'V-rod', plausible: { min: -5000, max: 5000, source: 'class: quadrupole DC at most about 0.17 of the RF, below ±5 kV (Dawson 1976 apex a/q; common practice)' }, badSide: 'both',
    baselineTolerance: rel(0.01, 0.02),
    // At unit resolution U sits just below the apex value 0.16784·V (resolution offset), about 1–5 % [cp].
    ...against('dc-amplitude', rel(0.05, 0.1), 'apex DC, U = 0.16784·V (Dawson 1976), less a resolution offset of a few per cent'),
    context: [parkedMz], matchContext: ['mz'], trendScale: 'linear',
    help: 'Read back from the instrument; never put a meter on the rods while RF is on.',
  },
  {
    id: 'rf-frequency', label: 'RF frequency', group: 'analyser', baseUnit: 'Hz', units: frequencyUnits,
    defaultUnit: 'MHz', plausible: { min: 1e4, max: 5e7, source: 'class: quadrupole RF from tens of kHz (large RGAs) to a few tens of MHz (common practice)' }, badSide: 'both',
    // δm/m ≈ 2·δf/f (from q = 4eV/(m r0²Ω²), Dawson, Quadrupole Mass Spectrometry and Its Applications, 1976): 0.02 % of f is 0.2 u at m/z 500, the edge of ±0.1–0.2 u mass accuracy.
    baselineTolerance: rel(0.0001, 0.0002),
    ...against('rf-frequency', rel(0.005, 0.02), 'nominal frequency in the instrument profile (profile values are nominal: ±0.5 % common practice)'),
    context: [], matchContext: [], trendScale: 'linear',
    help: 'Counter or oscilloscope through a loosely coupled pickup loop: a probe on the tank detunes it.',
  },
  {
    id: 'multiplier-voltage', label: 'Multiplier voltage (as set for the wanted gain)', group: 'detector', baseUnit: 'V', units: voltageUnits,
    defaultUnit: 'V', plausible: { min: 0, max: 6000, source: 'class: multiplier supplies below 6 kV (common practice)' }, badSide: 'high',
    // The voltage climbs as the multiplier ages (common practice); +10 % over the baseline is worth planning for [cp].
    baselineTolerance: rel(0.1, 0.2),
    generic: [{ low: 1000, high: 3000, source: 'discrete-dynode multipliers 1000 to 3000 V (common practice)' }],
    genericMargin: rel(0, 0.1),
    context: [], matchContext: [], trendScale: 'linear',
    help: 'The voltage the instrument set at its latest gain adjustment (from the calibration report or the read-back). Enter its magnitude.',
  },
  {
    id: 'emission-current', label: 'Emission current', group: 'source', baseUnit: 'A', units: currentUnits,
    defaultUnit: 'uA', plausible: { min: 0, max: 0.02, source: 'class: EI and RGA emission below 20 mA (common practice)' }, badSide: 'low',
    baselineTolerance: rel(0.05, 0.2),
    // Signal scales with emission, I⁺ = K·I_e·p (CRC Handbook of Chemistry and Physics, Bayard–Alpert gauge relation): a 20 % shortfall is 20 % less signal.
    ...against('setpoint', rel(0.05, 0.2), 'the set value (signal scales with emission current)'),
    generic: [
      { kinds: [...gcKinds, ...lcKinds], low: 10e-6, high: 500e-6, source: 'EI sources: tens to a few hundred µA (common practice)' },
      { kinds: ['rga'], low: 0.1e-3, high: 2e-3, source: 'RGA: 0.1 to 2 mA (from memory)' },
    ],
    genericMargin: rel(0, 0.2),
    context: [setpoint('A', 0, 0.02)], matchContext: [], trendScale: 'linear',
    help: 'Actual emission read back with the filament on.',
  },
  {
    id: 'source-temperature', label: 'Ion source temperature', group: 'source', baseUnit: '°C', units: temperatureUnits,
    defaultUnit: 'degC', plausible: { min: -50, max: 800, source: 'class: source heaters from room temperature to a few hundred °C; −50 to 800 °C with margin (common practice)' }, badSide: 'both',
    baselineTolerance: abs(2, 5),
    ...against('setpoint', abs(2, 5), 'the set value; actual within about ±2 °C of set (common practice)'),
    generic: [{ kinds: gcKinds, low: 200, high: 300, source: 'EI source 200 to 300 °C (common practice)' }],
    genericMargin: abs(0, 20),
    context: [setpoint('°C', -50, 800)], matchContext: [], trendScale: 'linear',
    help: 'Actual temperature read back after it has settled.',
  },
  {
    id: 'peak-width', label: 'Peak width (FWHM) at a calibrant ion', group: 'performance', baseUnit: 'u', units: massUnits,
    defaultUnit: 'u', plausible: { min: 0.01, max: 10, source: 'class: quadrupole FWHM from 0.01 u (high resolution) to 10 u (wide open) (common practice)' }, badSide: 'both',
    // Against the instrument's own baseline only: no preset width limit; a maker's or engineer's limit replaces it.
    baselineTolerance: abs(0.05, 0.1),
    limitWins: true,
    context: [ionMz('Calibrant ion m/z')], matchContext: ['mz'], trendScale: 'linear',
    help: 'Full width at half maximum from a profile scan of a calibrant ion you chose for this instrument. Judged against its baseline, or the limit entered for the instrument.',
  },
  // ---- Calibrant check: ions and ratios chosen by the engineer for each instrument (see checks.ts) ----
  {
    id: 'calibrant-ratio', label: 'Calibrant: one ion as % of another', group: 'performance', baseUnit: '%',
    units: percentUnits, defaultUnit: 'percent', plausible: { min: 0, max: 100000, source: 'physical: an intensity share is not negative; a thousand times the reference ion is a typing slip' }, badSide: 'both',
    // Against the baseline within about ±20–30 % relative (common practice); regulated methods set their own windows,
    // entered as the instrument's limit, which then replaces this check.
    baselineTolerance: rel(0.2, 0.3),
    limitWins: true,
    context: [
      { ...ionMz('Ion m/z'), help: 'A calibrant ion you chose for this instrument.' },
      { key: 'referenceMz', label: 'As % of m/z', kind: 'number', unit: 'u', min: 1, max: 5000, required: true, help: 'The ion it is compared with; keep it the same from visit to visit.' },
    ],
    matchContext: ['mz', 'referenceMz'], trendScale: 'linear',
    help: 'Height of one calibrant ion as a percentage of another, both chosen by you for this instrument. Judged against its baseline, or the limit entered for the instrument.',
  },
  {
    id: 'calibrant-isotope', label: 'Calibrant: isotope ratio M+1/M', group: 'performance', baseUnit: '%',
    units: percentUnits, defaultUnit: 'percent', plausible: { min: 0, max: 1000, source: 'physical: M+1/M is not negative; ten times M is a typing slip' }, badSide: 'both',
    baselineTolerance: rel(0.2, 0.3),
    // Measured M+1/M within about ±20 % of the calculated value on a clean, unsaturated peak (common practice).
    ...against('isotope-formula', rel(0.2, 0.3), 'calculated from the ion’s formula with IUPAC isotopic abundances (representative compositions, as tabulated by NIST)'),
    limitWins: true,
    context: [
      { ...ionMz('Ion m/z (M)'), help: 'A calibrant ion you chose for this instrument.' },
      { key: 'formula', label: 'Ion formula', kind: 'text', help: 'Optional, for example C4F9: gives the calculated M+1/M to judge against when there is no baseline.' },
    ],
    matchContext: ['mz'], trendScale: 'linear',
    help: 'Height at M+1 as a percentage of M. A ratio well above the calculated one on a strong ion points to detector saturation.',
  },
  // ---- Background gas: air by the leak tools' peak-ratio method, water against the baseline (see checks.ts) ----
  {
    id: 'air-ratio-28-32', label: 'Background: air check, m/z 28 to 32', group: 'leak-check', baseUnit: 'ratio', units: ratioUnits,
    defaultUnit: 'ratio', plausible: { min: 0, max: 10000, source: 'physical: a ratio of peak heights is not negative' }, badSide: 'both',
    baselineTolerance: rel(0.25, 0.5),
    computed: 'air-signature',
    limitWins: true,
    context: [
      { key: 'argonPercent', label: 'm/z 40 as % of m/z 28', kind: 'number', unit: '%', min: 0, max: 1000,
        help: 'Optional, from the same scan: argon that agrees with air confirms an air leak; argon that does not says another gas is mixed in.' },
    ],
    matchContext: [], trendScale: 'linear',
    help: 'Height at m/z 28 divided by the height at m/z 32, from one background scan. Judged by the peak-ratio method of the leak tools: an air-like ratio means an air leak is likely (dry air N2/O2 = 3.73 by volume, CRC).',
  },
  {
    id: 'water-18', label: 'Background: water, m/z 18 as % of a chosen ion', group: 'leak-check', baseUnit: '%', units: percentUnits,
    defaultUnit: 'percent', plausible: { min: 0, max: 100000, source: 'physical: an intensity share is not negative; a thousand times the reference ion is a typing slip' }, badSide: 'high',
    // No preset limit: water depends on the instrument and its history. Judged against its own baseline; twice the
    // baseline is worth a look and three times points to a leak or wet carrier (common practice).
    baselineTolerance: times(1.5, 3),
    limitWins: true,
    context: [{ key: 'referenceMz', label: 'As % of m/z', kind: 'number', unit: 'u', min: 1, max: 5000, required: true,
      help: 'The ion you compare with (for example a calibrant ion); keep it the same from visit to visit.' }],
    matchContext: ['referenceMz'], trendScale: 'log',
    help: 'Height at m/z 18 as a percentage of an ion you choose. No preset limit: it is judged against this instrument’s baseline and its trend. Water falls for hours to days after a vent.',
  },
  // ---- Earlier design: kept so older readings and backups still read, show and trend; not offered for new readings ----
  {
    id: 'relative-abundance', label: 'Earlier design: relative abundance of a reference ion', group: 'earlier', baseUnit: '%',
    units: percentUnits, defaultUnit: 'percent', plausible: { min: 0, max: 1000, source: 'physical: an abundance is not negative; ten times the reference ion is a typing slip' }, badSide: 'both',
    baselineTolerance: rel(0.2, 0.3),
    context: [
      ionMz('Ion m/z'),
      { key: 'referenceMz', label: 'Relative to m/z', kind: 'number', unit: 'u', min: 1, max: 5000, required: true },
    ],
    matchContext: ['mz', 'referenceMz'], trendScale: 'linear',
    help: 'An ion as a percentage of a reference ion, recorded before the calibrant check was rebuilt. New readings: “Calibrant: one ion as % of another”.',
  },
  {
    id: 'isotope-ratio', label: 'Earlier design: isotope ratio M+1/M of a calibrant ion', group: 'earlier', baseUnit: '%',
    units: percentUnits, defaultUnit: 'percent', plausible: { min: 0, max: 100, source: 'physical: M+1/M of a calibrant ion is not negative and below 100 % for ions below about 90 carbons (IUPAC 13C abundance 1.082 %)' }, badSide: 'both',
    baselineTolerance: rel(0.2, 0.3),
    context: [ionMz('Ion m/z (M)')], matchContext: ['mz'], trendScale: 'linear',
    help: 'Recorded before the calibrant check was rebuilt. New readings: “Calibrant: isotope ratio M+1/M”, which takes the ion’s formula.',
  },
  earlierLeakPeak(18, 'water', 'Recorded before the background check was rebuilt. New readings: “Background: water”.'),
  earlierLeakPeak(28, 'nitrogen', 'Recorded before the background check was rebuilt. New readings: “Background: air check”.'),
  earlierRatio('leak-ratio-28-32', 'Earlier design: ratio m/z 28 to 32', 'ratio', ratioUnits,
    'Recorded before the background check was rebuilt. New readings: “Background: air check, m/z 28 to 32”.'),
  earlierRatio('leak-argon-40', 'Earlier design: argon, m/z 40 relative to 28', '%', percentUnits,
    'Recorded before the background check was rebuilt. New readings give 40:28 with the air check.'),
  {
    id: 'noted-value', label: 'Noted value', group: 'own', baseUnit: 'as noted', units: [{ id: 'as-noted', label: 'as noted', factor: 1 }],
    defaultUnit: 'as-noted', plausible: { min: -1e30, max: 1e30, source: 'none: a noted value is kept as given' }, badSide: 'both',
    baselineTolerance: rel(0, 0),
    context: [
      { key: 'label', label: 'What it is', kind: 'text', required: true },
      { key: 'unit', label: 'Unit', kind: 'text' },
    ],
    matchContext: ['label', 'unit'], trendScale: 'linear',
    help: 'A value noted from a calculator or a screen that has no reading type of its own; kept as given, not judged.',
  },
];

const byId = new Map(catalogue.map((t) => [t.id, t]));

export function catalogueType(id: string): ReadingType | undefined {
  return byId.get(id);
}

export function unitOf(type: ReadingType, unitId: string): UnitDef | undefined {
  return type.units.find((u) => u.id === unitId);
}

/** Other names other parts of the app use for catalogue types. */
export const typeAliases: Readonly<Record<string, string>> = { 'analyser-pressure': 'vacuum-high', 'analyzer-pressure': 'vacuum-high' };

/**
 * Find the unit a value from elsewhere in the app is in: its exact id or label, else (RF and DC) from the
 * short form ("V 0-p", "V p-p", "V rms", "V") and the convention words ("between the pairs"), else a
 * case-insensitive id or label match. Undefined when nothing fits.
 */
export function resolveUnit(type: ReadingType, unitText: string, conventionText = ''): UnitDef | undefined {
  const exact = type.units.find((u) => u.id === unitText || u.label === unitText);
  if (exact) return exact;
  const words = `${unitText} ${conventionText}`.toLowerCase();
  if ((type.id === 'rf-amplitude' || type.id === 'dc-amplitude') && /^\s*v\b/i.test(unitText)) {
    const pairs = /between/.test(words);
    if (type.id === 'dc-amplitude') return unitOf(type, pairs ? 'V-pairs' : 'V-rod');
    const form = /p-p|peak-to-peak/.test(words) ? 'Vpp' : /rms/.test(words) ? 'Vrms' : 'V0p';
    return unitOf(type, `${form}-${pairs ? 'pairs' : 'rod'}`);
  }
  const t = unitText.trim().toLowerCase();
  return type.units.find((u) => u.id.toLowerCase() === t || u.label.toLowerCase() === t);
}
