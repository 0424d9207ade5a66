/**
 * Fundamental solutions of w'' + (A − 2Q cos 2ξ) w = 0 (DLMF 28.2.1) over one period Δξ = π.
 *
 * Φ(ξ) = [[u, w], [u', w']] with Φ(0) = I; x-motion uses (A, Q) = (a, q), y-motion (−a, −q).
 * Integrator: fourth-order Magnus expansion with two Gauss points (S. Blanes, F. Casas, J. Ros,
 * BIT 40 (2000) 434, eq. for Ω^[4]): Ω = h/2·(A1 + A2) + (√3/12)h²[A2, A1], Φ ← exp(Ω)Φ.
 * The generator is traceless, so exp(Ω) has determinant 1 exactly (up to rounding): the computed
 * one-period matrix M = Φ(π) keeps det M = 1 and hence the stability test |tr M| < 2 of Floquet theory.
 * The exponential of a traceless 2×2 matrix is closed form: exp(Ω) = c·I + s·Ω, with d = −det Ω,
 * c = cosh √d, s = sinh √d/√d (cos, sin for d < 0).
 */

export interface PeriodTable {
  /** Samples per period S: ξ_j = jπ/S, j = 0..S. */
  samples: number;
  /** Rows of Φ(ξ_j): u, w and their ξ-derivatives up, wp, length S + 1 (index S is ξ = π). */
  u: Float64Array;
  w: Float64Array;
  up: Float64Array;
  wp: Float64Array;
  A: number;
  Q: number;
  /** Magnus steps between samples. */
  substeps: number;
}

const SQRT3 = Math.sqrt(3);
const GAUSS_LOW = 0.5 - SQRT3 / 6;
const GAUSS_HIGH = 0.5 + SQRT3 / 6;

/** exp of [[α, β], [γ, −α]] written into out[0..3] row-major. */
function expTraceless(alpha: number, beta: number, gamma: number, out: Float64Array): void {
  const d = alpha * alpha + beta * gamma;
  let c: number;
  let s: number;
  if (Math.abs(d) < 1e-6) {
    // Series: cosh √d = 1 + d/2 + d²/24 + d³/720, sinh √d/√d = 1 + d/6 + d²/120 + d³/5040.
    c = 1 + d * (0.5 + d * (1 / 24 + d / 720));
    s = 1 + d * (1 / 6 + d * (1 / 120 + d / 5040));
  } else if (d > 0) {
    const r = Math.sqrt(d);
    c = Math.cosh(r);
    s = Math.sinh(r) / r;
  } else {
    const r = Math.sqrt(-d);
    c = Math.cos(r);
    s = Math.sin(r) / r;
  }
  out[0] = c + s * alpha;
  out[1] = s * beta;
  out[2] = s * gamma;
  out[3] = c - s * alpha;
}

/** One Magnus step of length h from ξ for the matrix [[m00, m01], [m10, m11]]; returns the step matrix in out. */
export function magnusStep(A: number, Q: number, xi: number, h: number, out: Float64Array): void {
  const g1 = A - 2 * Q * Math.cos(2 * (xi + GAUSS_LOW * h));
  const g2 = A - 2 * Q * Math.cos(2 * (xi + GAUSS_HIGH * h));
  // [A2, A1] = diag(g2 − g1, g1 − g2) for A_i = [[0, 1], [−g_i, 0]].
  const alpha = ((SQRT3 * h * h) / 12) * (g2 - g1);
  expTraceless(alpha, h, -0.5 * h * (g1 + g2), out);
}

/** Tabulate Φ over one period at S samples with `substeps` Magnus steps between samples. */
export function periodTable(A: number, Q: number, samples: number, substeps = 2): PeriodTable {
  const u = new Float64Array(samples + 1);
  const w = new Float64Array(samples + 1);
  const up = new Float64Array(samples + 1);
  const wp = new Float64Array(samples + 1);
  let m00 = 1;
  let m01 = 0;
  let m10 = 0;
  let m11 = 1;
  u[0] = 1;
  wp[0] = 1;
  const h = Math.PI / (samples * substeps);
  const step = new Float64Array(4);
  for (let j = 0; j < samples; j++) {
    for (let k = 0; k < substeps; k++) {
      magnusStep(A, Q, (j * substeps + k) * h, h, step);
      const n00 = step[0] * m00 + step[1] * m10;
      const n01 = step[0] * m01 + step[1] * m11;
      const n10 = step[2] * m00 + step[3] * m10;
      const n11 = step[2] * m01 + step[3] * m11;
      m00 = n00;
      m01 = n01;
      m10 = n10;
      m11 = n11;
    }
    u[j + 1] = m00;
    w[j + 1] = m01;
    up[j + 1] = m10;
    wp[j + 1] = m11;
  }
  return { samples, u, w, up, wp, A, Q, substeps };
}

/** Step matrix scratch for fundamentalAt (overwritten on each call). */
const stepScratch = new Float64Array(4);

/** Φ(ξ) for 0 ≤ ξ ≤ π from the table: one short Magnus step from the sample below (same order of accuracy). */
export function fundamentalAt(table: PeriodTable, xi: number, out: Float64Array): void {
  const spacing = Math.PI / table.samples;
  let j = Math.floor(xi / spacing);
  if (j >= table.samples) j = table.samples - 1;
  if (j < 0) j = 0;
  const rest = xi - j * spacing;
  const steps = Math.max(1, Math.ceil((rest / spacing) * table.substeps));
  let m00 = table.u[j];
  let m01 = table.w[j];
  let m10 = table.up[j];
  let m11 = table.wp[j];
  const step = stepScratch;
  const h = rest / steps;
  for (let k = 0; k < steps && rest > 0; k++) {
    magnusStep(table.A, table.Q, j * spacing + k * h, h, step);
    const n00 = step[0] * m00 + step[1] * m10;
    const n01 = step[0] * m01 + step[1] * m11;
    const n10 = step[2] * m00 + step[3] * m10;
    const n11 = step[2] * m01 + step[3] * m11;
    m00 = n00;
    m01 = n01;
    m10 = n10;
    m11 = n11;
  }
  out[0] = m00;
  out[1] = m01;
  out[2] = m10;
  out[3] = m11;
}

/** One-period (monodromy) matrix M = Φ(π), row-major. */
export function monodromy(table: PeriodTable): Float64Array {
  const s = table.samples;
  return Float64Array.of(table.u[s], table.w[s], table.up[s], table.wp[s]);
}

/** Row-major 2×2 product a·b. */
export function multiply2(a: Float64Array, b: Float64Array): Float64Array {
  return Float64Array.of(
    a[0] * b[0] + a[1] * b[2],
    a[0] * b[1] + a[1] * b[3],
    a[2] * b[0] + a[3] * b[2],
    a[2] * b[1] + a[3] * b[3],
  );
}

/** M^k by repeated squaring. */
export function power2(m: Float64Array, k: number): Float64Array {
  let result: Float64Array = Float64Array.of(1, 0, 0, 1);
  let base: Float64Array = m;
  let e = k;
  while (e > 0) {
    if (e & 1) result = multiply2(result, base);
    e = Math.floor(e / 2);
    if (e > 0) base = multiply2(base, base);
  }
  return result;
}
