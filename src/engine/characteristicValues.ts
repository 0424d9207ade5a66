// Mathieu characteristic values a_n(q) (even, ce_n) and b_n(q) (odd, se_n), DLMF §28.2(v), A&S ch. 20.
// Each is an eigenvalue of one of four symmetric tridiagonal matrices from the Fourier recurrences
// (DLMF 28.4.5–28.4.8), found by Sturm-sequence bisection (Wilkinson, The Algebraic Eigenvalue Problem,
// 1965, §5.37; Barth, Martin & Wilkinson, Numer. Math. 9 (1967) 386). The matrix is symmetrised with the
// single factor √2 in the first off-diagonal of the a_{2n} matrix. Negative q is handled by the matrices
// themselves (their spectra give DLMF 28.2.21–28.2.22 automatically).
import { brentRoot } from './rootFinding';
import { checkNumber } from './validate';

/** Which recurrence: even/odd in ξ (cos/sin series) and period π (even multiples) or 2π (odd multiples). */
export type RecurrenceKind = 'aEven' | 'aOdd' | 'bOdd' | 'bEven';

/** Largest accepted |q| for characteristic values (matrix size grows as 2√|q|). */
export const MAX_ABS_Q = 1e5;
/** Largest accepted order n. */
export const MAX_ORDER = 200;

/** Matrix size enough for eigenvalue index k at this q: Fourier coefficients fall by q/(4m²) per step, which
 * is below 1/16 from m = 2√|q| on, so 10 further terms put the truncation error (≈ coefficient²) far below
 * double precision. */
export function truncationSize(index: number, q: number): number {
  return index + Math.ceil(2 * Math.sqrt(Math.abs(q))) + 10;
}

/** Diagonal of the recurrence matrix (DLMF 28.4.5–28.4.8). */
function diagonal(kind: RecurrenceKind, m: number, q: number): number {
  switch (kind) {
    case 'aEven':
      return 4 * m * m;
    case 'aOdd':
      return m === 0 ? 1 + q : (2 * m + 1) * (2 * m + 1);
    case 'bOdd':
      return m === 0 ? 1 - q : (2 * m + 1) * (2 * m + 1);
    case 'bEven':
      return (2 * m + 2) * (2 * m + 2);
  }
}

/** Squared off-diagonal between rows m and m+1 (the a_{2n} matrix carries 2q² in its first entry). */
function offDiagonalSquared(kind: RecurrenceKind, m: number, q: number): number {
  return kind === 'aEven' && m === 0 ? 2 * q * q : q * q;
}

/**
 * Number of eigenvalues below x of the size-n recurrence matrix (Sturm count through the LDLᵀ pivots).
 * A zero pivot is nudged to a tiny negative number, the usual safeguard (Kahan 1966).
 */
export function sturmCount(kind: RecurrenceKind, q: number, n: number, x: number): number {
  let count = 0;
  let pivot = diagonal(kind, 0, q) - x;
  if (pivot === 0) pivot = -1e-300;
  if (pivot < 0) count++;
  for (let m = 1; m < n; m++) {
    pivot = diagonal(kind, m, q) - x - offDiagonalSquared(kind, m - 1, q) / pivot;
    if (pivot === 0) pivot = -1e-300;
    if (pivot < 0) count++;
  }
  return count;
}

/** det(T − xI) divided by Π max(1, |d_m − shift|): same sign and roots, no overflow near x ≈ shift. */
function scaledDeterminant(kind: RecurrenceKind, q: number, n: number, x: number, shift: number): number {
  let product = 1;
  let d = diagonal(kind, 0, q);
  let pivot = d - x;
  if (pivot === 0) pivot = -1e-300;
  product *= pivot / Math.max(1, Math.abs(d - shift));
  for (let m = 1; m < n; m++) {
    d = diagonal(kind, m, q);
    pivot = d - x - offDiagonalSquared(kind, m - 1, q) / pivot;
    if (pivot === 0) pivot = -1e-300;
    product *= pivot / Math.max(1, Math.abs(d - shift));
  }
  return product;
}

/**
 * The index-th (0-based, ascending) eigenvalue of the recurrence matrix: Sturm bisection until the
 * eigenvalue is isolated, then Brent's method on the (scaled) characteristic polynomial, which has a
 * single simple root in the isolating interval. Falls back to plain bisection if the polynomial misbehaves.
 */
export function recurrenceEigenvalue(kind: RecurrenceKind, index: number, q: number): number {
  const n = truncationSize(index, q);
  // Gershgorin bounds of the whole spectrum.
  let lo = Infinity;
  let hi = -Infinity;
  for (let m = 0; m < n; m++) {
    const left = m > 0 ? Math.sqrt(offDiagonalSquared(kind, m - 1, q)) : 0;
    const right = m < n - 1 ? Math.sqrt(offDiagonalSquared(kind, m, q)) : 0;
    const d = diagonal(kind, m, q);
    lo = Math.min(lo, d - left - right);
    hi = Math.max(hi, d + left + right);
  }
  // Characteristic values never fall below −2|q| (the potential minimum); it tightens the bracket.
  lo = Math.max(lo, -2 * Math.abs(q) - 1);
  let countLo = 0;
  let countHi = n;
  for (let iteration = 0; iteration < 2000; iteration++) {
    if (countLo === index && countHi === index + 1) break;
    const mid = 0.5 * (lo + hi);
    if (mid <= lo || mid >= hi) return 0.5 * (lo + hi);
    const count = sturmCount(kind, q, n, mid);
    if (count > index) {
      hi = mid;
      countHi = count;
    } else {
      lo = mid;
      countLo = count;
    }
  }
  const shift = 0.5 * (lo + hi);
  const f = (x: number) => scaledDeterminant(kind, q, n, x, shift);
  const fLo = f(lo);
  const fHi = f(hi);
  if (Number.isFinite(fLo) && Number.isFinite(fHi) && fLo * fHi <= 0) {
    const root = brentRoot(f, lo, hi, 1e-16 * Math.max(1, Math.abs(shift)));
    if (Number.isFinite(root)) return root;
  }
  for (let iteration = 0; iteration < 2000; iteration++) {
    const mid = 0.5 * (lo + hi);
    if (mid <= lo || mid >= hi) break;
    if (sturmCount(kind, q, n, mid) > index) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * Characteristic value a_n(q) of the even Mathieu function ce_n(ξ, q) (DLMF 28.2.16; A&S 20.1.3).
 * @param order n = 0, 1, 2, … (up to 200)
 * @param q Mathieu parameter, any sign, |q| ≤ 1e5
 * Accuracy about 1e-13 absolute for |a| ≤ 1 and 1e-14 relative above (tests: A&S 20.2.25, scipy, DLMF 28.8.1).
 */
export function mathieuA(order: number, q: number): number {
  checkNumber('order', order, { min: 0, max: MAX_ORDER, integer: true });
  checkNumber('q', q, { min: -MAX_ABS_Q, max: MAX_ABS_Q });
  return order % 2 === 0
    ? recurrenceEigenvalue('aEven', order / 2, q)
    : recurrenceEigenvalue('aOdd', (order - 1) / 2, q);
}

/**
 * Characteristic value b_n(q) of the odd Mathieu function se_n(ξ, q) (DLMF 28.2.17; A&S 20.1.3).
 * @param order n = 1, 2, 3, … (up to 200)
 * @param q Mathieu parameter, any sign, |q| ≤ 1e5
 */
export function mathieuB(order: number, q: number): number {
  checkNumber('order', order, { min: 1, max: MAX_ORDER, integer: true });
  checkNumber('q', q, { min: -MAX_ABS_Q, max: MAX_ABS_Q });
  return order % 2 === 1
    ? recurrenceEigenvalue('bOdd', (order - 1) / 2, q)
    : recurrenceEigenvalue('bEven', order / 2 - 1, q);
}

/** Unchecked fast paths for the engine's own loops (inputs already validated). */
export function a0Unchecked(q: number): number {
  return recurrenceEigenvalue('aEven', 0, q);
}
export function b1Unchecked(q: number): number {
  return recurrenceEigenvalue('bOdd', 0, q);
}

/**
 * Number of characteristic values (all a_n and b_n together) below a at this q. For q ≠ 0 they interlace
 * a0 < b1 < a1 < b2 < a2 < … (|q| replaces q; DLMF 28.2.21), so an odd count means (a, q) lies in a
 * stable zone, index (count − 1)/2; an even count means an unstable zone.
 */
export function countCharacteristicValuesBelow(a: number, q: number): number {
  const absQ = Math.abs(q);
  // Index bound: values a_n, b_n near n² for n² ≫ |q|, so n up to √(a + 2|q|) + 2 matters.
  const nMax = Math.ceil(Math.sqrt(Math.max(0, a + 2 * absQ))) + 2;
  const size = truncationSize(Math.ceil(nMax / 2), absQ); // each matrix holds every other order
  let count = 0;
  for (const kind of KINDS) if (a > spectrumLowerBound(kind, absQ, size)) count += sturmCount(kind, absQ, size, a);
  return count;
}

const KINDS: readonly RecurrenceKind[] = ['aEven', 'aOdd', 'bOdd', 'bEven'];

/** Gershgorin lower bound of the recurrence matrix's spectrum (rows stop mattering once d_m − 2√2|q| grows). */
function spectrumLowerBound(kind: RecurrenceKind, q: number, size: number): number {
  let bound = Infinity;
  let left = 0;
  for (let m = 0; m < size; m++) {
    const d = diagonal(kind, m, q);
    if (d - 2 * Math.SQRT2 * q > bound) break; // later rows have larger diagonals and the same off-diagonals
    const right = m < size - 1 ? Math.sqrt(offDiagonalSquared(kind, m, q)) : 0;
    bound = Math.min(bound, d - left - right);
    left = right;
  }
  return bound;
}
