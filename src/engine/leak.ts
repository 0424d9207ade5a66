/**
 * Leak and gas-load tools: pure computations in SI units (Pa, m³, s, Pa·m³/s).
 *
 * - Peak-ratio indication from residual-gas peaks (m/z 4, 17, 18, 28, 32, 40, 44).
 * - Rate-of-rise: throughput Q = V·Δp/Δt and a linear-versus-levelling judgement.
 * - Outgassing or leak: least-squares fit of p(t) = A/t + B to a pump-down series.
 * - Gas load from a flow at reference conditions and expected pressure p = Q/S_eff (the ion-gauge gas
 *   correction is in ionGauge.ts).
 *
 * No DOM, no storage, nothing of ours imported: this file belongs to the engine.
 */

import { ION_GAUGE_SENSITIVITY } from './ionGauge';
import { leastSquares } from './linearFit';
import { checkNumber, InputRangeError } from './validate';

// Input checks through the engine's validation helper: messages name the field, the value and the range.
const positive = (field: string, value: unknown, unit: string): number =>
  checkNumber(field, value, { min: 0, minExclusive: true, unit: unit || undefined });
const nonNegative = (field: string, value: unknown, unit: string): number => checkNumber(field, value, { min: 0, unit: unit || undefined });

// ---------------------------------------------------------------------------
// Reference composition and gauge sensitivities.

/** Dry air by volume (CRC Handbook, composition of dry air; U.S. Standard Atmosphere, 1976). */
export const DRY_AIR_PERCENT = { nitrogen: 78.084, oxygen: 20.946, argon: 0.934 } as const;
export const DRY_AIR_SOURCE = 'CRC Handbook of Chemistry and Physics, composition of dry air; U.S. Standard Atmosphere, 1976';

/** Ratio of two composition percentages, e.g. N2/O2 of dry air = 78.084 / 20.946 = 3.728. */
export function airRatio(numeratorPercent: number, denominatorPercent: number): number {
  const n = checkNumber('numeratorPercent', numeratorPercent, { min: 0, minExclusive: true, max: 100, unit: '%' });
  const d = checkNumber('denominatorPercent', denominatorPercent, { min: 0, minExclusive: true, max: 100, unit: '%' });
  return n / d;
}

// ---------------------------------------------------------------------------
// (1) Peak ratios.

export interface PeakHeights {
  /** Heights in any one consistent unit (A, counts/s, arbitrary): only ratios are used. */
  m4?: number;
  m17?: number;
  m18?: number;
  m28: number;
  m32: number;
  m40?: number;
  m44?: number;
}

export type LeakIndication =
  | 'air-leak'
  | 'water-after-venting'
  | 'carbon-dioxide'
  | 'outgassing-or-co'
  | 'not-air'
  | 'helium-tracer';

export interface RatioUsed {
  /** e.g. '28:32' */
  name: string;
  /** Measured ratio, or null when the denominator peak is zero. */
  measured: number | null;
  /** Band the ratio is compared with. */
  low: number;
  high: number;
  /** Whether the measured ratio lies in the band (false when it cannot be formed). */
  inBand: boolean;
  /** Where the band comes from, with its class (published / computed / common practice / from memory). */
  source: string;
}

export interface LeakIndicationResult {
  indication: LeakIndication;
  /** Largest of the peaks given. */
  dominantMz: number;
  ratios: RatioUsed[];
  /** Plain sentences explaining the call. */
  reasons: string[];
}

/** Expected composition ratios of dry air (computed from DRY_AIR_PERCENT). */
export function airCompositionRatios(): { nitrogenToOxygen: number; argonToNitrogen: number } {
  return {
    nitrogenToOxygen: airRatio(DRY_AIR_PERCENT.nitrogen, DRY_AIR_PERCENT.oxygen),
    argonToNitrogen: airRatio(DRY_AIR_PERCENT.argon, DRY_AIR_PERCENT.nitrogen),
  };
}

/**
 * Air ratios weighted by relative ionisation, with the ion-gauge sensitivities as the proxy
 * (composition × S_rel): 28:32 ≈ 3.88 and 40:28 ≈ 1.7 %.
 */
export function airSignalRatios(): { m28ToM32: number; m40ToM28: number } {
  const s = ION_GAUGE_SENSITIVITY;
  const c = airCompositionRatios();
  return { m28ToM32: (c.nitrogenToOxygen * s.N2) / s.O2, m40ToM28: (c.argonToNitrogen * s.Ar) / s.N2 };
}

/** Bands used by the indication. Exported so a screen can show them beside the result. */
export const LEAK_BANDS = {
  /** Air leak: 28:32 about 3.7–4 (common practice). */
  airCore: { low: 3.7, high: 4.0, source: 'common practice (no source): air leak shows 28:32 ≈ 3.7–4' },
  /** Still air-like before ruling air out (from memory); a hot filament eats O2 and raises 28:32. */
  airWide: { low: 3.0, high: 5.0, source: 'from memory: treat 28:32 of about 3–5 as air-like' },
  /** Water: 17 is 20–26 % of 18 (from memory). */
  water: { low: 0.2, high: 0.26, source: 'from memory: m/z 17 is about 20–26 % of m/z 18 for water' },
  /**
   * Argon 40:28 in air: composition Ar/N2 = 0.0120 (CRC / USSA 1976), about 1.7 % with the Ar ion-gauge
   * sensitivity; accept 0.5–3 % because the mass filter's own transmission and the multiplier differ (common practice).
   */
  argon: {
    low: 0.005,
    high: 0.03,
    source:
      'computed from CRC dry-air composition (Ar/N2 = 0.0120) and CRC Bayard–Alpert sensitivity (Ar 1.4): about 1.7 %; band 0.5–3 % common practice',
  },
  /** Helium tracer seen when m/z 4 rises at least twofold over its value before spraying (common practice). */
  heliumRise: { low: 2, high: Number.POSITIVE_INFINITY, source: 'common practice: a tracer response at least doubles the m/z 4 background' },
} as const;

function ratio(n: number | undefined, d: number | undefined): number | null {
  if (n === undefined || d === undefined || d === 0) return null;
  return n / d;
}

function band(name: string, measured: number | null, b: { low: number; high: number; source: string }): RatioUsed {
  return { name, measured, low: b.low, high: b.high, inBand: measured !== null && measured >= b.low && measured <= b.high, source: b.source };
}

/**
 * Reads a residual-gas spectrum for a leak signature (dry air N2 78.084 %, O2 20.946 %, Ar 0.934 %: CRC Handbook of Chemistry and Physics, composition of dry air; U.S. Standard Atmosphere 1976).
 * @param peaks heights at m/z 18, 28, 32, 40, 44 (17 and 4 optional), in one consistent unit
 * @param heliumBackground optional m/z 4 height before spraying helium at a joint (tracer test)
 */
export function leakIndication(peaks: PeakHeights, heliumBackground?: number): LeakIndicationResult {
  const m28 = nonNegative('m28 (height at m/z 28)', peaks.m28, '');
  const m32 = nonNegative('m32 (height at m/z 32)', peaks.m32, '');
  const opt = (field: string, v: number | undefined) => (v === undefined ? undefined : nonNegative(field, v, ''));
  const m4 = opt('m4 (height at m/z 4)', peaks.m4);
  const m17 = opt('m17 (height at m/z 17)', peaks.m17);
  const m18 = opt('m18 (height at m/z 18)', peaks.m18);
  const m40 = opt('m40 (height at m/z 40)', peaks.m40);
  const m44 = opt('m44 (height at m/z 44)', peaks.m44);
  const bgHe = heliumBackground === undefined ? undefined : nonNegative('heliumBackground (m/z 4 before spraying)', heliumBackground, '');

  const all: Array<[number, number | undefined]> = [[18, m18], [28, m28], [32, m32], [40, m40], [44, m44]];
  let dominantMz = 28;
  let top = -1;
  for (const [mz, h] of all) if (h !== undefined && h > top) { top = h; dominantMz = mz; }
  if (!(top > 0)) throw new InputRangeError('peaks', top, 'at least one of m/z 18, 28, 32, 40, 44 greater than 0');

  const r2832 = ratio(m28, m32);
  const ratios: RatioUsed[] = [
    band('28:32', r2832, LEAK_BANDS.airCore),
  ];
  const wide = band('28:32 (air-like, wide)', r2832, LEAK_BANDS.airWide);
  ratios.push(wide);
  const r4028 = ratio(m40, m28);
  if (m40 !== undefined) ratios.push(band('40:28', r4028, LEAK_BANDS.argon));
  if (m17 !== undefined && m18 !== undefined) ratios.push(band('17:18', ratio(m17, m18), LEAK_BANDS.water));
  const reasons: string[] = [];

  // Helium tracer first: a tracer test asks one question, "did m/z 4 respond?".
  if (m4 !== undefined && bgHe !== undefined) {
    const rise = bgHe === 0 ? (m4 > 0 ? Number.POSITIVE_INFINITY : null) : m4 / bgHe;
    const used = band('4 (now) : 4 (before)', rise, LEAK_BANDS.heliumRise);
    ratios.push(used);
    if (used.inBand) {
      reasons.push('m/z 4 rose at least twofold after spraying helium: the joint under test leaks.');
      return { indication: 'helium-tracer', dominantMz, ratios, reasons };
    }
    reasons.push('m/z 4 did not rise twofold after spraying helium: no tracer response at this joint.');
  }

  if (dominantMz === 18) {
    reasons.push('m/z 18 is the largest peak: water dominates.');
    const w = ratios.find((r) => r.name === '17:18');
    if (w && !w.inBand) reasons.push('17:18 lies outside the water band; check for another species at m/z 18 or 17.');
    reasons.push('Normal for one to three days after venting; if there was no recent vent, suspect moisture in the carrier or a small leak.');
    return { indication: 'water-after-venting', dominantMz, ratios, reasons };
  }
  if (dominantMz === 44 || (m44 !== undefined && m44 >= 0.5 * m28)) {
    reasons.push('m/z 44 is large compared with m/z 28: carbon dioxide, whose fragment adds to m/z 28.');
    return { indication: 'carbon-dioxide', dominantMz, ratios, reasons };
  }
  if (dominantMz === 28) {
    if (r2832 === null || r2832 > LEAK_BANDS.airWide.high) {
      reasons.push('m/z 28 with little or no m/z 32: not air; mostly CO (hot filament, outgassing after a bake) or N2 from a nitrogen source.');
      return { indication: 'outgassing-or-co', dominantMz, ratios, reasons };
    }
    if (r2832 < LEAK_BANDS.airWide.low) {
      reasons.push('28:32 is below about 3: too much m/z 32 for air; look for an oxygen source or methanol (strong m/z 31).');
      return { indication: 'not-air', dominantMz, ratios, reasons };
    }
    const argon = ratios.find((r) => r.name === '40:28');
    if (argon && !argon.inBand) {
      reasons.push('28:32 is air-like but 40:28 is not: argon from a tracer or another gas is mixed in; re-check before calling it air.');
      return { indication: 'not-air', dominantMz, ratios, reasons };
    }
    reasons.push(
      ratios[0].inBand
        ? '28:32 lies in the air band (3.7–4): air leak.'
        : '28:32 lies in the wide air-like band (3–5): treat as an air leak until shown otherwise (a hot filament consumes O2 and raises 28:32).',
    );
    return { indication: 'air-leak', dominantMz, ratios, reasons };
  }
  reasons.push(`m/z ${dominantMz} is the largest peak, which air does not give: not an air leak.`);
  return { indication: 'not-air', dominantMz, ratios, reasons };
}

// ---------------------------------------------------------------------------
// (2) Rate of rise.

export interface PressureSample {
  /** time, s */
  t: number;
  /** pressure, Pa */
  p: number;
}

export type RiseShape = 'linear' | 'levelling' | 'unclear';

export interface RateOfRiseResult {
  /** Throughput Q = V·Δp/Δt over the whole series, Pa·m³/s (O'Hanlon 2003). */
  throughput: number;
  /** Δp/Δt over the whole series, Pa/s. */
  riseRate: number;
  /** Late-half slope divided by early-half slope (null with fewer than 4 samples). */
  slopeRatio: number | null;
  shape: RiseShape;
  reason: string;
}

/** Least-squares slope, intercept and r² of y on x (times are checked to increase, so x always varies). */
function linearFit(xs: number[], ys: number[]): { slope: number; intercept: number; rSquared: number } {
  const fit = leastSquares(xs, ys)!;
  return { slope: fit.slope, intercept: fit.intercept, rSquared: fit.r2 };
}

function checkSeries(field: string, samples: PressureSample[], minCount: number, strictlyPositiveTime: boolean): PressureSample[] {
  if (!Array.isArray(samples) || samples.length < minCount) {
    throw new InputRangeError(`${field}.length`, Array.isArray(samples) ? samples.length : undefined, `at least ${minCount} samples`);
  }
  const out = samples.map((s, i) => ({
    t: strictlyPositiveTime ? positive(`${field}[${i}].t`, s?.t, 's') : nonNegative(`${field}[${i}].t`, s?.t, 's'),
    p: nonNegative(`${field}[${i}].p`, s?.p, 'Pa'),
  }));
  for (let i = 1; i < out.length; i++) {
    if (!(out[i].t > out[i - 1].t)) throw new InputRangeError(`${field}[${i}].t`, out[i].t, `later than ${field}[${i - 1}].t = ${out[i - 1].t} s (times must increase)`);
  }
  return out;
}

/**
 * Pressure-rise test on an isolated volume: Q = V·Δp/Δt (J. F. O'Hanlon, A User's Guide to Vacuum
 * Technology, 3rd ed., Wiley 2003). A rise that stays linear points to a real leak; one that curves over
 * and levels off points to outgassing or a virtual leak.
 *
 * Shape rule (ours): compare the slope of the late half with that of the early half. At least 0.8 → linear;
 * at most 0.5 → levelling; in between → unclear (take more points). With 2–3 samples the shape is unclear.
 * @param volume isolated volume, m³
 * @param samples pressure against time (s, Pa), times increasing
 */
export function rateOfRise(volume: number, samples: PressureSample[]): RateOfRiseResult {
  const v = positive('volume', volume, 'm³');
  const s = checkSeries('samples', samples, 2, false);
  const first = s[0], last = s[s.length - 1];
  const riseRate = (last.p - first.p) / (last.t - first.t);
  const throughput = v * riseRate;
  if (s.length < 4) {
    return { throughput, riseRate, slopeRatio: null, shape: 'unclear', reason: 'Fewer than four readings: the shape of the rise cannot be judged; take more.' };
  }
  const mid = Math.floor(s.length / 2);
  const early = s.slice(0, mid + 1), late = s.slice(mid);
  const se = linearFit(early.map((x) => x.t), early.map((x) => x.p)).slope;
  const sl = linearFit(late.map((x) => x.t), late.map((x) => x.p)).slope;
  if (!(se > 0)) {
    return { throughput, riseRate, slopeRatio: null, shape: 'unclear', reason: 'The pressure did not rise in the first half of the test: check the isolation valve and the gauge.' };
  }
  const slopeRatio = sl / se;
  if (slopeRatio >= 0.8) return { throughput, riseRate, slopeRatio, shape: 'linear', reason: 'The rise stays linear: points to a real leak.' };
  if (slopeRatio <= 0.5) return { throughput, riseRate, slopeRatio, shape: 'levelling', reason: 'The rise curves over and levels off: points to outgassing or a virtual leak.' };
  return { throughput, riseRate, slopeRatio, shape: 'unclear', reason: 'The rise slows somewhat: a leak and outgassing may both be present; extend the test.' };
}

// ---------------------------------------------------------------------------
// (3) Outgassing or leak.

export interface OutgassingFit {
  /** Coefficient of the 1/t term, Pa·s. */
  A: number;
  /** Constant floor, Pa: the leak (or permeation) estimate. */
  B: number;
  /** Coefficient of determination of the fit in 1/t. */
  rSquared: number;
  /** Root-mean-square residual, Pa. */
  residualRms: number;
  /** Share of the fitted pressure at the last sample that the floor B explains (0–1, clamped). */
  floorShareAtEnd: number;
  judgement: 'outgassing' | 'leak-floor' | 'mixed' | 'poor-fit';
  reason: string;
}

/**
 * Least-squares fit of p(t) = A/t + B to a pump-down series, done in closed form as a straight line
 * in x = 1/t. Water outgassing from unbaked surfaces falls roughly as 1/t; a leak gives a constant floor
 * (O'Hanlon 2003). B estimates the floor.
 *
 * Judgement (ours): R² below 0.9 → poor fit; floor share at the last sample above 0.5 → leak floor;
 * below 0.2 (or B ≤ 0) → outgassing; in between → mixed.
 * @param samples time since pump-down started (s, > 0) and pressure (Pa); at least 3, times increasing
 */
export function fitOutgassing(samples: PressureSample[]): OutgassingFit {
  const s = checkSeries('samples', samples, 3, true);
  const xs = s.map((x) => 1 / x.t), ys = s.map((x) => x.p);
  const { slope: A, intercept: B, rSquared } = linearFit(xs, ys);
  let ss = 0;
  for (let i = 0; i < s.length; i++) { const r = ys[i] - (A * xs[i] + B); ss += r * r; }
  const residualRms = Math.sqrt(ss / s.length);
  const tLast = s[s.length - 1].t;
  const pFitEnd = A / tLast + B;
  const floorShareAtEnd = pFitEnd > 0 ? Math.min(1, Math.max(0, B / pFitEnd)) : 0;
  if (rSquared < 0.9) {
    return { A, B, rSquared, residualRms, floorShareAtEnd, judgement: 'poor-fit', reason: 'The series does not follow A/t + B well: look for bursts, gauge changes or a pump fault.' };
  }
  if (B <= 0 || floorShareAtEnd < 0.2) {
    return { A, B, rSquared, residualRms, floorShareAtEnd, judgement: 'outgassing', reason: 'The pressure is still falling as 1/t with little floor: outgassing; keep pumping or bake.' };
  }
  if (floorShareAtEnd > 0.5) {
    return { A, B, rSquared, residualRms, floorShareAtEnd, judgement: 'leak-floor', reason: 'A constant floor explains most of the pressure now: a leak or permeation; find it with a rate-of-rise test and a tracer gas.' };
  }
  return { A, B, rSquared, residualRms, floorShareAtEnd, judgement: 'mixed', reason: 'Outgassing and a floor both matter: keep pumping and repeat the fit later.' };
}

// ---------------------------------------------------------------------------
// Gas load and expected pressure.

/** Standard atmosphere, Pa (ISO 2533:1975). The usual reference pressure of "standard" flows. */
export const STANDARD_PRESSURE = 101_325;

/**
 * pV throughput of a flow given at reference conditions: Q = p_ref · V̇_ref.
 * 1 mL/min at 101.325 kPa → 1.68875×10⁻³ Pa·m³/s = 0.0168875 mbar·L/s (common practice reference conditions; computed from SI units).
 * @param standardFlow volume flow at the reference conditions, m³/s
 * @param referencePressure reference pressure of that flow, Pa (default 101 325 Pa)
 */
export function gasLoad(standardFlow: number, referencePressure: number = STANDARD_PRESSURE): number {
  const f = nonNegative('standardFlow', standardFlow, 'm³/s');
  const p = positive('referencePressure', referencePressure, 'Pa');
  return f * p;
}

/**
 * Expected steady pressure p = Q / S_eff with 1/S_eff = 1/S + 1/C (O'Hanlon 2003).
 * @param throughput gas load, Pa·m³/s
 * @param pumpingSpeed pump speed for that gas, m³/s
 * @param conductance conductance between pump and gauge, m³/s (omit for none)
 */
export function expectedPressure(throughput: number, pumpingSpeed: number, conductance?: number): number {
  const q = nonNegative('throughput', throughput, 'Pa·m³/s');
  const s = positive('pumpingSpeed', pumpingSpeed, 'm³/s');
  const sEff = conductance === undefined ? s : 1 / (1 / s + 1 / positive('conductance', conductance, 'm³/s'));
  return q / sEff;
}
