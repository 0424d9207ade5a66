// Characteristic exponent β of the Mathieu equation w'' + (a − 2q cos 2ξ) w = 0 (DLMF 28.2.1), by Hill's
// infinite determinant (E. T. Whittaker & G. N. Watson, A Course of Modern Analysis, 4th ed. 1927, §19.42;
// DLMF §28.12 area):  sin²(πν/2) = Δ(0) · sin²(π√a/2),  Δ(0) = det[δ_rs + γ_r (δ_{r,s+1} + δ_{r,s−1})],
// γ_r = q/((2r)² − a), r ∈ ℤ. The tridiagonal determinant is an O(N) three-term recurrence.
//   • Rows r = ±r*, r* = round(√a/2), are left unnormalised (diagonal 4r*² − a, off-diagonals q) and the
//     matching factor is taken out of sin²(π√a/2) analytically, so a near 4r² has no pole (and a < 0 uses
//     sinh in place of sin).
//   • Rows beyond |r| = N add the factor exp(−2 Σ_{k≥N} γ_k γ_{k+1}) (first order in the small products);
//     that sum is summed in closed form through Hurwitz zeta asymptotics (DLMF 25.11.43), which turns the
//     O(N⁻³) truncation error of the plain determinant into O(q⁴ N⁻⁷).
// β(a, −q) = β(a, q) (shift ξ → ξ + π/2), so |q| is used throughout.
import { countCharacteristicValuesBelow } from './characteristicValues';
import { checkNumber } from './validate';

/** Accepted |a| and |q| for the exponent (far beyond any mass filter; keeps the growth factor finite). */
export const MAX_ABS_A_EXPONENT = 1000;
export const MAX_ABS_Q_EXPONENT = 1000;

const HALF_PI = Math.PI / 2;
const RESCALE = 2 ** 500;

/** sin x / x, stable near 0. */
function sinc(x: number): number {
  return Math.abs(x) < 1e-4 ? 1 - (x * x) / 6 : Math.sin(x) / x;
}
/** sinh x / x, stable near 0. */
function sinhc(x: number): number {
  return Math.abs(x) < 1e-4 ? 1 + (x * x) / 6 : Math.sinh(x) / x;
}

/** Σ_{k≥N} γ_k γ_{k+1} with γ_k = q/(4k² − a), via x = k + ½:
 *  (4k² − a)(4(k+1)² − a) = 16 (x⁴ − A x² + B), A = a/2 + ½, B = (a − 1)²/16, expanded in 1/x² as
 *  Σ_j e_j x^(−4−2j), and each Σ_k x^(−s) = ζ(s, N + ½) by the Hurwitz zeta asymptotic series
 *  ζ(s, w) ≈ w^(1−s)/(s−1) + w^(−s)/2 + Σ B_2k/(2k)! · s(s+1)…(s+2k−2) · w^(−s−2k+1) (DLMF 25.11.43). */
function tailSum(a: number, q: number, n: number): number {
  const capitalA = a / 2 + 0.5;
  const capitalB = ((a - 1) * (a - 1)) / 16;
  const w = n + 0.5;
  const inverseW = 1 / w;
  const inverseW2 = inverseW * inverseW;
  let ws = inverseW2 * inverseW2; // w^(−s), s = 4 + 2j
  let previous = 0;
  let current = 1; // e_j
  let sum = 0;
  for (let j = 0; j < 14; j++) {
    const s = 4 + 2 * j;
    const zeta =
      ws *
      (w / (s - 1) +
        0.5 +
        inverseW *
          ((s / 12) +
            inverseW2 *
              ((-s * (s + 1) * (s + 2)) / 720 +
                (inverseW2 * (s * (s + 1) * (s + 2) * (s + 3) * (s + 4))) / 30240)));
    const term = current * zeta;
    sum += term;
    if (Math.abs(term) < 1e-17 * Math.abs(sum)) break;
    const next = capitalA * current - capitalB * previous;
    previous = current;
    current = next;
    ws *= inverseW2;
  }
  return ((q * q) / 16) * sum;
}

/** Number of rows each side of r = 0 kept explicitly. */
function hillSize(a: number, absQ: number, rStar: number): number {
  return Math.max(rStar + 8, Math.ceil(Math.sqrt(8 * (Math.abs(a) + 1))), Math.ceil(20 * Math.pow(Math.max(1, absQ), 4 / 7)));
}

/** sin²(πν/2) as mantissa · RESCALE^exponent (the determinant can be huge deep in unstable zones). */
export interface HillValue {
  mantissa: number;
  exponent: number;
}

/** Hill's sin²(πν/2) for the Mathieu equation; inputs unchecked (internal). */
export function hillSinSquared(a: number, q: number): HillValue {
  const absQ = Math.abs(q);
  const rStar = a > 0 ? Math.round(Math.sqrt(a) / 2) : 0;
  const n = hillSize(a, absQ, rStar);
  // Three-term recurrence f_k = d_k f_{k−1} − c_{k−1} c_k f_{k−2} over rows r = −n … −1 only: the matrix is
  // symmetric about r = 0, so with L_k = det(rows −n … k) the full determinant is
  // L_{−1} · (d_0 L_{−1} − 2 p L_{−2}), p = c_0 c_1 the coupling product of rows 0 and ±1.
  let scale = 0;
  let previous = 1; // L_{k−2}
  let current = 1; // L_{k−1} (empty determinant)
  let previousOffDiagonal = 0;
  for (let r = -n; r <= -1; r++) {
    const pivotRow = r === -rStar;
    const denominator = 4 * r * r - a;
    const diagonal = pivotRow ? denominator : 1;
    const offDiagonal = pivotRow ? absQ : absQ / denominator;
    const next = diagonal * current - previousOffDiagonal * offDiagonal * previous;
    previous = current;
    current = next;
    previousOffDiagonal = offDiagonal;
    if (Math.abs(current) > RESCALE) {
      current /= RESCALE;
      previous /= RESCALE;
      scale++;
    } else if (current !== 0 && Math.abs(current) < 1 / RESCALE && Math.abs(previous) < 1 / RESCALE) {
      current *= RESCALE;
      previous *= RESCALE;
      scale--;
    }
  }
  const centreDiagonal = rStar === 0 ? -a : 1;
  const centreOffDiagonal = rStar === 0 ? absQ : absQ / -a;
  const full = current * (centreDiagonal * current - 2 * previousOffDiagonal * centreOffDiagonal * previous);
  scale *= 2;
  const determinant = full * Math.exp(-2 * tailSum(a, absQ, n));
  // G = sin²(π√a/2) / Π_{r=±r*} (4r² − a), smooth through a = 4r*².
  let g: number;
  if (rStar === 0) {
    const h = a >= 0 ? sinc(HALF_PI * Math.sqrt(a)) : sinhc(HALF_PI * Math.sqrt(-a));
    g = -HALF_PI * HALF_PI * h * h;
  } else {
    const s = Math.sqrt(a);
    const epsilon = s - 2 * rStar;
    const h = sinc(HALF_PI * epsilon) / (2 * rStar + s);
    g = HALF_PI * HALF_PI * h * h;
  }
  return { mantissa: determinant * g, exponent: scale };
}

/** Full description of the exponent at one (a, q). */
export interface ExponentResult {
  /** True when all solutions stay bounded (0 ≤ sin²(πν/2) ≤ 1). */
  stable: boolean;
  /** β ≥ 0 in zone n < β < n + 1 when stable; null when unstable. */
  beta: number | null;
  /** Stable zone n (0 for the first region) when stable; null when unstable. */
  zone: number | null;
  /** |Floquet multiplier| per RF period (Δξ = π): 1 when stable, e^{πμ} > 1 when unstable. */
  growthPerPeriod: number;
  /** ln of growthPerPeriod (finite even where growthPerPeriod overflows). */
  logGrowthPerPeriod: number;
  /** RF periods for the amplitude to grow tenfold, ln 10 / ln(growth) — how fast an ion is lost; null when stable. */
  periodsPerTenfoldGrowth: number | null;
  /** cos πν = ½ trace of the one-period monodromy matrix (Floquet); capped to ±1e300. */
  halfTrace: number;
}

/** Internal, unchecked: exponent from Hill's determinant plus the zone from a Sturm count. */
export function exponentUnchecked(a: number, q: number): ExponentResult {
  const hill = hillSinSquared(a, q);
  if (hill.exponent < 0) {
    // A determinant scaled down below 1/RESCALE is zero to double precision: sin²(πν/2) = 0 then.
    hill.mantissa *= Math.pow(RESCALE, hill.exponent);
    hill.exponent = 0;
  }
  if (hill.exponent === 0 && hill.mantissa >= 0 && hill.mantissa <= 1) {
    const f = hill.mantissa;
    // θ = acos(1 − 2F)/π written with asin for accuracy near F = 0 and F = 1.
    const theta = f <= 0.5 ? Math.asin(Math.sqrt(f)) / HALF_PI : 1 - Math.asin(Math.sqrt(1 - f)) / HALF_PI;
    const count = countCharacteristicValuesBelow(a, q);
    let beta: number;
    let zone: number;
    if (count % 2 === 1) {
      zone = (count - 1) / 2;
      beta = zone % 2 === 0 ? zone + theta : zone + 1 - theta;
    } else {
      // On a boundary within rounding: β is the integer shared by both neighbours.
      beta = count / 2;
      zone = Math.max(0, count / 2 - (theta < 0.5 ? 0 : 1));
    }
    return {
      stable: true,
      beta,
      zone,
      growthPerPeriod: 1,
      logGrowthPerPeriod: 0,
      periodsPerTenfoldGrowth: null,
      halfTrace: 1 - 2 * f,
    };
  }
  // |cos πν| > 1: cosh(πμ) = |1 − 2F|.
  let logGrowth: number;
  let halfTrace: number;
  if (hill.exponent === 0) {
    const c = 1 - 2 * hill.mantissa;
    const absC = Math.abs(c);
    logGrowth = Math.log(absC + Math.sqrt((absC - 1) * (absC + 1)));
    halfTrace = c;
  } else {
    // |c| ≈ 2F is astronomically large: ln(|c| + √(c² − 1)) = ln 2|c|.
    const logF = Math.log(Math.abs(hill.mantissa)) + hill.exponent * Math.log(RESCALE);
    logGrowth = 2 * Math.LN2 + logF;
    halfTrace = (hill.mantissa > 0 ? -1 : 1) * Math.min(1e300, Math.exp(Math.min(690, Math.LN2 + logF)));
  }
  return {
    stable: false,
    beta: null,
    zone: null,
    growthPerPeriod: Math.min(Number.MAX_VALUE, Math.exp(logGrowth)),
    logGrowthPerPeriod: logGrowth,
    // logGrowth > 0 here except exactly on an edge (|c| = 1), where growth is only linear.
    periodsPerTenfoldGrowth: logGrowth > 0 ? Math.LN10 / logGrowth : Number.MAX_VALUE,
    halfTrace,
  };
}

function checkAQ(a: number, q: number): void {
  checkNumber('a', a, { min: -MAX_ABS_A_EXPONENT, max: MAX_ABS_A_EXPONENT });
  checkNumber('q', q, { min: -MAX_ABS_Q_EXPONENT, max: MAX_ABS_Q_EXPONENT });
}

/**
 * Characteristic exponent β of the Mathieu equation at (a, q): β ≥ 0 (β in zone n < β < n + 1) when the
 * motion is stable, null when unstable. For the mass filter use β_x = β(a, q), β_y = β(−a, −q).
 * @param a Mathieu a, |a| ≤ 1000
 * @param q Mathieu q, |q| ≤ 1000
 */
export function stabilityExponent(a: number, q: number): number | null {
  checkAQ(a, q);
  return exponentUnchecked(a, q).beta;
}

/** β, its zone, and the growth factor per RF period where unstable (how fast an ion is lost). */
export function characteristicExponent(a: number, q: number): ExponentResult {
  checkAQ(a, q);
  return exponentUnchecked(a, q);
}

/** Grid of β(a, q) over a rectangle, chart-ready. */
export interface ExponentGrid {
  /** a values, one per row (length aCount). */
  a: Float64Array;
  /** q values, one per column (length qCount). */
  q: Float64Array;
  /** β row-major (index i·qCount + j for a[i], q[j]); −1 marks an unstable cell. */
  beta: Float64Array;
  /** ln growth per RF period, row-major; 0 in stable cells. */
  logGrowth: Float64Array;
}

/**
 * β over an aCount × qCount grid of evenly spaced (a, q) (ends included). Unstable cells hold −1 in `beta`
 * (a typed array cannot hold null) and their ln growth per RF period in `logGrowth`.
 */
export function exponentGrid(p: {
  aMin: number;
  aMax: number;
  aCount: number;
  qMin: number;
  qMax: number;
  qCount: number;
}): ExponentGrid {
  const range = { min: -MAX_ABS_A_EXPONENT, max: MAX_ABS_A_EXPONENT };
  const aMin = checkNumber('aMin', p?.aMin, range);
  const aMax = checkNumber('aMax', p?.aMax, { ...range, min: aMin });
  const qMin = checkNumber('qMin', p?.qMin, range);
  const qMax = checkNumber('qMax', p?.qMax, { ...range, min: qMin });
  const aCount = checkNumber('aCount', p?.aCount, { min: 1, max: 4096, integer: true });
  const qCount = checkNumber('qCount', p?.qCount, { min: 1, max: 4096, integer: true });
  const aValues = new Float64Array(aCount);
  const qValues = new Float64Array(qCount);
  for (let i = 0; i < aCount; i++) aValues[i] = aCount === 1 ? aMin : aMin + ((aMax - aMin) * i) / (aCount - 1);
  for (let j = 0; j < qCount; j++) qValues[j] = qCount === 1 ? qMin : qMin + ((qMax - qMin) * j) / (qCount - 1);
  const beta = new Float64Array(aCount * qCount);
  const logGrowth = new Float64Array(aCount * qCount);
  for (let i = 0; i < aCount; i++) {
    for (let j = 0; j < qCount; j++) {
      const result = exponentUnchecked(aValues[i], qValues[j]);
      beta[i * qCount + j] = result.beta ?? -1;
      logGrowth[i * qCount + j] = result.logGrowthPerPeriod;
    }
  }
  return { a: aValues, q: qValues, beta, logGrowth };
}

/** β in both directions of the mass filter over a grid, chart-ready. */
export interface MassFilterGrid {
  a: Float64Array;
  q: Float64Array;
  /** β_x = β(a, q), row-major (i·qCount + j); −1 where x is unstable. */
  betaX: Float64Array;
  /** β_y = β(−a, −q), row-major; −1 where y is unstable. */
  betaY: Float64Array;
  /** 1 where both directions are stable (any zones), else 0: shades the first and the higher regions. */
  stable: Uint8Array;
}

/**
 * β_x and β_y of the mass filter over a grid of (a, q) (same arguments as exponentGrid). The first region
 * and the higher stability regions are the cells where both are stable.
 */
export function massFilterGrid(p: {
  aMin: number;
  aMax: number;
  aCount: number;
  qMin: number;
  qMax: number;
  qCount: number;
}): MassFilterGrid {
  const x = exponentGrid(p);
  const aMirrored = { ...p, aMin: -p.aMax, aMax: -p.aMin };
  const yReversed = exponentGrid(aMirrored);
  const aCount = p.aCount;
  const qCount = p.qCount;
  const betaY = new Float64Array(aCount * qCount);
  const stable = new Uint8Array(aCount * qCount);
  for (let i = 0; i < aCount; i++) {
    // Row i of x is a[i]; the y value at a[i] is β(−a[i], q), row aCount−1−i of the mirrored grid.
    // (β depends on |q| only, so −q needs no second mirror.)
    const mirroredRow = aCount - 1 - i;
    for (let j = 0; j < qCount; j++) {
      const value = yReversed.beta[mirroredRow * qCount + j];
      betaY[i * qCount + j] = value;
      stable[i * qCount + j] = value >= 0 && x.beta[i * qCount + j] >= 0 ? 1 : 0;
    }
  }
  return { a: x.a, q: x.q, betaX: x.beta, betaY, stable };
}
