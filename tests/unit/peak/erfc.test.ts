// Special functions behind the transmission integral, against references:
// erfc vs mpmath 1.3 at 50 digits (fixture made by scripts/peak/erfc_chebyshev.py);
// Φ vs Abramowitz & Stegun Table 26.1; Gauss–Legendre exact for polynomials of degree ≤ 2n − 1 (A&S 25.4.29).
import { describe, expect, it } from 'vitest';
import fixture from './erfc.fixture.json';
import { erfc, gaussLegendre, meanNormalCdf, normalCdf, normalPdf } from '../../../src/engine/transmissionMath';
import { near } from './helpers';

describe('erfc', () => {
  it('special values: NaN → NaN, erfc(0) = 1, erfc(±∞) = 0 / 2', () => {
    expect(erfc(Number.NaN)).toBeNaN();
    expect(erfc(0)).toBe(1);
    expect(erfc(Number.POSITIVE_INFINITY)).toBe(0);
    expect(erfc(Number.NEGATIVE_INFINITY)).toBe(2);
  });

  it('matches mpmath erfc to 2e-14 relative (fixture, scripts/peak/erfc_chebyshev.py)', () => {
    for (const { x, erfc: expected } of fixture.points) {
      near(`erfc(${x})`, erfc(x), expected, 2e-14 * Math.abs(expected) + 1e-300);
    }
  });
});

describe('normal distribution helpers', () => {
  it('Φ(1) = 0.8413447460685429, Φ(−1.96) = 0.024997895148220435 (A&S Table 26.1)', () => {
    near('Φ(1)', normalCdf(1), 0.8413447460685429, 1e-15);
    near('Φ(−1.96)', normalCdf(-1.96), 0.024997895148220435, 1e-16);
    expect(normalCdf(40)).toBe(1);
    expect(normalCdf(-40)).toBe(0);
  });

  it('mean of Φ over a linear stretch equals a fine numerical average (close and far ends)', () => {
    const cases: Array<[number, number]> = [
      [-3, 2],
      [0.1, 0.12],
      [-0.03, 0.03],
      [5, 12],
      [-12, -5],
      [-20, 20],
      [1.5, 1.5000001],
    ];
    for (const [t0, t1] of cases) {
      // Composite Simpson on 20 000 intervals.
      const m = 20000;
      const h = (t1 - t0) / m;
      let sum = normalCdf(t0) + normalCdf(t1);
      for (let i = 1; i < m; i++) sum += (i % 2 ? 4 : 2) * normalCdf(t0 + i * h);
      const expected = (sum * h) / 3 / (t1 - t0);
      near(`mean Φ on [${t0}, ${t1}]`, meanNormalCdf(t0, t1), expected, 1e-12);
    }
  });

  it('φ(0) = 1/√(2π)', () => near('φ(0)', normalPdf(0), 0.3989422804014327, 1e-16));
});

describe('Gauss–Legendre rule', () => {
  it('integrates x^k exactly for k ≤ 2n − 1 on [−1, 1]', () => {
    for (const n of [1, 2, 4, 8, 16]) {
      const { nodes, weights } = gaussLegendre(n);
      for (let k = 0; k <= 2 * n - 1; k++) {
        let sum = 0;
        for (let i = 0; i < n; i++) sum += weights[i] * nodes[i] ** k;
        const exact = k % 2 ? 0 : 2 / (k + 1);
        near(`n=${n} k=${k}`, sum, exact, 1e-14);
      }
    }
  });
});
