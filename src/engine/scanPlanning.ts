// Scan planning: how long a mass scan takes and what averaging buys. Stepped scan over [mzStart, mzEnd] in
// steps of `step`, `dwell` seconds per point plus an optional settling time per point, `scans` scans averaged.
// S/N gain from averaging N scans is √N: counting statistics (Poisson) give noise ∝ √counts while the signal
// grows ∝ counts (G. F. Knoll, Radiation Detection and Measurement, 4th ed. 2010, ch. 3: RSD = 1/√N).
// This assumes the noise is counting noise, uncorrelated between scans; drift and chemical background do not
// average away like this.
import { checkNumber } from './validate';

export interface ScanPlan {
  /** Mass points per scan (both ends included). */
  points: number;
  /** Seconds per scan: points · (dwell + settle). */
  timePerScan: number;
  /** Seconds for all averaged scans. */
  totalTime: number;
  /** Signal-to-noise gain of the average over one scan: √scans (counting statistics). */
  signalToNoiseGain: number;
  /** Counts expected per point over all scans (countRate · dwell · scans); null without a count rate. */
  countsPerPoint: number | null;
  /** Relative standard deviation of those counts, 1/√counts (Knoll 2010); null without a count rate. */
  relativeStandardDeviation: number | null;
}

/**
 * Time and S/N of a stepped scan.
 * @param mzStart first m/z (u), > 0
 * @param mzEnd last m/z (u), ≥ mzStart
 * @param step m/z step (u), > 0
 * @param dwell seconds per point, > 0
 * @param scans number of scans averaged, integer ≥ 1
 * @param settle seconds of settling per point (default 0)
 * @param countRate ions per second at a peak top (optional), for the counting-statistics RSD
 */
export function scanPlan(p: {
  mzStart: number;
  mzEnd: number;
  step: number;
  dwell: number;
  scans: number;
  settle?: number;
  countRate?: number;
}): ScanPlan {
  const mzStart = checkNumber('mzStart', p?.mzStart, { min: 0, minExclusive: true, max: 1e7, unit: 'u' });
  const mzEnd = checkNumber('mzEnd', p?.mzEnd, { min: mzStart, max: 1e7, unit: 'u' });
  const step = checkNumber('step', p?.step, { min: 0, minExclusive: true, max: 1e7, unit: 'u' });
  const dwell = checkNumber('dwell', p?.dwell, { min: 0, minExclusive: true, max: 3600, unit: 's' });
  const scans = checkNumber('scans', p?.scans, { min: 1, max: 1e7, integer: true });
  const settle = checkNumber('settle', p?.settle === undefined ? 0 : p.settle, { min: 0, max: 3600, unit: 's' });
  // The small allowance keeps 1 → 100 in 0.1 u steps at 991 points despite binary rounding of 0.1.
  const points = Math.floor((mzEnd - mzStart) / step + 1e-9) + 1;
  checkNumber('points', points, { min: 1, max: 1e8, integer: true });
  const timePerScan = points * (dwell + settle);
  let countsPerPoint: number | null = null;
  let relativeStandardDeviation: number | null = null;
  if (p.countRate !== undefined) {
    const countRate = checkNumber('countRate', p.countRate, { min: 0, minExclusive: true, max: 1e12, unit: 's⁻¹' });
    countsPerPoint = countRate * dwell * scans;
    relativeStandardDeviation = 1 / Math.sqrt(countsPerPoint);
  }
  return {
    points,
    timePerScan,
    totalTime: timePerScan * scans,
    signalToNoiseGain: Math.sqrt(scans),
    countsPerPoint,
    relativeStandardDeviation,
  };
}

/** Scans to average for a wanted S/N gain g over one scan: ⌈g²⌉ (counting statistics, as above). */
export function scansForGain(gain: number): number {
  checkNumber('gain', gain, { min: 1, max: 1e4 });
  return Math.ceil(gain * gain - 1e-9);
}
