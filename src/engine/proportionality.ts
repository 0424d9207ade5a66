// Proportionality check that needs no geometry: at fixed f, r0 and scan line through the
// origin, V ∝ m/z, so V(m2) = V(m1)·m2/m1 (P. H. Dawson (ed.), Quadrupole Mass Spectrometry and its
// Applications, 1976 — from memory). From two or three read-backs at parked m/z values: the instrument
// constant k = V/(m/z), each reading's deviation from k·m/z, and (with three or more) a straight-line fit
// whose intercept shows an offset. A deviation beyond about ±1 % deserves a look (common practice).
// Readings may be in any one convention (zero-to-peak, peak-to-peak, rms; per rod or between pairs): the
// check is a ratio, so the factor cancels.
import { checkNumber, InputRangeError } from './validate';

export interface ProportionalityReading {
  /** Parked m/z (u). */
  mz: number;
  /** Read-back RF amplitude (V), every reading in the same convention. */
  rf: number;
}

export interface ProportionalityResult {
  /** Least-squares k through the origin, Σ m·V / Σ m², V per u. */
  constant: number;
  perReading: {
    mz: number;
    rf: number;
    /** This reading's own V/m, V per u. */
    constant: number;
    /** V/(k·m) − 1: fractional deviation from proportionality. */
    deviation: number;
  }[];
  /** Largest |deviation|. */
  maxDeviation: number;
  /** Straight line V = slope·m + intercept by least squares (three or more readings), else null. */
  line: { slope: number; intercept: number; maxResidualFraction: number } | null;
  /** The common-practice tolerance used for the verdict (±1 %). */
  tolerance: number;
  withinTolerance: boolean;
}

/** Tolerance on proportionality: about ±1 % (common practice). */
export const PROPORTIONALITY_TOLERANCE = 0.01;

export function proportionalityCheck(readings: readonly ProportionalityReading[]): ProportionalityResult {
  if (!Array.isArray(readings) || readings.length < 2 || readings.length > 20) {
    throw new InputRangeError('readings', Array.isArray(readings) ? readings.length : readings, 'between 2 and 20 readings');
  }
  const checked = readings.map((r, i) => ({
    mz: checkNumber(`readings[${i}].mz`, r?.mz, { min: 0, minExclusive: true, max: 1e7, unit: 'u' }),
    rf: checkNumber(`readings[${i}].rf`, r?.rf, { min: 0, minExclusive: true, max: 1e7, unit: 'V' }),
  }));
  const distinct = new Set(checked.map((r) => r.mz));
  if (distinct.size < 2) throw new InputRangeError('readings[1].mz', checked[1].mz, 'an m/z different from the first reading');
  let smm = 0;
  let smv = 0;
  for (const r of checked) {
    smm += r.mz * r.mz;
    smv += r.mz * r.rf;
  }
  const constant = smv / smm;
  const perReading = checked.map((r) => ({ ...r, constant: r.rf / r.mz, deviation: r.rf / (constant * r.mz) - 1 }));
  const maxDeviation = Math.max(...perReading.map((r) => Math.abs(r.deviation)));
  let line: ProportionalityResult['line'] = null;
  if (checked.length >= 3 && distinct.size >= 2) {
    const n = checked.length;
    const meanM = checked.reduce((s, r) => s + r.mz, 0) / n;
    const meanV = checked.reduce((s, r) => s + r.rf, 0) / n;
    let sxx = 0;
    let sxy = 0;
    for (const r of checked) {
      sxx += (r.mz - meanM) ** 2;
      sxy += (r.mz - meanM) * (r.rf - meanV);
    }
    const slope = sxy / sxx;
    const intercept = meanV - slope * meanM;
    const maxResidualFraction = Math.max(...checked.map((r) => Math.abs(r.rf - (slope * r.mz + intercept)) / r.rf));
    line = { slope, intercept, maxResidualFraction };
  }
  return {
    constant,
    perReading,
    maxDeviation,
    line,
    tolerance: PROPORTIONALITY_TOLERANCE,
    withinTolerance: maxDeviation <= PROPORTIONALITY_TOLERANCE,
  };
}

/** Mass error of a passed m/z against the set m/z: in u and in ppm (10⁶·Δm/m_set). */
export function massError(p: { setMz: number; passedMz: number }): { error: number; ppm: number } {
  const setMz = checkNumber('setMz', p?.setMz, { min: 0, minExclusive: true, max: 1e7, unit: 'u' });
  const passedMz = checkNumber('passedMz', p?.passedMz, { min: 0, minExclusive: true, max: 1e7, unit: 'u' });
  const error = passedMz - setMz;
  return { error, ppm: (error / setMz) * 1e6 };
}
