/**
 * Special functions and quadrature rules for the transmission integral.
 *
 * Φ is the standard normal distribution function, Ψ(τ) = ∫_{-∞}^{τ} Φ = τΦ(τ) + φ(τ) its integral.
 * erfc(x) = t·exp(−x² + f(t)), t = 2/(2 + x) for x ≥ 0 (the form of W. H. Press et al., Numerical Recipes,
 * 3rd ed., 2007, §6.2.2), with f as a Chebyshev series in 2t − 1 whose coefficients we computed ourselves with
 * mpmath (scripts/peak/erfc_chebyshev.py, degree 26 kept: relative error ≈ 1e-16 before rounding); erfc(−x) = 2 − erfc(x).
 * Checked against the mpmath fixture tests/unit/peak/erfc.fixture.json made by the same script.
 */

const INV_SQRT_2PI = 1 / Math.sqrt(2 * Math.PI);

// scripts/peak/erfc_chebyshev.py, degree 30 table truncated after the term below 1e-16.
const ERFC_CHEBYSHEV = [
  -6.5132685989085472e-1, 6.4196979235649026e-1, 1.9476473204185836e-2, -9.5615147868086316e-3,
  -9.4659534448203687e-4, 3.6683949785276145e-4, 4.2523324806907772e-5, -2.0278578112534243e-5,
  -1.6242900046470255e-6, 1.3036558355805232e-6, 1.5626441722066143e-8, -8.5238095914926543e-8,
  6.5290544390988515e-9, 5.0593434955514689e-9, -9.9136415649303309e-10, -2.2736512229318358e-10,
  9.6467911020155259e-11, 2.3940380830391358e-12, -6.8860275264975447e-12, 8.9448792730883884e-13,
  3.1309213993507742e-13, -1.1270822361426012e-13, 3.8109051986874039e-16, 7.1060976402505253e-15,
  -1.5230282401808004e-15, -9.4575081748730267e-17, 1.2102459734085757e-16,
];
// The series split into its even and odd halves: Σ c_j T_j(u) = Σ c_2k T_k(v) + u·Σ c_2k+1 V_k(v), v = 2u² − 1
// (T_2k(u) = T_k(T_2(u)); T_2k+1(u) = u·V_k(v) with V_0 = 1, V_1 = 2v − 1, V_k+1 = 2v·V_k − V_k−1, the Chebyshev
// polynomials of the fourth kind), so the two Clenshaw recurrences of half the length run side by side.
const ERFC_EVEN = Float64Array.from(ERFC_CHEBYSHEV.filter((_, j) => j % 2 === 0));
const ERFC_ODD = Float64Array.from(ERFC_CHEBYSHEV.filter((_, j) => j % 2 === 1));
const EVEN_TERMS = ERFC_EVEN.length;
const ODD_TERMS = ERFC_ODD.length;

/** Complementary error function for real x. */
export function erfc(x: number): number {
  if (Number.isNaN(x)) return Number.NaN;
  const z = Math.abs(x);
  let value = 0;
  if (z < 27) {
    const t = 2 / (2 + z);
    const u = 2 * t - 1;
    const v = 2 * u * u - 1;
    const v2 = 2 * v;
    // Clenshaw recurrences: T_k(v) for the even half, V_k(v) for the odd half.
    let e1 = 0;
    let e2 = 0;
    let o1 = 0;
    let o2 = 0;
    let k = EVEN_TERMS - 1;
    for (; k >= ODD_TERMS; k--) {
      const e0 = v2 * e1 - e2 + ERFC_EVEN[k];
      e2 = e1;
      e1 = e0;
    }
    for (; k >= 1; k--) {
      const e0 = v2 * e1 - e2 + ERFC_EVEN[k];
      e2 = e1;
      e1 = e0;
      const o0 = v2 * o1 - o2 + ERFC_ODD[k];
      o2 = o1;
      o1 = o0;
    }
    const even = v * e1 - e2 + ERFC_EVEN[0];
    const odd = (v2 - 1) * o1 - o2 + ERFC_ODD[0];
    const f = even + u * odd;
    value = t * Math.exp(-z * z + f);
  }
  return x >= 0 ? value : 2 - value;
}

/** Standard normal distribution function Φ(τ) = ½ erfc(−τ/√2). */
export function normalCdf(t: number): number {
  if (t > 8.3) return 1; // 1 − Φ(8.3) < 1e-16
  if (t < -38) return 0;
  return 0.5 * erfc(-t * Math.SQRT1_2);
}

/** Standard normal density φ(τ). */
export function normalPdf(t: number): number {
  return INV_SQRT_2PI * Math.exp(-0.5 * t * t);
}

/** Ψ(τ) − max(τ, 0), where Ψ(τ) = ∫_{-∞}^{τ} Φ(t) dt = τΦ(τ) + φ(τ); Ψ(τ) = τ + Ψ(−τ) keeps this small and exact. */
export function psiExcess(t: number): number {
  const u = -Math.abs(t);
  if (u < -9) return 0; // Ψ(−9) ≈ φ(9)/81 < 1e-20
  return u * normalCdf(u) + normalPdf(u);
}

/**
 * Mean of Φ(τ) over τ linear between τ0 and τ1: (Ψ(τ1) − Ψ(τ0))/(τ1 − τ0).
 * For close ends the difference quotient would cancel, so a short Taylor series about the midpoint is used:
 * mean = Φ(m) + d²/6·Φ''(m) + d⁴/120·Φ''''(m), d = (τ1 − τ0)/2, with Φ'' = −mφ, Φ'''' = (3m − m³)φ.
 */
export function meanNormalCdf(t0: number, t1: number): number {
  const d = 0.5 * (t1 - t0);
  const m = 0.5 * (t0 + t1);
  if (Math.abs(d) < 0.05) {
    if (Math.abs(m) > 9) return m > 0 ? 1 : 0;
    const phi = normalPdf(m);
    const d2 = d * d;
    return normalCdf(m) + (d2 / 6) * (-m * phi) + ((d2 * d2) / 120) * ((3 * m - m * m * m) * phi);
  }
  const difference = Math.max(t1, 0) - Math.max(t0, 0) + psiExcess(t1) - psiExcess(t0);
  return difference / (t1 - t0);
}

/** Gauss–Legendre nodes and weights on [−1, 1] (Newton iteration on P_n; A&S 25.4.29). */
export function gaussLegendre(order: number): { nodes: Float64Array; weights: Float64Array } {
  const nodes = new Float64Array(order);
  const weights = new Float64Array(order);
  for (let i = 0; i < order; i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (order + 0.5));
    let derivative = 0;
    for (let iteration = 0; iteration < 100; iteration++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= order; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      const pn = order === 1 ? x : p1;
      const pnm1 = order === 1 ? 1 : p0;
      derivative = (order * (x * pn - pnm1)) / (x * x - 1);
      const step = pn / derivative;
      x -= step;
      if (Math.abs(step) < 1e-16) break;
    }
    nodes[i] = x;
    weights[i] = 2 / ((1 - x * x) * derivative * derivative);
  }
  return { nodes, weights };
}
