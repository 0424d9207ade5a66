// Mass-axis fit (src/spectrum/massAxis.ts) against hand-computed least-squares solutions.
import { describe, expect, it } from 'vitest';
import { fitMassAxis, ionMz } from '../../../src/spectrum/index';

function near(label: string, actual: number, expected: number, tolerance: number): void {
  const difference = Math.abs(actual - expected);
  if (!(difference <= tolerance)) throw new Error(`${label}: got ${actual}, expected ${expected}, |Δ| = ${difference} > ${tolerance}`);
}

describe('fitMassAxis', () => {
  it('order 1, hand-computed: (1,1) (2,3) (3,2) (4,4) → slope Sxy/Sxx = 4/5, intercept 2.5 − 0.8·2.5 = 0.5', () => {
    const fit = fitMassAxis(
      [{ observed: 1, reference: 1 }, { observed: 2, reference: 3 }, { observed: 3, reference: 2 }, { observed: 4, reference: 4 }],
      1,
    );
    near('c1', fit.coefficients.c1, 0.8, 1e-14);
    near('c0', fit.coefficients.c0, 0.5, 1e-14);
    expect(fit.coefficients.c2).toBeUndefined();
    // Residuals: 1 − 1.3, 3 − 2.1, 2 − 2.9, 4 − 3.7.
    [-0.3, 0.9, -0.9, 0.3].forEach((r, i) => near(`residual ${i}`, fit.residualsU[i], r, 1e-12));
    near('ppm 0', fit.residualsPpm[0], (-0.3 / 1) * 1e6, 1e-6);
    near('max |ppm|', fit.maxAbsPpm, (0.9 / 2) * 1e6, 1e-6);
    // ppm: −0.3/1, 0.9/3, −0.9/2, 0.3/4 (× 10⁶).
    near('rms', fit.rmsPpm, Math.sqrt((0.3e6 ** 2 + 0.3e6 ** 2 + 0.45e6 ** 2 + 0.075e6 ** 2) / 4), 1e-3);
  });

  it('order 2, hand-computed with orthogonal polynomials: y = x² + 0.01 at x = 1 only, x = 1…5', () => {
    // With t = x − 3, P₀ = 1, P₁ = t, P₂ = t² − 2 are orthogonal on t = −2…2 (ΣP₁² = 10, ΣP₂² = 14). The
    // perturbation e = (0.01, 0, 0, 0, 0) projects to 0.002 − 0.002·t + (0.02/14)·P₂, so
    // c2 = 1 + 0.02/14, c1 = −0.002 − 0.12/14, c0 = 0.008 + 0.14/14 = 0.018.
    const points = [1, 2, 3, 4, 5].map((x) => ({ observed: x, reference: x * x + (x === 1 ? 0.01 : 0) }));
    const fit = fitMassAxis(points, 2);
    near('c2', fit.coefficients.c2!, 1 + 0.02 / 14, 1e-12);
    near('c1', fit.coefficients.c1, -0.002 - 0.12 / 14, 1e-12);
    near('c0', fit.coefficients.c0, 0.018, 1e-12);
    near('predict(3)', fit.predict(3), 9 + 0.002 - (0.02 / 14) * 2, 1e-12);
  });

  it('order 2 at m/z 18–502 recovers a known curved axis to < 1e-5 ppm (centring keeps the digits)', () => {
    const truth = (x: number) => 0.03 + 0.9998 * x + 4e-7 * x * x;
    const refs = ['H2O', 'N2', 'Ar', 'CF3', 'C4F9', 'C8F16N', 'C9F20N'].map((f) => ionMz(f));
    // Observed values that the true axis maps onto the references (solve the quadratic).
    const points = refs.map((reference) => {
      const a = 4e-7, b = 0.9998, c = 0.03 - reference;
      return { observed: (-b + Math.sqrt(b * b - 4 * a * c)) / (2 * a), reference };
    });
    const fit = fitMassAxis(points, 2);
    expect(fit.maxAbsPpm).toBeLessThan(1e-5);
    near('c2', fit.coefficients.c2!, 4e-7, 1e-13);
    near('predict(300)', fit.predict(300), truth(300), 1e-9);
    // A straight line through the same points leaves a curved residual of a few hundred ppm at m/z 18.
    const line = fitMassAxis(points, 1);
    expect(line.maxAbsPpm).toBeGreaterThan(100);
  });

  it('refuses too few points, repeated observed values and bad numbers with clear messages', () => {
    const p = (observed: number, reference: number) => ({ observed, reference });
    expect(() => fitMassAxis([p(1, 1), p(2, 2)], 1)).toThrow(/2 given; an order-1 fit needs at least 3/);
    expect(() => fitMassAxis([p(1, 1), p(2, 2), p(3, 3)], 2)).toThrow(/3 given; an order-2 fit needs at least 4/);
    expect(() => fitMassAxis([p(1, 1), p(2, 2), p(2, 2.1)], 1)).toThrow(/points\[2\]\.observed = 2 repeats points\[1\]\.observed/);
    expect(() => fitMassAxis([p(1, 1), p(2, NaN), p(3, 3)], 1)).toThrow(/points\[1\]\.reference = NaN is out of range/);
    expect(() => fitMassAxis([p(1, 1), p(2, 2), p(3, 3)], 3 as 1)).toThrow(/order = 3 is out of range/);
    const fit = fitMassAxis([p(1, 1), p(2, 2), p(3, 3)], 1);
    expect(() => fit.predict(Number.NaN)).toThrow(/observed = NaN/);
  });
});
