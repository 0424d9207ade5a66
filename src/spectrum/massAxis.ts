// Mass-axis fit: reference m/z against observed m/z by least squares, straight line (the engine's centred
// leastSquares) or quadratic (Householder QR on the centred and scaled Vandermonde matrix, so m/z ≈ 500 squared
// costs no digits; G. H. Golub, C. F. Van Loan, Matrix Computations, 4th ed., 2013, §5.3).
import { leastSquares } from '../engine/index';

export interface MassAxisPoint {
  observed: number;
  reference: number;
}

export interface MassAxisFit {
  order: 1 | 2;
  /** reference ≈ c0 + c1·observed (+ c2·observed²). */
  coefficients: { c0: number; c1: number; c2?: number };
  /** The fitted reference m/z for an observed m/z (evaluated in centred form). */
  predict(observed: number): number;
  /** (reference − fitted)/reference × 10⁶, one per point, in input order. */
  residualsPpm: number[];
  /** reference − fitted, u. */
  residualsU: number[];
  rmsPpm: number;
  maxAbsPpm: number;
}

function checkPoints(points: MassAxisPoint[], order: 1 | 2): void {
  if (order !== 1 && order !== 2) throw new Error(`order = ${String(order)} is out of range; accepted: 1 (straight line) or 2 (quadratic)`);
  if (!Array.isArray(points)) throw new Error('points: expected a list of { observed, reference } m/z pairs');
  const needed = order + 2;
  if (points.length < needed) {
    throw new Error(
      `points: ${points.length} given; an order-${order} fit needs at least ${needed} (${order + 1} coefficients and one more to check them)`,
    );
  }
  points.forEach((p, i) => {
    for (const key of ['observed', 'reference'] as const) {
      const v = p?.[key];
      if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0 || v > 1e7) {
        throw new Error(`points[${i}].${key} = ${String(v)} is out of range; accepted: an m/z > 0 and ≤ 1e7`);
      }
    }
  });
  const seen = new Map<number, number>();
  points.forEach((p, i) => {
    const before = seen.get(p.observed);
    if (before !== undefined) {
      throw new Error(`points[${i}].observed = ${p.observed} repeats points[${before}].observed; each observed m/z may appear once`);
    }
    seen.set(p.observed, i);
  });
}

/** Least-squares solution of A·b = y (A: m × k, column-major) by Householder QR. */
function solveQr(columns: Float64Array[], y: Float64Array): Float64Array {
  const k = columns.length;
  const m = y.length;
  const a = columns.map((c) => Float64Array.from(c));
  const rhs = Float64Array.from(y);
  for (let j = 0; j < k; j++) {
    let norm = 0;
    for (let i = j; i < m; i++) norm += a[j][i] * a[j][i];
    norm = Math.sqrt(norm);
    if (!(norm > 0)) throw new Error('points: the observed m/z values do not determine the fit (too few distinct values)');
    const alpha = a[j][j] > 0 ? -norm : norm;
    const v = new Float64Array(m);
    for (let i = j; i < m; i++) v[i] = a[j][i];
    v[j] -= alpha;
    let vv = 0;
    for (let i = j; i < m; i++) vv += v[i] * v[i];
    if (vv === 0) continue;
    const reflect = (col: Float64Array): void => {
      let dot = 0;
      for (let i = j; i < m; i++) dot += v[i] * col[i];
      const f = (2 * dot) / vv;
      for (let i = j; i < m; i++) col[i] -= f * v[i];
    };
    for (let c = j; c < k; c++) reflect(a[c]);
    reflect(rhs);
  }
  const b = new Float64Array(k);
  for (let j = k - 1; j >= 0; j--) {
    let s = rhs[j];
    for (let c = j + 1; c < k; c++) s -= a[c][j] * b[c];
    if (Math.abs(a[j][j]) < 1e-12) throw new Error('points: the observed m/z values do not determine the fit (too few distinct values)');
    b[j] = s / a[j][j];
  }
  return b;
}

/** Fits reference m/z against observed m/z (order 1: line, order 2: quadratic). */
export function fitMassAxis(points: MassAxisPoint[], order: 1 | 2): MassAxisFit {
  checkPoints(points, order);
  const xs = points.map((p) => p.observed);
  const ys = points.map((p) => p.reference);
  let predict: (x: number) => number;
  let coefficients: MassAxisFit['coefficients'];
  if (order === 1) {
    const line = leastSquares(xs, ys);
    if (!line) throw new Error('points: the observed m/z values do not determine a line');
    predict = (x) => line.intercept + line.slope * x;
    coefficients = { c0: line.intercept, c1: line.slope };
  } else {
    const n = xs.length;
    const mean = xs.reduce((s, x) => s + x, 0) / n;
    let spread = 0;
    for (const x of xs) spread = Math.max(spread, Math.abs(x - mean));
    const t = Float64Array.from(xs, (x) => (x - mean) / spread);
    const b = solveQr([new Float64Array(n).fill(1), t, Float64Array.from(t, (v) => v * v)], Float64Array.from(ys));
    predict = (x) => {
      const u = (x - mean) / spread;
      return b[0] + u * (b[1] + u * b[2]);
    };
    const s2 = spread * spread;
    coefficients = {
      c0: b[0] - (b[1] * mean) / spread + (b[2] * mean * mean) / s2,
      c1: b[1] / spread - (2 * b[2] * mean) / s2,
      c2: b[2] / s2,
    };
  }
  const residualsU = points.map((p) => p.reference - predict(p.observed));
  const residualsPpm = points.map((p, i) => (residualsU[i] / p.reference) * 1e6);
  const rmsPpm = Math.sqrt(residualsPpm.reduce((s, r) => s + r * r, 0) / residualsPpm.length);
  const maxAbsPpm = residualsPpm.reduce((m, r) => Math.max(m, Math.abs(r)), 0);
  const check = (x: number): number => {
    if (typeof x !== 'number' || !Number.isFinite(x)) throw new Error(`observed = ${String(x)} is out of range; accepted: a finite m/z`);
    return predict(x);
  };
  return { order, coefficients, predict: check, residualsPpm, residualsU, rmsPpm, maxAbsPpm };
}
