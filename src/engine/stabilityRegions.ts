// Stability regions of the mass filter in the (q, a) plane (rod pair x at +(U + V cos Ωt), Dawson 1976): x stable when
// a0(q) < a < b1(q), y stable when a0(q) < −a < b1(q) (|q| in both; DLMF 28.2.21). For a ≥ 0 the first
// region's upper edge is min(−a0(q), b1(q)): the y edge −a0 rises from the origin to the apex, the x edge
// b1 falls from the apex to a = 0 at q ≈ 0.908. All curves here are computed from characteristic values.
import { a0Unchecked, b1Unchecked, mathieuA, mathieuB } from './characteristicValues';
import { brentRoot } from './rootFinding';
import { checkNumber } from './validate';

let apexCache: { a: number; q: number } | null = null;
let rfOnlyEdgeCache: number | null = null;

/**
 * Apex of the first stability region: the crossing of the x edge b1(q) and the y edge −a0(q).
 * Textbook values q ≈ 0.706, a ≈ 0.23699 (P. H. Dawson (ed.), Quadrupole Mass Spectrometry and its
 * Applications, 1976 — from memory); here to about 1e-13.
 */
export function firstRegionApex(): { a: number; q: number } {
  if (!apexCache) {
    const q = brentRoot((x) => b1Unchecked(x) + a0Unchecked(x), 0.6, 0.8, 1e-16);
    apexCache = { a: b1Unchecked(q), q };
  }
  return { ...apexCache };
}

/** U/V at the apex = a/(2q) ≈ 0.16784: above it no mass is transmitted. */
export function apexRatio(): number {
  const apex = firstRegionApex();
  return apex.a / (2 * apex.q);
}

/** q where b1(q) = 0 (≈ 0.908): the first region's a = 0 edge, the RF-only low-mass cut-off. */
export function rfOnlyEdgeQ(): number {
  if (rfOnlyEdgeCache === null) rfOnlyEdgeCache = brentRoot((x) => b1Unchecked(x), 0.85, 0.95, 1e-16);
  return rfOnlyEdgeCache;
}

/** First-region edges sampled in q, columnar and chart-ready (uPlot order: [q, ...series]). */
export interface FirstRegionBoundary {
  /** q from 0 to the a = 0 edge, ascending; the apex q is one of the samples. */
  q: Float64Array;
  /** y edge, a = −a0(q): y stable below it (high-mass cut-off left of the apex). */
  yEdge: Float64Array;
  /** x edge, a = b1(q): x stable below it (low-mass cut-off right of the apex). */
  xEdge: Float64Array;
  /** Upper boundary of the region, min(yEdge, xEdge). */
  upper: Float64Array;
  /** Lower boundary (the region is symmetric in a): −upper. */
  lower: Float64Array;
  /** Index of the apex sample in q. */
  apexIndex: number;
}

/** The first stability region's edges at `points` values of q (≥ 3; the apex is always sampled). */
export function firstRegionBoundary(points = 1000): FirstRegionBoundary {
  const steps = firstRegionBoundarySteps(points, points);
  for (;;) {
    const r = steps.next();
    if (r.done) return r.value;
  }
}

/**
 * The same edges as firstRegionBoundary, computed `perStep` samples at a time: the generator yields the fraction
 * done after each step and returns the boundary. A caller on a phone's main thread runs one step per task, so
 * the whole computation (hundreds of eigenvalue searches) never holds the page still.
 */
export function* firstRegionBoundarySteps(points = 1000, perStep = 25): Generator<number, FirstRegionBoundary, void> {
  checkNumber('points', points, { min: 3, max: 1_000_000, integer: true });
  checkNumber('perStep', perStep, { min: 1, max: 1_000_000, integer: true });
  const apex = firstRegionApex();
  const qEnd = rfOnlyEdgeQ();
  if (perStep < points) yield 0; // the apex and the a = 0 edge, by root finding, are a step of their own
  // Left segment [0, apex] and right segment (apex, qEnd], split in proportion to length.
  const leftCount = Math.max(2, Math.min(points - 1, Math.round((points - 1) * (apex.q / qEnd)) + 1));
  const rightCount = points - leftCount;
  const q = new Float64Array(points);
  for (let i = 0; i < leftCount; i++) q[i] = (apex.q * i) / (leftCount - 1);
  q[leftCount - 1] = apex.q; // exactly, so the kink of the upper edge is drawn
  for (let j = 1; j <= rightCount; j++) q[leftCount - 1 + j] = apex.q + ((qEnd - apex.q) * j) / rightCount;
  const yEdge = new Float64Array(points);
  const xEdge = new Float64Array(points);
  const upper = new Float64Array(points);
  const lower = new Float64Array(points);
  for (let i = 0; i < points; i++) {
    yEdge[i] = -a0Unchecked(q[i]);
    xEdge[i] = i === points - 1 ? 0 : b1Unchecked(q[i]);
    upper[i] = i === leftCount - 1 ? apex.a : Math.min(yEdge[i], xEdge[i]);
    lower[i] = -upper[i];
    if ((i + 1) % perStep === 0 && i + 1 < points) yield (i + 1) / points;
  }
  return { q, yEdge, xEdge, upper, lower, apexIndex: leftCount - 1 };
}

/** Characteristic curves a_n(q), b_n(q) for display of the higher regions (Mathieu plane). */
export interface CharacteristicCurves {
  q: Float64Array;
  /** a[n] = a_n(q) for n = 0 … maxOrder. */
  a: Float64Array[];
  /** b[n] = b_n(q) for n = 1 … maxOrder; b[0] is empty. */
  b: Float64Array[];
}

/**
 * a_n and b_n over q ∈ [qMin, qMax] for n ≤ maxOrder. In the Mathieu plane the stable zones lie between
 * a_n and b_{n+1} (q ≥ 0); for the mass filter the x curves are these, the y curves their negatives
 * (a → −a), and a region is stable where an x zone and a y zone overlap.
 */
export function characteristicCurves(p: { qMin?: number; qMax: number; points: number; maxOrder: number }): CharacteristicCurves {
  const qMin = checkNumber('qMin', p?.qMin ?? 0, { min: -1e4, max: 1e4 });
  const qMax = checkNumber('qMax', p?.qMax, { min: qMin, max: 1e4 });
  const points = checkNumber('points', p?.points, { min: 2, max: 100_000, integer: true });
  const maxOrder = checkNumber('maxOrder', p?.maxOrder, { min: 0, max: 50, integer: true });
  const q = new Float64Array(points);
  for (let i = 0; i < points; i++) q[i] = qMin + ((qMax - qMin) * i) / (points - 1);
  const a: Float64Array[] = [];
  const b: Float64Array[] = [new Float64Array(0)];
  for (let n = 0; n <= maxOrder; n++) {
    const values = new Float64Array(points);
    for (let i = 0; i < points; i++) values[i] = mathieuA(n, q[i]);
    a.push(values);
    if (n >= 1) {
      const odd = new Float64Array(points);
      for (let i = 0; i < points; i++) odd[i] = mathieuB(n, q[i]);
      b.push(odd);
    }
  }
  return { q, a, b };
}

/** Signed distance in a to the nearest first-region edge for one direction: > 0 inside, < 0 outside. */
export function firstRegionMargin(a: number, q: number): number {
  const absQ = Math.abs(q);
  return Math.min(a - a0Unchecked(absQ), b1Unchecked(absQ) - a);
}
