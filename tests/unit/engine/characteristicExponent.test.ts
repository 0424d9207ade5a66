import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  characteristicExponent,
  exponentGrid,
  massFilterGrid,
  mathieuA,
  mathieuB,
  stabilityExponent,
} from '../../../src/engine/index';
import { expectClose } from './close';
import { halfTraceByIntegration } from './monodromy';

describe('β: special values', () => {
  it('q = 0: β = √a for a > 0 in every zone (the equation is w″ + a w = 0)', () => {
    for (const a of [1e-6, 0.01, 0.25, 0.81, 1.44, 2.25, 6.25, 12.25, 30.25]) {
      expectClose(stabilityExponent(a, 0)!, Math.sqrt(a), 1e-12, `β(${a}, 0)`, 'mixed');
    }
  });
  it('stable points report no growth: periodsPerTenfoldGrowth null, growth 1', () => {
    const r = characteristicExponent(0.1, 0.5);
    expect(r.periodsPerTenfoldGrowth).toBeNull();
    expect(r.growthPerPeriod).toBe(1);
  });
  it('q = 0, a < 0: unstable, growth per RF period e^{π√−a} (solutions e^{±√−a ξ}, period π)', () => {
    for (const a of [-0.01, -0.5, -3, -20]) {
      expect(stabilityExponent(a, 0), `β(${a}, 0)`).toBeNull();
      const r = characteristicExponent(a, 0);
      expectClose(r.logGrowthPerPeriod, Math.PI * Math.sqrt(-a), 1e-12, `ln growth (${a}, 0)`, 'mixed');
    }
  });
  it('β is an integer n on the characteristic curves a_n(q), b_n(q) (DLMF 28.2(v))', () => {
    for (const q of [0.3, 0.9, 2.5]) {
      for (let n = 1; n <= 4; n++) {
        // Just inside the stable side of each curve: β within √(slope·δ) of n.
        const inside = n % 2 === 0 ? 1e-9 : 1e-9;
        const beta = stabilityExponent(mathieuA(n, q) + inside, q);
        expect(beta, `β just above a_${n}(${q})`).not.toBeNull();
        expectClose(beta!, n, 1e-3, `β at a_${n}(${q})`);
        const betaB = stabilityExponent(mathieuB(n, q) - inside, q);
        expect(betaB, `β just below b_${n}(${q})`).not.toBeNull();
        expectClose(betaB!, n, 1e-3, `β at b_${n}(${q})`);
      }
      const b0 = stabilityExponent(mathieuA(0, q) + 1e-9, q);
      expectClose(b0!, 0, 1e-3, `β at a_0(${q})`);
    }
  });
  it('unstable just outside the curves, stable just inside (first and second zones)', () => {
    for (const q of [0.2, 0.7, 1.5]) {
      expect(stabilityExponent(mathieuA(0, q) - 1e-6, q)).toBeNull();
      expect(stabilityExponent(mathieuB(1, q) + 1e-6, q)).toBeNull();
      expect(stabilityExponent(mathieuA(1, q) - 1e-6, q)).toBeNull();
      expect(stabilityExponent(mathieuA(1, q) + 1e-6, q)).not.toBeNull();
      expect(stabilityExponent(mathieuB(2, q) + 1e-6, q)).toBeNull();
    }
  });
  it('sign of q does not change β (ξ → ξ + π/2)', () => {
    for (const [a, q] of [[0.2, 0.5], [3, 1.1], [-0.1, 0.3], [10, 4]]) {
      expect(stabilityExponent(a, -q)).toBe(stabilityExponent(a, q));
    }
  });
});

describe('β against an independent monodromy integration (Floquet: cos πβ = ½ trace M(π))', () => {
  // Gauss–Legendre order 6 (tests/unit/engine/monodromy.ts), 400 steps per period; its own error is below
  // 1e-13 for these (a, q) (checked by halving the step in the first test).
  const points: [number, number][] = [
    [0.2, 0.5], [0.236, 0.706], [0, 0.9], [0.1, 0.3], [0.02, 0.15], [-0.05, 0.4], [-0.2, 0.5],
    [1, 0.3], [0.99999, 0.3], [1.00001, 0.3], [4, 0.5], [4.0000001, 0.2], [3.9999999, 0.2],
    [2.2, 1.3], [16, 2], [25, 5], [-3, 2], [5, 10], [9, 0.01], [0.5, 0], [36, 3],
  ];
  it('integrator self-check: 400 vs 800 steps agree to 1e-12', () => {
    for (const [a, q] of points.slice(0, 6)) {
      expectClose(halfTraceByIntegration(a, q, 400), halfTraceByIntegration(a, q, 800), 1e-12, `½tr(${a}, ${q})`, 'mixed');
    }
  });
  it('half-trace from Hill’s determinant = half-trace of the monodromy matrix', () => {
    for (const [a, q] of points) {
      const hill = characteristicExponent(a, q).halfTrace;
      expectClose(hill, halfTraceByIntegration(a, q, 400), 2e-11, `cos πβ at (${a}, ${q})`, 'mixed');
    }
  });
  it('β from the engine reproduces the integrated cos πβ to 1e-10 where stable', () => {
    for (const [a, q] of points) {
      const beta = stabilityExponent(a, q);
      const halfTrace = halfTraceByIntegration(a, q, 400);
      if (beta === null) {
        expect(Math.abs(halfTrace), `(${a}, ${q}) unstable but |½tr| = ${halfTrace}`).toBeGreaterThan(1);
      } else {
        expectClose(Math.cos(Math.PI * beta), halfTrace, 1e-10, `cos πβ at (${a}, ${q})`);
      }
    }
  });
  it('larger q and a (zones up to 5, deep instability): half-trace agrees to 1e-11 relative (2000 steps)', () => {
    for (const [a, q] of [[50, 30], [100, 100], [-50, 1], [10, 40], [60, 20]] as [number, number][]) {
      const hill = characteristicExponent(a, q).halfTrace;
      expectClose(hill, halfTraceByIntegration(a, q, 2000), 1e-11, `cos πβ at (${a}, ${q})`, 'mixed');
    }
  });
  it('growth per RF period equals the larger |Floquet multiplier| where unstable', () => {
    for (const [a, q] of points) {
      const r = characteristicExponent(a, q);
      if (r.stable) continue;
      const c = Math.abs(halfTraceByIntegration(a, q, 400));
      expectClose(r.growthPerPeriod, c + Math.sqrt(c * c - 1), 1e-9, `growth at (${a}, ${q})`, 'mixed');
      expectClose(r.periodsPerTenfoldGrowth!, Math.LN10 / Math.log(c + Math.sqrt(c * c - 1)), 1e-8, `periods ×10 at (${a}, ${q})`, 'relative');
    }
  });
});

describe('β: small-q regime against DLMF 28.15.1 (from memory)', () => {
  // a = ν² + q²/(2(ν²−1)) + (5ν²+7)q⁴/(32(ν²−1)³(ν²−4)) + O(q⁶), so the engine's β put into the series
  // must give back a to O(q⁶).
  it('a(β, q) series returns a to within 0.2·q⁶', () => {
    for (const a of [0.05, 0.1, 0.2, 0.3]) {
      for (const q of [0.01, 0.05, 0.1, 0.15]) {
        const nu = stabilityExponent(a, q)!;
        const n2 = nu * nu;
        const series = n2 + (q * q) / (2 * (n2 - 1)) + ((5 * n2 + 7) * q ** 4) / (32 * (n2 - 1) ** 3 * (n2 - 4));
        expectClose(series, a, 0.2 * q ** 6 + 1e-14, `a from β(${a}, ${q})`);
      }
    }
  });
  it('the rough rule β² ≈ a + q²/2 is only good near a = 0, small q (Dawson 1976; from memory): within 1e-3 at q = 0.1', () => {
    const beta = stabilityExponent(0.01, 0.1)!;
    expectClose(beta * beta, 0.01 + 0.005, 1e-3, 'β² at (0.01, 0.1)');
  });
});

describe('β: properties (fast-check)', () => {
  it('continuous inside the first region: nearby points give nearby β', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 0.85, noNaN: true }), fc.double({ min: 0.02, max: 0.98, noNaN: true }), (q, t) => {
        // a between a0(q) and b1(q), kept 1e-3 away from the edges where β has a square-root singularity.
        const lo = mathieuA(0, q) + 1e-3;
        const hi = mathieuB(1, q) - 1e-3;
        const a = lo + t * (hi - lo);
        const h = 1e-7;
        const b1 = stabilityExponent(a, q)!;
        const b2 = stabilityExponent(a + h, q)!;
        const b3 = stabilityExponent(a, q + h)!;
        return b1 > 0 && b1 < 1 && Math.abs(b2 - b1) < 1e-3 && Math.abs(b3 - b1) < 1e-3 && b2 > b1;
      }),
      { numRuns: 300 },
    );
  });
  it('x/y symmetry of the mass filter: (a, q) → (−a, −q) is the y direction, and β_y(−a) = β_x(a)', () => {
    fc.assert(
      fc.property(fc.double({ min: -0.3, max: 0.3, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (a, q) => {
        return stabilityExponent(-a, -q) === stabilityExponent(-a, q);
      }),
    );
  });
  it('never NaN anywhere in |a|, |q| ≤ 1000', () => {
    fc.assert(
      fc.property(fc.double({ min: -1000, max: 1000, noNaN: true }), fc.double({ min: -1000, max: 1000, noNaN: true }), (a, q) => {
        const r = characteristicExponent(a, q);
        return (
          (r.beta === null || Number.isFinite(r.beta)) &&
          Number.isFinite(r.logGrowthPerPeriod) &&
          !Number.isNaN(r.growthPerPeriod) &&
          Number.isFinite(r.halfTrace)
        );
      }),
      { numRuns: 300 },
    );
  });
});

describe('β grid', () => {
  it('shape, axes and cells equal single evaluations; unstable cells are −1', () => {
    const grid = exponentGrid({ aMin: -0.1, aMax: 0.4, aCount: 7, qMin: 0, qMax: 1, qCount: 9 });
    expect(grid.a.length).toBe(7);
    expect(grid.q.length).toBe(9);
    expect(grid.beta.length).toBe(63);
    expect(grid.a[0]).toBe(-0.1);
    expect(grid.a[6]).toBe(0.4);
    let stable = 0;
    for (let i = 0; i < 7; i++) {
      for (let j = 0; j < 9; j++) {
        const beta = stabilityExponent(grid.a[i], grid.q[j]);
        expect(grid.beta[i * 9 + j]).toBe(beta ?? -1);
        if (beta !== null) stable++;
      }
    }
    expect(stable).toBeGreaterThan(5);
    expect(stable).toBeLessThan(63);
  });
});

describe('mass-filter grid', () => {
  it('β_x = β(a, q), β_y = β(−a, −q) per cell; stable where both are', () => {
    const grid = massFilterGrid({ aMin: -0.3, aMax: 0.3, aCount: 13, qMin: 0, qMax: 1.2, qCount: 11 });
    let stableCells = 0;
    for (let i = 0; i < 13; i++) {
      for (let j = 0; j < 11; j++) {
        const k = i * 11 + j;
        const bx = stabilityExponent(grid.a[i], grid.q[j]);
        const by = stabilityExponent(-grid.a[i], -grid.q[j]);
        expect(grid.betaX[k]).toBe(bx ?? -1);
        if (by === null) expect(grid.betaY[k]).toBe(-1);
        else expectClose(grid.betaY[k], by, 1e-12, `β_y at (${grid.a[i]}, ${grid.q[j]})`);
        expect(grid.stable[k]).toBe(bx !== null && by !== null ? 1 : 0);
        stableCells += grid.stable[k];
      }
    }
    // Symmetric in a: row i and row 12−i have the same stability.
    for (let i = 0; i < 13; i++) for (let j = 0; j < 11; j++) expect(grid.stable[i * 11 + j]).toBe(grid.stable[(12 - i) * 11 + j]);
    expect(stableCells).toBeGreaterThan(10);
  });
});
