// Seeded randomness: same seed → same numbers; moments of the uniform and normal streams.
// Generator: xoshiro128** (Blackman & Vigna, ACM TOMS 47 (2021) 36) seeded by splitmix32.
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../src/engine/peakRandom';

describe('seededRandom', () => {
  it('reproduces the same stream for the same seed and differs for another seed', () => {
    const a = seededRandom(42);
    const b = seededRandom(42);
    const c = seededRandom(43);
    const sa = Array.from({ length: 100 }, () => a.uniform());
    const sb = Array.from({ length: 100 }, () => b.uniform());
    const sc = Array.from({ length: 100 }, () => c.uniform());
    expect(sa).toEqual(sb);
    expect(sa).not.toEqual(sc);
  });

  it('gives uniform numbers in [0, 1) with mean 1/2 and variance 1/12 (to 4σ of the sampling error)', () => {
    const r = seededRandom(1);
    const n = 200_000;
    let sum = 0;
    let sum2 = 0;
    let outside = 0;
    for (let i = 0; i < n; i++) {
      const v = r.uniform();
      if (!(v >= 0 && v < 1)) outside++;
      sum += v;
      sum2 += v * v;
    }
    expect(outside).toBe(0);
    const mean = sum / n;
    const variance = sum2 / n - mean * mean;
    expect(Math.abs(mean - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(4 * Math.sqrt(1 / 180 / n));
  });

  it('gives standard normal numbers: mean 0, variance 1, P(|z| < 1) = 0.6827 (normal table)', () => {
    const r = seededRandom(2);
    const n = 200_000;
    let sum = 0;
    let sum2 = 0;
    let inside = 0;
    for (let i = 0; i < n; i++) {
      const v = r.normal();
      sum += v;
      sum2 += v * v;
      if (Math.abs(v) < 1) inside++;
    }
    expect(Math.abs(sum / n)).toBeLessThan(4 / Math.sqrt(n));
    expect(Math.abs(sum2 / n - 1)).toBeLessThan(4 * Math.sqrt(2 / n));
    // Φ(1) − Φ(−1) = 0.682689 (A&S Table 26.1).
    expect(Math.abs(inside / n - 0.682689)).toBeLessThan(4 * Math.sqrt((0.6827 * 0.3173) / n));
  });

  it('refuses a non-integer seed', () => {
    expect(() => seededRandom(1.5)).toThrow(/seed/);
  });
});
