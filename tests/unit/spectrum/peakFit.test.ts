// The verdict fit (src/spectrum/peakFit.ts) on synthetic scans made from the engine's own ideal peak (computed
// reference): known U/V, ion energy and offset come back within their stated uncertainty; added tailing or a
// shoulder is "not explained" and sends the user to the peak-shape tree.
import { beforeAll, describe, expect, it } from 'vitest';
import { ratioForResolution } from '../../../src/engine/index';
import { fitPeak, PEAK_SHAPE_TREE_ID, type PeakFitResult } from '../../../src/spectrum/index';
import { INSTRUMENT, cleanPeak, measured, type CleanPeak } from './synthetic';

let peak: CleanPeak;
beforeAll(() => {
  // CF3+ (m/z 68.995), band resolution 300, 4 V axial: 151 points across ±3 band widths.
  peak = cleanPeak({ ionMz: 68.995, bandResolution: 300, axialVoltage: 4, points: 151 });
}, 120_000);

function within(label: string, fitted: { value: number; sigma: number }, truth: number, k: number): void {
  const gap = Math.abs(fitted.value - truth);
  if (!(Number.isFinite(fitted.sigma) && gap <= k * fitted.sigma)) {
    throw new Error(`${label}: fitted ${fitted.value} ± ${fitted.sigma} (1σ), truth ${truth}, |Δ| = ${gap} > ${k}σ`);
  }
}

describe('fitPeak on the ideal peak', () => {
  let result: PeakFitResult;
  const shift = 0.012;
  beforeAll(() => {
    const scan = measured(peak, { height: 1e4, baseline: 200, noise: 40, seed: 5, shift });
    result = fitPeak({ scan, peakMz: 69, instrument: INSTRUMENT, axialVoltage: 7, wantedResolution: 600 });
  }, 120_000);

  it('gives back U/V and ion energy within 2σ of the stated 1σ uncertainty, and the offset', () => {
    within('U/V', result.ratio, peak.ratio, 2);
    within('axial voltage', result.axialVoltage, peak.axialVoltage, 2);
    // The model centres the band on the measured centroid; offset + centroid puts the ion where it was.
    expect(Math.abs(result.peak.centroid + 0 - (peak.ionMz + shift))).toBeLessThan(0.1 * result.fwhmMeasured);
    within('baseline', result.baseline, 200, 3);
  });

  it('calls it explained, with residual noise near the noise, and the U/V for a wanted resolution', () => {
    expect(result.verdict.explained).toBe(true);
    expect(result.verdict.findings).toEqual([]);
    expect(result.verdict.treeId).toBeNull();
    expect(result.reducedChiSquare).toBeLessThan(1.5);
    expect(result.residualNoise / 40).toBeGreaterThan(0.8);
    expect(result.residualNoise / 40).toBeLessThan(1.25);
    expect(result.verdict.limits).toMatch(/no fringe fields/);
    const wanted = result.verdict.forWantedResolution!;
    expect(wanted.resolution).toBe(600);
    // Higher resolution needs a U/V closer to the apex than the fitted one, and the engine's inverse gives the rule value.
    expect(wanted.ratio).toBeGreaterThan(result.ratio.value);
    expect(wanted.ratioRule).toBe(ratioForResolution(600).rule);
    expect(result.fitted).toHaveLength(result.mz.length);
    expect(Array.from(result.residual).every(Number.isFinite)).toBe(true);
  });
});

describe('fitPeak on peaks the ideal filter cannot make', () => {
  it('tailing to high m/z: not explained, tailing named, peak-shape tree and usual causes', () => {
    const w = peak.bandWidth;
    const top = peak.ionMz + 0.5 * w;
    const scan = measured(peak, {
      height: 1e4, baseline: 200, noise: 40, seed: 9,
      // A decaying tail from the high-mass edge: 15 % of the height, decay length one band width.
      extra: (m) => (m > top ? 1500 * Math.exp(-(m - top) / w) * Math.min(1, (m - top) / (0.1 * w)) : 0),
    });
    const r = fitPeak({ scan, peakMz: 69, instrument: INSTRUMENT, axialVoltage: 4 });
    expect(r.verdict.explained).toBe(false);
    expect(r.verdict.findings.some((f) => f === 'tailing-high' || f === 'shoulder-high')).toBe(true);
    expect(r.verdict.treeId).toBe(PEAK_SHAPE_TREE_ID);
    expect(r.verdict.usualCauses.join(' ')).toMatch(/contaminated rods/);
    expect(r.verdict.summary).toMatch(/Not explained/);
  });

  it('a shoulder on the low-m/z side: not explained, shoulder (or split) named', () => {
    const w = peak.bandWidth;
    const at = peak.ionMz - 0.8 * w;
    const scan = measured(peak, {
      height: 1e4, baseline: 200, noise: 40, seed: 13,
      extra: (m) => 2000 * Math.exp(-0.5 * ((m - at) / (0.2 * w)) ** 2),
    });
    const r = fitPeak({ scan, peakMz: 69, instrument: INSTRUMENT, axialVoltage: 4 });
    expect(r.verdict.explained).toBe(false);
    expect(r.verdict.findings.some((f) => f === 'shoulder-low' || f === 'split' || f === 'tailing-low')).toBe(true);
    expect(r.verdict.treeId).toBe('peak-shape');
  });

  it('refuses bad input with the field and range', () => {
    const scan = measured(peak, { height: 1e4, baseline: 200, noise: 40, seed: 1 });
    expect(() => fitPeak({ scan, peakMz: -1, instrument: INSTRUMENT })).toThrow(/peakMz = -1 is out of range/);
    expect(() => fitPeak({ scan, peakMz: 69, instrument: { ...INSTRUMENT, r0: 0 } })).toThrow(/r0 = 0 is out of range/);
    expect(() => fitPeak({ scan, peakMz: 120, instrument: INSTRUMENT })).toThrow(/no peak within 3 FWHM/);
    expect(() => fitPeak({ scan, peakMz: 69, instrument: INSTRUMENT, axialVoltage: 0 })).toThrow(/axialVoltage = 0/);
  });
});
