// Ordinary least squares y = intercept + slope·x, shared by the leak tools (rate of rise, A/t + B) and the
// visit-log trends. x is centred before summing, because epoch seconds (~1.7e9) squared lose digits in
// double precision.
import { InputRangeError } from './validate';

export interface LinearFit {
  n: number;
  slope: number;
  intercept: number;
  /**
   * Coefficient of determination 1 − SSres/SStot. When y does not vary at all the line fits it exactly
   * (SSres = 0), so r² = 1.
   */
  r2: number;
  /** Residual standard deviation √(SSres/(n−2)); 0 for n = 2. */
  residualStd: number;
}

/**
 * Least-squares line through (xs, ys). Undefined for fewer than two points or when all x are equal (no line is
 * defined); a non-finite entry is refused with an InputRangeError naming it.
 */
export function leastSquares(xs: ArrayLike<number>, ys: ArrayLike<number>): LinearFit | undefined {
  if (!xs || !ys || typeof xs.length !== 'number' || typeof ys.length !== 'number') {
    throw new InputRangeError(!xs || typeof xs.length !== 'number' ? 'xs' : 'ys', !xs || typeof xs.length !== 'number' ? xs : ys, 'a list of finite numbers');
  }
  const n = Math.min(xs.length, ys.length);
  for (let i = 0; i < n; i++) {
    if (typeof xs[i] !== 'number' || !Number.isFinite(xs[i])) throw new InputRangeError(`xs[${i}]`, xs[i], 'a finite number');
    if (typeof ys[i] !== 'number' || !Number.isFinite(ys[i])) throw new InputRangeError(`ys[${i}]`, ys[i], 'a finite number');
  }
  if (n < 2) return undefined;
  let sx = 0, sy = 0;
  for (let i = 0; i < n; i++) { sx += xs[i]; sy += ys[i]; }
  const mx = sx / n, my = sy / n;
  let sxx = 0, sxy = 0, syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = xs[i] - mx, dy = ys[i] - my;
    sxx += dx * dx; sxy += dx * dy; syy += dy * dy;
  }
  if (!(sxx > 0)) return undefined;
  const slope = sxy / sxx;
  const intercept = my - slope * mx;
  let ssRes = 0;
  for (let i = 0; i < n; i++) {
    const r = ys[i] - (intercept + slope * xs[i]);
    ssRes += r * r;
  }
  const r2 = syy > 0 ? Math.max(0, 1 - ssRes / syy) : 1;
  return { n, slope, intercept, r2, residualStd: n > 2 ? Math.sqrt(ssRes / (n - 2)) : 0 };
}
