import { describe, expect, it } from 'vitest';
import {
  apexRatio,
  characteristicCurves,
  firstRegionApex,
  firstRegionBoundary,
  firstRegionBoundarySteps,
  mathieuA,
  mathieuB,
  rfOnlyEdgeQ,
  stabilityExponent,
} from '../../../src/engine/index';
import { expectClose } from './close';
import { halfTraceByIntegration } from './monodromy';

/** Bisection for a sign change of f on [lo, hi] (test-local, independent of the engine). */
function bisect(f: (x: number) => number, lo: number, hi: number, tolerance: number): number {
  let fLo = f(lo);
  for (let i = 0; i < 200 && hi - lo > tolerance; i++) {
    const mid = 0.5 * (lo + hi);
    const fMid = f(mid);
    if (fMid === 0) return mid;
    if (Math.sign(fMid) === Math.sign(fLo)) {
      lo = mid;
      fLo = fMid;
    } else hi = mid;
  }
  return 0.5 * (lo + hi);
}

describe('first stability region: apex', () => {
  it('matches the textbook values q ≈ 0.706, a ≈ 0.23699, U/V ≈ 0.16784 (Dawson 1976 — from memory)', () => {
    const apex = firstRegionApex();
    expectClose(apex.q, 0.706, 5e-4, 'apex q (quoted to 3 decimals)');
    expectClose(apex.a, 0.23699, 5e-6, 'apex a (quoted to 5 decimals)');
    expectClose(apexRatio(), 0.16784, 1e-5, 'apex U/V (Dawson 1976: ± 1e-5)');
    expectClose(apexRatio(), apex.a / (2 * apex.q), 1e-15, 'U/V = a/(2q)');
  });
  it('is the crossing of the edges b1(q) = −a0(q) to 1e-13', () => {
    const apex = firstRegionApex();
    expectClose(mathieuB(1, apex.q), -mathieuA(0, apex.q), 1e-13, 'b1 + a0 at apex q');
    expectClose(mathieuB(1, apex.q), apex.a, 1e-13, 'b1(q_apex) = a_apex');
  });
  it('agrees to 1e-9 with an apex found by monodromy integration alone (β_x = 1 meets β_y = 0)', () => {
    // x edge at q: a where cos πβ(a, q) = −1; y edge: a where cos πβ(−a, q) = +1. Then where they meet.
    const steps = 200; // GL6 error at 200 steps is below 1e-12 here
    const xEdge = (q: number) => bisect((a) => halfTraceByIntegration(a, q, steps) + 1, 0.15, 0.3, 1e-13);
    const yEdge = (q: number) => bisect((a) => halfTraceByIntegration(-a, q, steps) - 1, 0.15, 0.3, 1e-13);
    const q = bisect((x) => xEdge(x) - yEdge(x), 0.69, 0.72, 1e-11);
    const a = xEdge(q);
    const apex = firstRegionApex();
    expectClose(apex.q, q, 1e-9, 'apex q vs integration');
    expectClose(apex.a, a, 1e-9, 'apex a vs integration');
  });
});

describe('first stability region: a = 0 edge (RF-only cut-off)', () => {
  it('b1(q) = 0 at q ≈ 0.908 (Dawson 1976 — from memory)', () => {
    expectClose(rfOnlyEdgeQ(), 0.908, 5e-4, 'a = 0 edge q (quoted to 3 decimals)');
    expectClose(mathieuB(1, rfOnlyEdgeQ()), 0, 1e-14, 'b1 at the edge');
  });
  it('β_x → 1 at the edge: stable just left, unstable just right (a = 0)', () => {
    expect(stabilityExponent(0, rfOnlyEdgeQ() - 1e-6)).not.toBeNull();
    expect(stabilityExponent(0, rfOnlyEdgeQ() + 1e-6)).toBeNull();
    const halfTrace = halfTraceByIntegration(0, rfOnlyEdgeQ(), 400);
    expectClose(halfTrace, -1, 1e-11, 'cos πβ at the edge by integration');
  });
});

describe('first stability region: boundary arrays', () => {
  const boundary = firstRegionBoundary(1000);
  it('columnar Float64Arrays of equal length, q ascending from 0 to the a = 0 edge, apex sampled', () => {
    for (const column of [boundary.q, boundary.xEdge, boundary.yEdge, boundary.upper, boundary.lower]) {
      expect(column).toBeInstanceOf(Float64Array);
      expect(column.length).toBe(1000);
    }
    expect(boundary.q[0]).toBe(0);
    expectClose(boundary.q[999], rfOnlyEdgeQ(), 1e-15, 'last q');
    for (let i = 1; i < 1000; i++) expect(boundary.q[i]).toBeGreaterThan(boundary.q[i - 1]);
    expect(boundary.q[boundary.apexIndex]).toBe(firstRegionApex().q);
    expect(boundary.upper[boundary.apexIndex]).toBe(firstRegionApex().a);
  });
  it('edges equal −a0(q) and b1(q); upper is their minimum and peaks at the apex; lower = −upper', () => {
    for (let i = 0; i < 1000; i += 37) {
      const q = boundary.q[i];
      expectClose(boundary.yEdge[i], -mathieuA(0, q), 1e-14, `y edge at q=${q}`);
      if (i < 999) expectClose(boundary.xEdge[i], mathieuB(1, q), 1e-14, `x edge at q=${q}`);
      expect(boundary.lower[i]).toBe(-boundary.upper[i]);
    }
    const max = Math.max(...boundary.upper);
    expect(max).toBe(firstRegionApex().a);
    for (let i = 1; i <= boundary.apexIndex; i++) expect(boundary.upper[i]).toBeGreaterThanOrEqual(boundary.upper[i - 1]);
    for (let i = boundary.apexIndex + 1; i < 1000; i++) expect(boundary.upper[i]).toBeLessThanOrEqual(boundary.upper[i - 1]);
  });
  it('computed in steps, the boundary is the same, bit for bit, and each step reports the fraction done', () => {
    const steps = firstRegionBoundarySteps(1000, 64);
    const fractions: number[] = [];
    let r = steps.next();
    while (!r.done) {
      fractions.push(r.value);
      r = steps.next();
    }
    expect(fractions).toHaveLength(16); // the apex and the a = 0 edge, then 64, 128, … 960 of 1000 samples
    expect(fractions[0]).toBe(0);
    expect(fractions[1]).toBe(0.064);
    for (let i = 1; i < fractions.length; i++) expect(fractions[i]).toBeGreaterThan(fractions[i - 1]);
    for (const key of ['q', 'xEdge', 'yEdge', 'upper', 'lower'] as const) expect(r.value[key]).toEqual(boundary[key]);
    expect(r.value.apexIndex).toBe(boundary.apexIndex);
    expect(() => firstRegionBoundarySteps(1000, 0).next()).toThrow(/perStep/);
  });
  it('points just under the upper edge are stable in x and y; just above are not', () => {
    for (let i = 20; i < 990; i += 97) {
      const q = boundary.q[i];
      const a = boundary.upper[i];
      expect(stabilityExponent(a - 1e-6, q), `x below edge at q=${q}`).not.toBeNull();
      expect(stabilityExponent(-(a - 1e-6), q), `y below edge at q=${q}`).not.toBeNull();
      const xOut = stabilityExponent(a + 1e-6, q) === null;
      const yOut = stabilityExponent(-(a + 1e-6), q) === null;
      expect(xOut || yOut, `above edge at q=${q}`).toBe(true);
    }
  });
});

describe('characteristic curves for the higher regions', () => {
  it('columns of a_n, b_n equal the single-value functions', () => {
    const curves = characteristicCurves({ qMax: 10, points: 11, maxOrder: 3 });
    expect(curves.a.length).toBe(4);
    expect(curves.b.length).toBe(4);
    expect(curves.b[0].length).toBe(0);
    for (let i = 0; i < 11; i++) {
      for (let n = 0; n <= 3; n++) expect(curves.a[n][i]).toBe(mathieuA(n, curves.q[i]));
      for (let n = 1; n <= 3; n++) expect(curves.b[n][i]).toBe(mathieuB(n, curves.q[i]));
    }
  });
  it('the second-zone band a1 < a < b2 is stable with 1 < β < 2 (DLMF 28.2(v))', () => {
    const q = 2;
    const a = 0.5 * (mathieuA(1, q) + mathieuB(2, q));
    const beta = stabilityExponent(a, q)!;
    expect(beta).toBeGreaterThan(1);
    expect(beta).toBeLessThan(2);
  });
});
