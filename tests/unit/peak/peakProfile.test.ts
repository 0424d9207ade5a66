// Peak profile, resolution at 50 % / 10 % and transmission against resolution (src/engine/peakProfile.ts).
import { describe, expect, it } from 'vitest';
import {
  PeakCancelledError,
  peakProfile,
  peakWidths,
  stableInterval,
  transmissionVsResolution,
} from '../../../src/engine/peakProfile';
import { mathieuA, mathieuB } from '../../../src/engine/characteristicValues';
import { passBand } from '../../../src/engine/index';
import { InputRangeError } from '../../../src/engine/validate';
import { ATOMIC_MASS_CONSTANT, ELEMENTARY_CHARGE } from '../../../src/engine/constants';
import { flightModel } from '../../../src/engine/peakInput';
import { near } from './helpers';

const R0 = 4e-3;
const F = 1e6;
const OMEGA = 2 * Math.PI * F;
/** V (per rod, zero-to-peak) that puts m/z at q. */
function rfFor(mz: number, q: number): number {
  return (q * mz * ATOMIC_MASS_CONSTANT * R0 * R0 * OMEGA * OMEGA) / (4 * ELEMENTARY_CHARGE);
}

/**
 * Exact pass band along the scan line a = 2λq from the first-region edges (DLMF ch. 28 characteristic values,
 * engine mathieuA/mathieuB): high-mass edge where 2λq = −a0(q) (y side, q < apex), low-mass edge where
 * 2λq = b1(q) (x side, q > apex). With V fixed, m/z = C/q.
 */
function exactBand(ratio: number, mzRef: number, qRef: number): { low: number; high: number } {
  const solve = (f: (q: number) => number, lo: number, hi: number): number => {
    let a = lo;
    let b = hi;
    for (let i = 0; i < 80; i++) {
      const mid = 0.5 * (a + b);
      if (f(a) * f(mid) <= 0) b = mid;
      else a = mid;
    }
    return 0.5 * (a + b);
  };
  const qHighMass = solve((q) => 2 * ratio * q + mathieuA(0, q), 0.3, 0.70600);
  const qLowMass = solve((q) => 2 * ratio * q - mathieuB(1, q), 0.70601, 0.908);
  return { low: (mzRef * qRef) / qLowMass, high: (mzRef * qRef) / qHighMass };
}

describe('peakWidths: resolution from a sampled peak', () => {
  it('a sampled Gaussian gives m/FWHM with FWHM = 2√(2 ln 2)σ (normal distribution, exact)', () => {
    const n = 2001;
    const mz = new Float64Array(n);
    const t = new Float64Array(n);
    const sigma = 0.1;
    for (let i = 0; i < n; i++) {
      mz[i] = 199 + (2 * i) / (n - 1);
      t[i] = 0.8 * Math.exp(-(((mz[i] - 200) / sigma) ** 2) / 2);
    }
    const w = peakWidths(mz, t);
    near('R50', w.resolution50, 200 / (2 * Math.sqrt(2 * Math.LN2) * sigma), 0.05);
    near('R10', w.resolution10, 200 / (2 * Math.sqrt(2 * Math.log(10)) * sigma), 0.05);
    near('height', w.peakTransmission, 0.8, 1e-12);
  });

  it('gives resolution 0 (not measurable) when the peak is cut off by the range (never a made-up number, never NaN)', () => {
    const mz = Float64Array.from([1, 2, 3, 4]);
    const t = Float64Array.from([0.1, 0.5, 0.9, 1]);
    expect(peakWidths(mz, t).resolution50).toBe(0);
  });
});

describe('peakProfile: published behaviour', () => {
  it('with very many cycles and a small cold beam, R50 and R10 approach the ideal band from the stability edges (engine passBand)', () => {
    // Ideal R ≈ 100 (U/V = 0.16784 − 0.126/100, Dawson 1976 rule, from memory); n ≈ 1000 cycles, n²/K ≫ 100.
    const mz0 = 100;
    const q0 = 0.706;
    const ratio = 0.16784 - 0.126 / 100;
    const rf = rfFor(mz0, q0);
    // The engine's pass band (first-region edges) is the reference; our own bisection on the characteristic
    // values and on |tr M| must agree with it.
    const band = passBand({ dc: ratio * rf, rf, r0: R0, frequency: F })!;
    const fromValues = exactBand(ratio, mz0, q0);
    near('engine passBand low vs characteristic values', band.low, fromValues.low, 1e-7 * band.low);
    near('engine passBand high vs characteristic values', band.high, fromValues.high, 1e-7 * band.high);
    const idealResolution = (0.5 * (band.low + band.high)) / (band.high - band.low);
    const settings = { r0: R0, frequency: F, dc: ratio * rf, rf, rodLength: 0.2, axialVoltage: 0.02, beamRadius: 0.01 * R0, transverseEnergy: 1e-5 };
    expect(flightModel({ ...settings, mz: mz0 }).cycles).toBeGreaterThan(900);
    const width = band.high - band.low;
    const profile = peakProfile({ ...settings, mzFrom: band.low - 0.2 * width, mzTo: band.high + 0.2 * width, points: 141 });
    // The sampled peak is flat-topped: edges at the band edges, so R50 ≈ R10 ≈ ideal (sampling step 1/100 of the band).
    near('R50 vs ideal band', profile.resolution50, idealResolution, 0.02 * idealResolution);
    near('R10 vs ideal band', profile.resolution10, idealResolution, 0.03 * idealResolution);
    near('peak transmission', profile.peakTransmission, 1, 1e-3);
    // Our own Floquet bisection agrees with the characteristic-value edges.
    const own = stableInterval(settings as never, mz0)!;
    near('low edge', own.low, band.low, 1e-6 * band.low);
    near('high edge', own.high, band.high, 1e-6 * band.high);
  });

  it('resolution falls as ion energy rises (fewer cycles) as n²/K, K in the range of the literature', () => {
    // U/V at the ideal R ≈ 20 000, so the RF-cycles limit dominates. Paul, Reinhard & von Zahn,
    // Z. Phys. 152 (1958) 143 via Dawson 1976 (K ≈ 12.25) and later reviews (K ≈ 20) — both from memory —
    // state m/Δm ≲ n²/K with Δm at the base of the peak; we measure it at 10 % height.
    const mz0 = 100;
    const q0 = 0.706;
    const ratio = 0.16784 - 0.126 / 20000;
    const rf = rfFor(mz0, q0);
    const results: Array<{ n: number; r10: number; r50: number }> = [];
    for (const axialVoltage of [5, 10, 20, 40]) {
      const settings = { r0: R0, frequency: F, dc: ratio * rf, rf, rodLength: 0.2, axialVoltage, beamRadius: 0.1e-3, transverseEnergy: 0.01 };
      const n = flightModel({ ...settings, mz: mz0 }).cycles;
      const width = (mz0 * 30) / (n * n);
      const p = peakProfile({ ...settings, mzFrom: mz0 - 1.5 * width, mzTo: mz0 + 1.5 * width, points: 81 });
      results.push({ n, r10: p.resolution10, r50: p.resolution50 });
    }
    for (let i = 1; i < results.length; i++) {
      expect(results[i].r50).toBeLessThan(results[i - 1].r50);
      expect(results[i].r10).toBeLessThan(results[i - 1].r10);
    }
    for (const r of results) {
      const k10 = (r.n * r.n) / r.r10;
      expect(k10).toBeGreaterThan(10);
      expect(k10).toBeLessThan(25);
    }
    // R ∝ n²: log-log slope between the extremes.
    const first = results[0];
    const last = results[results.length - 1];
    const slope = Math.log(first.r10 / last.r10) / Math.log(first.n / last.n);
    expect(slope).toBeGreaterThan(1.7);
    expect(slope).toBeLessThan(2.3);
  });
});

describe('peakProfile: a window without a peak', () => {
  it('reports no resolution (0, shown in words) and T ≈ 0 everywhere', () => {
    const rf = rfFor(500, 0.706);
    const p = peakProfile({ r0: R0, frequency: F, dc: 0.1677 * rf, rf, rodLength: 0.2, axialVoltage: 5, beamRadius: 4e-4, transverseEnergy: 0.2, mzFrom: 300, mzTo: 310, points: 41 });
    expect(p.peakTransmission).toBeLessThan(1e-6);
    expect(p.resolution50).toBe(0);
    expect(p.resolution10).toBe(0);
  });
});

describe('transmissionVsResolution', () => {
  it('stepping U/V towards the apex raises R50 and lowers the peak transmission', () => {
    const result = transmissionVsResolution(
      { mz: 100, r0: R0, frequency: F, rodLength: 0.2, axialVoltage: 10, beamRadius: 0.5e-3, transverseEnergy: 0.2, ratios: [0.155, 0.162, 0.166], points: 41 },
    );
    expect(result.ratio.length).toBe(3);
    for (let i = 1; i < 3; i++) {
      expect(result.resolution50[i]).toBeGreaterThan(result.resolution50[i - 1]);
      expect(result.peakTransmission[i]).toBeLessThan(result.peakTransmission[i - 1]);
    }
    near('rf at q = 0.706', result.rf[0], rfFor(100, 0.706), 1e-9);
    near('dc = ratio·rf', result.dc[1], 0.162 * result.rf[1], 1e-9);
  });

  it('past the apex there is no band: T = 0 and R = 0 (not measurable)', () => {
    const r = transmissionVsResolution({ mz: 100, r0: R0, frequency: F, rodLength: 0.2, axialVoltage: 10, beamRadius: 0.5e-3, transverseEnergy: 0.2, ratios: [0.17] });
    expect(r.peakTransmission[0]).toBe(0);
    expect(r.resolution50[0]).toBe(0);
  });
});

describe('peakProfile: control and bad input', () => {
  const rf = rfFor(100, 0.706);
  const base = { r0: R0, frequency: F, dc: 0.165 * rf, rf, rodLength: 0.2, axialVoltage: 10, beamRadius: 0.4e-3, transverseEnergy: 0.2, mzFrom: 99, mzTo: 101, points: 21 };

  it('reports progress from 0 to 1, non-decreasing', () => {
    const seen: number[] = [];
    peakProfile(base, { onProgress: (f) => seen.push(f) });
    expect(seen.length).toBeGreaterThan(5);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1]);
    expect(seen[seen.length - 1]).toBe(1);
  });

  it('stops with PeakCancelledError when asked (shouldStop or an aborted signal)', () => {
    let calls = 0;
    expect(() => peakProfile(base, { shouldStop: () => ++calls > 3 })).toThrow(PeakCancelledError);
    expect(() => peakProfile(base, { signal: { aborted: true } })).toThrow(PeakCancelledError);
  });

  const bad: Array<[string, Record<string, unknown>]> = [
    ['points', { points: 1 }],
    ['points', { points: 2.5 }],
    ['mzTo', { mzFrom: 101, mzTo: 100 }],
    ['mzTo', { mzFrom: 100, mzTo: 100 }],
    ['mzFrom', { mzFrom: Number.NaN }],
    ['r0', { r0: -1 }],
    ['beamRadius', { beamRadius: Number.NaN }],
    ['rodLength', { rodLength: 0 }],
  ];
  for (const [field, change] of bad) {
    it(`refuses ${field} = ${String(Object.values(change).at(-1))} naming the field and range`, () => {
      try {
        peakProfile({ ...base, ...change } as typeof base);
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(InputRangeError);
        expect((e as InputRangeError).field).toBe(field);
        expect((e as InputRangeError).message).toMatch(/expected|accepted/);
      }
    });
  }
});
