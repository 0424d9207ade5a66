// Reading a scan and finding its peaks (src/spectrum/scan.ts), on synthetic data with known answers.
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../src/engine/index';
import { findPeaks, readScan, type Scan } from '../../../src/spectrum/index';

function near(label: string, actual: number, expected: number, tolerance: number): void {
  const difference = Math.abs(actual - expected);
  if (!(difference <= tolerance)) throw new Error(`${label}: got ${actual}, expected ${expected}, |Δ| = ${difference} > ${tolerance}`);
}

/** Gaussian peaks (FWHM = 2√(2 ln 2)·σ, area = h·σ·√(2π)) on a uniform grid, with baseline and seeded noise. */
function synthetic(peaks: { mz: number; height: number; sigma: number; tail?: number }[], o: { from: number; to: number; points: number; baseline?: number; noise?: number; seed?: number }): Scan {
  const random = seededRandom(o.seed ?? 1);
  const mz = new Float64Array(o.points);
  const intensity = new Float64Array(o.points);
  for (let i = 0; i < o.points; i++) {
    const m = o.from + ((o.to - o.from) * i) / (o.points - 1);
    mz[i] = m;
    let v = o.baseline ?? 0;
    for (const p of peaks) {
      const z = (m - p.mz) / p.sigma;
      v += p.height * Math.exp(-0.5 * z * z);
      // Exponential tail on the high-m/z side: added signal decaying with length `tail` (u).
      if (p.tail && m > p.mz) v += 0.3 * p.height * Math.exp(-(m - p.mz) / p.tail) * (1 - Math.exp(-0.5 * z * z));
    }
    intensity[i] = v + (o.noise ?? 0) * random.normal();
  }
  return { mz, intensity };
}

const FWHM_PER_SIGMA = 2 * Math.sqrt(2 * Math.LN2);

describe('readScan', () => {
  it('reads comma, tab, spaces and semicolon with decimal comma; headers and # lines skipped', () => {
    const expected = { mz: [100.1, 100.2, 100.3], intensity: [5, 7.5, 6] };
    const texts = [
      'm/z,intensity\n100.1,5\n100.2,7.5\n100.3,6\n',
      'Mass\tSignal\r\n100.1\t5\r\n100.2\t7.5\r\n100.3\t6',
      '# made on the bench\n  100.1   5\n100.2 7.5\n\n100.3    6e0\n',
      'm/z;intensity\n100,1;5\n100,2;7,5\n100,3;6\n',
    ];
    for (const text of texts) {
      const scan = readScan(text);
      expect(Array.from(scan.mz)).toEqual(expected.mz);
      expect(Array.from(scan.intensity)).toEqual(expected.intensity);
      expect(scan.sorted).toBeUndefined();
    }
  });

  it('sorts falling or shuffled m/z and says so', () => {
    const scan = readScan('100.3,6\n100.1,5\n100.2,7.5\n');
    expect(Array.from(scan.mz)).toEqual([100.1, 100.2, 100.3]);
    expect(Array.from(scan.intensity)).toEqual([5, 7.5, 6]);
    expect(scan.sorted).toBe(true);
  });

  it('names the line of a bad entry', () => {
    expect(() => readScan('m/z,intensity\n100.1,5\n100.2,abc\n100.3,6')).toThrow(/Scan line 3: "100.2,abc" is not two numbers/);
    expect(() => readScan('100.1,5\n100.2,7\n100.2,6')).toThrow(/Scan line 3: m\/z 100.2 repeats line 2/);
    expect(() => readScan('100.1,5\n-3,7\n100.3,6')).toThrow(/Scan line 2: m\/z = -3 is out of range/);
    expect(() => readScan('100.1;5\n100.2;7;8\n100.3;6')).toThrow(/Scan line 2/);
    expect(() => readScan('m/z,intensity\n100.1,5\n')).toThrow(/1 data line found; at least 3/);
  });
});

describe('findPeaks', () => {
  it('a clean Gaussian: apex, centroid, FWHM, resolution, area and asymmetry 1 (analytic)', () => {
    const sigma = 0.1;
    const [p] = findPeaks(synthetic([{ mz: 219, height: 1000, sigma }], { from: 217, to: 221, points: 2001 }));
    near('apex', p.apex, 219, 1e-4);
    near('centroid', p.centroid, 219, 1e-6);
    near('height', p.height, 1000, 0.5);
    near('fwhm', p.fwhm, FWHM_PER_SIGMA * sigma, 1e-3 * FWHM_PER_SIGMA * sigma);
    near('resolution', p.resolution, 219 / (FWHM_PER_SIGMA * sigma), 1);
    near('area', p.area, 1000 * sigma * Math.sqrt(2 * Math.PI), 2);
    near('asymmetry', p.asymmetry, 1, 0.01);
  });

  it('noise (1 % of height) and a baseline offset of 500: height above the baseline, FWHM within 2 %', () => {
    const sigma = 0.1;
    const scan = synthetic([{ mz: 69, height: 1000, sigma }], { from: 67, to: 71, points: 2001, baseline: 500, noise: 10, seed: 7 });
    const peaks = findPeaks(scan);
    expect(peaks).toHaveLength(1);
    near('height', peaks[0].height, 1000, 15);
    near('fwhm', peaks[0].fwhm, FWHM_PER_SIGMA * sigma, 0.02 * FWHM_PER_SIGMA * sigma);
    near('apex', peaks[0].apex, 69, 0.005);
    near('area', peaks[0].area, 1000 * sigma * Math.sqrt(2 * Math.PI), 10);
  });

  it('a close doublet (1.5 FWHM apart) gives two peaks at the right places', () => {
    const sigma = 0.1;
    const gap = 1.5 * FWHM_PER_SIGMA * sigma;
    const scan = synthetic([{ mz: 100, height: 1000, sigma }, { mz: 100 + gap, height: 600, sigma }], { from: 98, to: 103, points: 2001, noise: 5, seed: 3 });
    const peaks = findPeaks(scan);
    expect(peaks).toHaveLength(2);
    near('first apex', peaks[0].apex, 100, 0.01);
    near('second apex', peaks[1].apex, 100 + gap, 0.02);
    expect(peaks[1].height / peaks[0].height).toBeGreaterThan(0.5);
  });

  it('tailing to high m/z gives asymmetry > 1; the mirror image gives < 1', () => {
    const sigma = 0.1;
    const tailed = synthetic([{ mz: 200, height: 1000, sigma, tail: 0.25 }], { from: 198, to: 203, points: 2501 });
    const [p] = findPeaks(tailed);
    expect(p.asymmetry).toBeGreaterThan(1.2);
    const mirrored: Scan = { mz: Float64Array.from(tailed.mz, (m) => 400 - m).reverse(), intensity: Float64Array.from(tailed.intensity).reverse() };
    const [q] = findPeaks(mirrored);
    near('mirror asymmetry', q.asymmetry, 1 / p.asymmetry, 0.01);
  });

  it('pure noise gives no peak; bad options are refused', () => {
    const scan = synthetic([], { from: 10, to: 20, points: 1000, baseline: 100, noise: 5, seed: 11 });
    expect(findPeaks(scan)).toHaveLength(0);
    expect(() => findPeaks(scan, { smooth: 4 })).toThrow(/smooth = 4 is out of range/);
    expect(() => findPeaks(scan, { minSnr: -1 })).toThrow(/minSnr/);
  });
});
