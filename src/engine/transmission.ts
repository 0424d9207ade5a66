/**
 * Ion-ensemble transmission through an ideal quadrupole mass filter, computed deterministically.
 *
 * MODEL (stated here and on screen): ideal hyperbolic field over the whole rod length, no fringe fields, no
 * collisions, no space charge. Engine convention: x pair at +(U + V cos Ωt), y pair at −(U + V cos Ωt), per rod
 * to ground, V zero-to-peak; a = 8zeU/(m r0²Ω²), q = 4zeV/(m r0²Ω²), ξ = Ωt/2, x'' + (a − 2q cos 2ξ)x = 0,
 * y'' − (a − 2q cos 2ξ)y = 0. Ions: entry phase ξ0 uniform over one RF period (Δξ = π); entry point uniform in a
 * disc of radius beamRadius on the axis; v_x, v_y independent Gaussians, mean 0, σ = √(e·ε⊥/m) with
 * ε⊥ = transverseEnergy (eV); axial speed fixed, v_z = √(2zeV_z/m); flight n = f·L/v_z RF cycles, not rounded.
 * An ion is lost when |x| ≥ r0 or |y| ≥ r0 at any instant of the flight. T = transmitted fraction.
 *
 * METHOD. The motion is linear: x(ξ) = x0·u(ξ) + x0'·w(ξ) with u, w the fundamental solutions from the entry
 * phase. For phase 0 we tabulate the rows r(ξ) = (u, w) at S samples per period (Magnus, trajectoryMathieu.ts);
 * later periods follow from the one-period matrix M: r(ξ + pπ) = r(ξ)·M^p. An ion entering at ξ0 has rows
 * c(ξ) = r(ξ)·Φ(ξ0)⁻¹, so every entry phase shares one point set, seen through a window [ξ0, ξ0 + nπ].
 * (x0, x0') survives the samples iff |c·z| < r0 for every sampled c; only the vertices of the convex hull of ±c
 * matter, and the accepted set is the polar polygon of that hull (a centrally symmetric convex polygon).
 * The hull of the whole periods 1..⌊n⌋−1 is built by doubling (hull(D ∪ D·M^k)), so the cost grows as log n;
 * hulls above 256 vertices (long stable flights) are thinned with a tracked factor: true hull ⊆ (1 + δ)·kept.
 * Each phase then adds its own partial first and last periods (only the samples outside the core hull).
 * For each x0 the accepted x0' is an interval [lo, hi] of a piecewise-linear concave chain, so the Gaussian
 * velocity integral is Φ(hi/s) − Φ(lo/s); the y-side integral over the chord of the disc has a closed form
 * (∫Φ = τΦ + φ on each linear piece); the remaining integral over x0 uses 4-point Gauss–Legendre panels split at
 * every feature (chain ends, and where the chain crosses 0, ±s/2, ±s, ±2s, ±4s, so panels adapt to the steep
 * parts of Φ), after x0 = b sin θ removes the square root at the rim of the disc (quadrature error < 1e-5 of
 * the peak height, measured against 32-point panels in the tests).
 * The entry phase is averaged with the trapezoid rule on a uniform periodic grid, 16 phases doubled while the
 * error estimate is too large (up to 512).
 *
 * ERROR BOUND (errorBound = sampling + phase rule + negligible phases):
 *  - Sampling. Between two samples ξ_k, ξ_k + h, e = x − (chord) satisfies e'' = −g·x, |g| ≤ G = |a| + 2|q|, so
 *    max|x| ≤ max(|x_k|, |x_k+1|) + h²G/8·max|x|. With ε = h²G/8 (h = π/S) and the thinning factor (1 + δ),
 *    the true acceptance lies between the computed polygon A and (1 − ε)/(1 + δ)·A. Both are integrated (the inner
 *    one at every other phase): T_in ≤ T ≤ T_out. We return T_out − (T_out − T_in)/2 and add the half-width.
 *    Cheaper inner end (option scaledInner): the entry density (uniform disc in (x0, y0) times Gaussians in the
 *    slopes) does not increase along rays from the origin, so with z → (λx·zx, λy·zy) the inner set
 *    λx·A_x × λy·A_y holds at least λx²·λy² of the ions in A_x × A_y (λx·λy with no transverse velocity, where the
 *    slopes are fixed at 0): T_in ≥ λx²λy²·T_out per phase, with λ = 1 − ε. No second quadrature is needed; the
 *    bracket is then ≈ 4ε·T instead of the integrated one (about half that).
 *  - Phase rule: |T_P − T_P/2| (the P/2 rule is the even subset; conservative for the exponentially convergent
 *    trapezoid rule on a smooth periodic integrand).
 *  - Growth beyond 1e10 (needle-shaped hulls lose their orientation digits): the phase is counted as 0 and the
 *    strip bound of phaseAcceptance is added.
 *  The Magnus tables (≈3e-9 per period), erfc (1e-14) and the quadrature (< 1e-5 of peak) are below this and are
 *  checked by convergence tests. (Panels cut at ±s, ±2s only — the coarse stage — move T by < 3e-4 of T in the
 *  tests, far inside that stage's 1 % budget. Fewer than 64 samples per period let the Magnus error, which is not in
 *  the bracket, show: the coarse stage keeps 64.) With S = 128 the bound is ≈ 1e-4·T near the apex; the profile refines phases
 *  until it is ≤ 1e-3 of the peak height. `uncertainty` is 0: nothing here is random.
 */
import { ConvexIndex, convexHull, hullOfConvexAndPoints, insertIntoConvex, isCleanHull, polarInto, polarPolygon, simplifyHull, simplifyInto, transformRows } from './transmissionHull';
import { gaussLegendre, meanNormalCdf, normalCdf, psiExcess } from './transmissionMath';
import { fundamentalAt, monodromy, multiply2, periodTable, power2, type PeriodTable } from './trajectoryMathieu';
import { flightModel, requireFinite, requireInteger, type FlightModel, type TransmissionParams } from './peakInput';
import { InputRangeError } from './validate';

export interface TransmissionResult {
  transmission: number;
  /** 1σ statistical uncertainty: 0 for this deterministic method. */
  uncertainty: number;
  /** Half-width of the rigorous sampling bracket [T_in, T_out] around `transmission`. */
  errorBound: number;
}

export interface FastTransmissionOptions {
  /** Samples per RF period S (a multiple of `phases`); default 128. */
  samplesPerPeriod?: number;
  /** Entry phases to start with (doubled while the error estimate is too large); default 16. */
  phases?: number;
  /** Gauss–Legendre order per panel; default 4. */
  quadratureOrder?: number;
  /** Magnus steps between samples; default 2. */
  substeps?: number;
  /**
   * Thinning of the whole-period hull, δ: true hull ⊆ (1 + δ)·kept hull, and δ widens the sampling bracket
   * (see ERROR BOUND). Default 2e-6; a coarse, quick profile may take 1e-3.
   */
  hullTolerance?: number;
  /** Hulls with at most this many vertices are kept exact; default 256. */
  hullKeep?: number;
  /**
   * Inner end of the sampling bracket: false (default) integrates the (1 − ε)-scaled polygons; true takes the
   * cheaper lower bound T_in ≥ λx^d·λy^d·T_out (λ = 1 − ε per axis, d = 2, or 1 with no transverse velocity),
   * which holds because the ion density does not increase along rays from the origin (see ERROR BOUND).
   */
  scaledInner?: boolean;
  /**
   * Levels k at which the quadrature panels are cut where the chain crosses ±k·s (besides 0 and the chain ends);
   * default [0.5, 1, 2, 4]. Fewer levels, fewer panels: the coarse profile takes [1, 2].
   */
  panelLevels?: readonly number[];
}

export const FAST_DEFAULTS = {
  samplesPerPeriod: 128,
  phases: 16,
  quadratureOrder: 4,
  substeps: 2,
  hullTolerance: 2e-6,
  hullKeep: 256,
  scaledInner: false,
  panelLevels: [0.5, 1, 2, 4] as readonly number[],
} as const;

/**
 * Rows r(ξ) beyond this size make the hull a needle whose orientation tests lose their digits (aspect ratio
 * 1e10 leaves ~1e-6 of them): the axis is then treated as collapsed, and every phase is bounded by the strip
 * argument of phaseAcceptance using the actual sample rows kept in `collapsedRows`.
 */
const COLLAPSE_LIMIT = 1e10;

/**
 * The core hull (whole periods) is thinned so that true hull ⊆ (1 + δ)·kept hull (δ = hullTolerance, default
 * 2e-6); δ enters the sampling bracket. Long stable flights otherwise carry ~2 hull vertices per RF cycle into
 * every phase.
 */

/** Everything about one transverse axis that does not depend on the entry phase. */
export interface AxisFlight {
  table: PeriodTable;
  monodromy: Float64Array;
  cycles: number;
  /** Hull (r-space, phase-0 frame) of whole periods 1..coreEnd, or null if none. */
  core: Float64Array | null;
  /** Fast inside test for the core hull (points inside it cannot be vertices of a window's hull). */
  coreIndex: ConvexIndex | null;
  coreEnd: number;
  /** No core vertex would be dropped by the hull clean-up (so per-phase hulls check only what changed). */
  coreClean: boolean;
  /** The motion grows so fast that the acceptance is negligible (see COLLAPSE_LIMIT). */
  collapsed: boolean;
  /** When collapsed: actual sample rows (phase-0 frame) of periods ≥ 1, for the strip bound. */
  collapsedRows: Float64Array | null;
  /**
   * Relative shrink of the inner polygon: the true acceptance contains (1 − ε)/(1 + δ) times the computed one,
   * ε = h²G/8 the overshoot between samples, (1 + δ) the product over the simplifications of the core hull
   * (≤ 1 + 1.6·hullTolerance).
   */
  epsilon: number;
  /**
   * Samples outside the core that some window may include: period 0 and the periods after the core, as
   * (ξ, u, w) rows in the phase-0 frame, ascending ξ. Samples inside the core hull are dropped once, here.
   */
  candidates: {
    xi: Float64Array;
    u: Float64Array;
    w: Float64Array;
    count: number;
    /** Core wedges (ConvexIndex.wedge) of (u, w) and of −(u, w), when there is a core index. */
    wedgePlus: Int32Array;
    wedgeMinus: Int32Array;
  };
}

export function prepareAxis(
  A: number,
  Q: number,
  cycles: number,
  samples: number,
  substeps: number,
  hullTolerance: number = FAST_DEFAULTS.hullTolerance,
  hullKeep: number = FAST_DEFAULTS.hullKeep,
): AxisFlight {
  const table = periodTable(A, Q, samples, substeps);
  const m = monodromy(table);
  const h = Math.PI / samples;
  const overshoot = (h * h * (Math.abs(A) + 2 * Math.abs(Q))) / 8;
  // True core hull ⊆ growth × kept hull (each simplification multiplies by 1 + its δ).
  let growth = 1;
  // One period's rows and their negatives.
  const one = new Float64Array(4 * (samples + 1));
  for (let j = 0; j <= samples; j++) {
    one[2 * j] = table.u[j];
    one[2 * j + 1] = table.w[j];
    one[2 * (samples + 1 + j)] = -table.u[j];
    one[2 * (samples + 1 + j) + 1] = -table.w[j];
  }
  const h1 = convexHull(one, 2 * (samples + 1));
  const coreEnd = Math.floor(cycles) - 1;
  let core: Float64Array | null = null;
  let collapsedRows: Float64Array | null = null;
  let collapsed = false;
  if (coreEnd >= 1) {
    // D_k = hull of periods 0..k−1; binary doubling from the top bit of coreEnd. D lives in a scratch buffer
    // (count nd); each step merges into another and thins back.
    const h1Count = h1.length / 2;
    let d = reserveDoubling(0, h1Count);
    d.set(h1);
    let nd = h1Count;
    let mk = m; // M^k
    const bits = coreEnd.toString(2);
    for (let i = 1; i < bits.length && !collapsed; i++) {
      nd = doublingStep(nd, null, 0, mk, hullTolerance / 64, hullKeep);
      growth *= 1 + hullTolerance / 64;
      mk = multiply2(mk, mk);
      if (bits[i] === '1') {
        nd = doublingStep(nd, h1, h1Count, mk, hullTolerance / 64, hullKeep);
        growth *= 1 + hullTolerance / 64;
        mk = multiply2(mk, m);
      }
      d = doublingD;
      if (maxAbs(mk, 4) > COLLAPSE_LIMIT || maxAbs(d, 2 * nd) > COLLAPSE_LIMIT) collapsed = true;
    }
    d = doublingD;
    const shifted = new Float64Array(2 * nd);
    transformRows(d, nd, m, shifted, 0);
    if (collapsed) collapsedRows = shifted;
    else {
      const hull = new Float64Array(shifted.length);
      const count = hullOfConvexAndPoints(shifted, nd, 0, true, hull);
      core = simplifyHull(hull.slice(0, 2 * count), hullTolerance, 64, hullKeep);
      growth *= 1 + hullTolerance;
    }
  }
  const epsilon = 1 - (1 - overshoot) / growth;
  const coreIndex = core && core.length >= 6 ? new ConvexIndex(core) : null;
  const candidates = windowCandidates(table, m, coreEnd, cycles, coreIndex);
  const coreClean = core ? isCleanHull(core) : false;
  return { table, monodromy: m, cycles, core, coreIndex, coreEnd, coreClean, collapsed, collapsedRows, epsilon, candidates };
}

function windowCandidates(
  table: PeriodTable,
  m: Float64Array,
  coreEnd: number,
  cycles: number,
  index: ConvexIndex | null,
): AxisFlight['candidates'] {
  const S = table.samples;
  const spacing = Math.PI / S;
  const firstExtra = Math.max(1, coreEnd + 1);
  // The latest window ends before π + nπ.
  const lastPeriod = Math.floor(cycles + 1);
  const capacity = S + 1 + Math.max(0, lastPeriod - firstExtra + 1) * S;
  const xi = new Float64Array(capacity);
  const u = new Float64Array(capacity);
  const w = new Float64Array(capacity);
  let count = 0;
  const add = (at: number, a: number, b: number): void => {
    if (index && index.contains(a, b)) return; // −(a, b) is then inside too: the core is centrally symmetric
    xi[count] = at;
    u[count] = a;
    w[count] = b;
    count++;
  };
  for (let j = 1; j <= S; j++) add(j * spacing, table.u[j], table.w[j]);
  if (lastPeriod >= firstExtra && lastPeriod - firstExtra < 4) {
    let mp = power2(m, firstExtra);
    for (let p = firstExtra; p <= lastPeriod; p++) {
      for (let j = 0; j < S; j++) {
        const a = table.u[j];
        const b = table.w[j];
        add(p * Math.PI + j * spacing, a * mp[0] + b * mp[2], a * mp[1] + b * mp[3]);
      }
      mp = multiply2(mp, m);
    }
  }
  const wedgePlus = new Int32Array(index ? count : 0);
  const wedgeMinus = new Int32Array(index ? count : 0);
  if (index) for (let i = 0; i < count; i++) {
    wedgePlus[i] = index.wedge(u[i], w[i]);
    wedgeMinus[i] = index.wedge(-u[i], -w[i]);
  }
  return { xi, u, w, count, wedgePlus, wedgeMinus };
}

// Buffers for the doubling in prepareAxis: D, the union's points, the merged hull.
let doublingD = new Float64Array(1024);
let doublingAll = new Float64Array(2048);
let doublingMerged = new Float64Array(2048);

/** Room for D of nd vertices plus ne more; returns doublingD (contents kept). */
function reserveDoubling(nd: number, ne: number): Float64Array {
  const need = 2 * (nd + ne);
  if (doublingAll.length < need) {
    doublingAll = new Float64Array(2 * need);
    doublingMerged = new Float64Array(2 * need);
  }
  if (doublingD.length < need) {
    const grown = new Float64Array(2 * need);
    grown.set(doublingD.subarray(0, 2 * nd));
    doublingD = grown;
  }
  return doublingD;
}

/**
 * D ← thin(hull(D ∪ E·B)) with E = D when `e` is null, else E = e (ne vertices): both are convex and B has
 * det 1, so E·B stays convex and the hull is a linear-time merge. Returns D's new vertex count.
 */
function doublingStep(nd: number, e: Float64Array | null, ne: number, b: Float64Array, delta: number, keep: number): number {
  const count = e ? ne : nd;
  reserveDoubling(nd, count);
  const all = doublingAll;
  all.set(doublingD.subarray(0, 2 * nd));
  transformRows(e ?? doublingD, count, b, all, nd);
  const m = hullOfConvexAndPoints(all, nd, count, true, doublingMerged);
  return simplifyInto(doublingMerged, m, delta, 64, keep, doublingD);
}

function maxAbs(v: Float64Array, length: number): number {
  let m = 0;
  for (let i = 0; i < length; i++) m = Math.max(m, Math.abs(v[i]));
  return m;
}

/**
 * The accepted polygon (units of r0: (x0/r0, x0'/r0)) for entry phase ξ0 ∈ [0, π), or null if the axis collapsed.
 * Counter-clockwise vertices.
 */
export function acceptancePolygon(axis: AxisFlight, entryPhase: number): Float64Array | null {
  const c = constraintHull(axis, entryPhase);
  return c ? polarPolygon(c) : null;
}

/**
 * Above this |c| the motion has grown so much that the accepted sliver is thinner than 1e-10 of r0 and its
 * polar vertices would be lost to rounding (the hull would mix vectors 1e10 apart in size): such a phase is
 * counted as transmitting nothing, and the strip bound below is added to the error bound instead.
 */
const WELL_CONDITIONED = 1e10;

/**
 * Buffers for one axis's work at one entry phase, reused from phase to phase (a phase evaluation reads them and
 * keeps nothing): the hull's input points, the hull, the hull in c-space, its polar polygon and upper chain.
 */
class AxisScratch {
  points = new Float64Array(256);
  hull = new Float64Array(256);
  c = new Float64Array(256);
  polar = new Float64Array(256);
  chain: UpperChain = { xs: new Float64Array(128), hs: new Float64Array(128), extent: 0, count: 0 };
  /** The chain scaled by the inner bracket's factor. */
  inner: UpperChain = { xs: new Float64Array(128), hs: new Float64Array(128), extent: 0, count: 0 };
  private wedgeBuffer = new Int32Array(128);
  /** Wedge indices for `count` extra points. */
  wedges(count: number): Int32Array {
    if (this.wedgeBuffer.length < count) this.wedgeBuffer = new Int32Array(2 * count);
    return this.wedgeBuffer;
  }
  /** Room for `numbers` numbers in the point buffers. */
  reserve(numbers: number): void {
    if (this.points.length < numbers) {
      const size = 2 * numbers;
      this.points = new Float64Array(size);
      this.hull = new Float64Array(size);
      this.c = new Float64Array(size);
      this.polar = new Float64Array(size);
    }
  }
}
const scratchX = new AxisScratch();
const scratchY = new AxisScratch();
const scratchOther = new AxisScratch();
const entryScratch = new Float64Array(4);
const exitScratch = new Float64Array(4);
const inverseScratch = new Float64Array(4);

function reserveChain(chain: UpperChain, count: number): void {
  if (chain.xs.length < count) {
    chain.xs = new Float64Array(2 * count);
    chain.hs = new Float64Array(2 * count);
  }
}

/**
 * Accepted polygon for one axis and phase, or `polygon: null` with `bound` ≥ the transmission of that phase
 * when the acceptance is negligible. Bound: the accepted set lies in the strip |c·z| < 1 of the longest hull
 * vector c (width 2/|c|); the density of ĉ·z is at most √2·max(2/(πb), 1/(s√(2π))) (disc marginal and Gaussian,
 * one of |ĉ_x|, |ĉ_y| ≥ 1/√2), and with s = 0 only the x part counts: P ≤ (2/max|c_x|)·2/(πb).
 */
export function phaseAcceptance(
  axis: AxisFlight,
  entryPhase: number,
  beamRadius: number,
  slopeSigma: number,
): { polygon: Float64Array | null; bound: number } {
  const s = scratchOther;
  const m = acceptanceInto(axis, entryPhase, beamRadius, slopeSigma, s);
  if (m < 0) return { polygon: null, bound: -m - 1 };
  return { polygon: s.polar.slice(0, 2 * m), bound: 0 };
}

/**
 * phaseAcceptance into `s`: returns the polygon's vertex count (polygon in s.polar), or −1 − bound when the
 * acceptance is negligible (bound as in phaseAcceptance; 0 when the axis collapsed with nothing kept).
 */
function acceptanceInto(axis: AxisFlight, entryPhase: number, beamRadius: number, slopeSigma: number, s: AxisScratch): number {
  let count = constraintHullInto(axis, entryPhase, s);
  const c = s.c;
  if (count < 0) {
    if (!axis.collapsedRows) return -1;
    // Collapsed axis: the kept rows seen from this entry phase, c = r·Φ(ξ0)⁻¹.
    const entry = entryScratch;
    fundamentalAt(axis.table, entryPhase, entry);
    count = axis.collapsedRows.length / 2;
    s.reserve(2 * count);
    inverseScratch[0] = entry[3];
    inverseScratch[1] = -entry[1];
    inverseScratch[2] = -entry[2];
    inverseScratch[3] = entry[0];
    transformRows(axis.collapsedRows, count, inverseScratch, s.c, 0);
    return conditionedPolar(s.c, count, beamRadius, slopeSigma, s);
  }
  return conditionedPolar(c, count, beamRadius, slopeSigma, s);
}

function conditionedPolar(c: Float64Array, count: number, beamRadius: number, slopeSigma: number, s: AxisScratch): number {
  let longest2 = 0;
  let longestX = 0;
  for (let i = 0; i < 2 * count; i += 2) {
    const r2 = c[i] * c[i] + c[i + 1] * c[i + 1];
    if (r2 > longest2) longest2 = r2;
    const ax = Math.abs(c[i]);
    if (ax > longestX) longestX = ax;
  }
  const longest = Math.sqrt(longest2);
  if (longest > WELL_CONDITIONED) {
    const disc = 2 / (Math.PI * beamRadius);
    const bound =
      slopeSigma > 0
        ? (2 / longest) * Math.SQRT2 * Math.max(disc, 1 / (slopeSigma * Math.sqrt(2 * Math.PI)))
        : longestX > 0
          ? (2 / longestX) * disc
          : 1;
    return -1 - Math.min(1, bound);
  }
  polarInto(c, count, s.polar);
  return count;
}

/** M^k for the exit period (k takes one or two values per flight): computed once per axis and k. */
const powerCache = new WeakMap<AxisFlight, Map<number, Float64Array>>();
function monodromyPower(axis: AxisFlight, k: number): Float64Array {
  let byK = powerCache.get(axis);
  if (!byK) {
    byK = new Map();
    powerCache.set(axis, byK);
  }
  let value = byK.get(k);
  if (!value) {
    value = power2(axis.monodromy, k);
    byK.set(k, value);
  }
  return value;
}

/** Append ±(x, y) unless inside the core hull; returns the new count. */
function pushOutside(pts: Float64Array, count: number, index: ConvexIndex | null, x: number, y: number): number {
  if (index && index.contains(x, y)) return count;
  pts[2 * count] = x;
  pts[2 * count + 1] = y;
  pts[2 * count + 2] = -x;
  pts[2 * count + 3] = -y;
  return count + 2;
}

/**
 * Hull of ±c(ξ) over the sampled flight for entry phase ξ0 (c-space: x(ξ)/r0 = c·(x0, x0')/r0), counter-clockwise;
 * null if the axis collapsed. max over its vertices of |c·z| is the largest sampled |x|/r0 of the ion z.
 */
export function constraintHull(axis: AxisFlight, entryPhase: number): Float64Array | null {
  const s = scratchOther;
  const m = constraintHullInto(axis, entryPhase, s);
  return m < 0 ? null : s.c.slice(0, 2 * m);
}

/** constraintHull into s.c; returns the vertex count, or −1 if the axis collapsed. */
function constraintHullInto(axis: AxisFlight, entryPhase: number, s: AxisScratch): number {
  if (axis.collapsed) return -1;
  const { table, cycles, candidates } = axis;
  const end = entryPhase + cycles * Math.PI;
  const lastPeriod = Math.floor(end / Math.PI);
  const coreCount = axis.core ? axis.core.length / 2 : 0;
  s.reserve(2 * (coreCount + 2 * (candidates.count + 2)));
  const entry = entryScratch;
  fundamentalAt(table, entryPhase, entry);
  const exit = exitScratch;
  const mEnd = monodromyPower(axis, lastPeriod);
  fundamentalAt(table, end - lastPeriod * Math.PI, exit);
  const exitU = exit[0] * mEnd[0] + exit[1] * mEnd[2];
  const exitW = exit[0] * mEnd[1] + exit[1] * mEnd[3];
  const index = axis.coreIndex;
  let m: number;
  let hull: Float64Array;
  if (axis.core && index && index.size >= 3 && candidates.wedgePlus.length === candidates.count) {
    // Few points outside the core: slot them into the core's vertex sequence (insertIntoConvex).
    const extras = s.points;
    const wedges = s.wedges(2 * (candidates.count + 2));
    let k = 0;
    const push = (x: number, y: number): void => {
      const wp = index.wedge(x, y);
      if (index.insideEdge(wp, x, y)) return; // −(x, y) is then inside too: the core is centrally symmetric
      extras[2 * k] = x;
      extras[2 * k + 1] = y;
      wedges[k++] = wp;
      extras[2 * k] = -x;
      extras[2 * k + 1] = -y;
      wedges[k++] = index.wedge(-x, -y);
    };
    push(entry[0], entry[1]);
    const { xi, u, w, wedgePlus, wedgeMinus } = candidates;
    for (let i = 0; i < candidates.count; i++) {
      const at = xi[i];
      if (at <= entryPhase) continue;
      if (at > end) break;
      extras[2 * k] = u[i];
      extras[2 * k + 1] = w[i];
      wedges[k++] = wedgePlus[i];
      extras[2 * k] = -u[i];
      extras[2 * k + 1] = -w[i];
      wedges[k++] = wedgeMinus[i];
    }
    push(exitU, exitW);
    if (k === 0) {
      m = coreCount;
      hull = axis.core;
    } else if (k <= 48) {
      m = insertIntoConvex(axis.core, coreCount, axis.coreClean, extras, wedges, k, s.hull);
      hull = s.hull;
    } else {
      // Many (growing motion): the core and the loose points merged in (x, y) order.
      const pts = s.c;
      pts.set(axis.core);
      pts.set(extras.subarray(0, 2 * k), 2 * coreCount);
      m = hullOfConvexAndPoints(pts, coreCount, k, false, s.hull);
      hull = s.hull;
    }
  } else {
    const pts = s.points;
    let count = 0;
    if (axis.core) {
      pts.set(axis.core);
      count = coreCount;
    }
    count = pushOutside(pts, count, index, entry[0], entry[1]);
    // Samples strictly after the entry and not after the exit (period 0 and the periods after the core).
    const { xi, u, w } = candidates;
    for (let i = 0; i < candidates.count; i++) {
      const at = xi[i];
      if (at <= entryPhase) continue;
      if (at > end) break;
      pts[2 * count] = u[i];
      pts[2 * count + 1] = w[i];
      pts[2 * count + 2] = -u[i];
      pts[2 * count + 3] = -w[i];
      count += 2;
    }
    count = pushOutside(pts, count, index, exitU, exitW);
    const extraCount = count - coreCount;
    m = hullOfConvexAndPoints(pts, coreCount, extraCount, false, s.hull);
    hull = s.hull;
  }
  // (Growth past the well-conditioned range in the last periods is caught by phaseAcceptance.)
  // c = r·Φ(ξ0)⁻¹, Φ⁻¹ = [[w', −w], [−u', u]] (det Φ = 1).
  inverseScratch[0] = entry[3];
  inverseScratch[1] = -entry[1];
  inverseScratch[2] = -entry[2];
  inverseScratch[3] = entry[0];
  transformRows(hull, m, inverseScratch, s.c, 0);
  return m;
}

/** Largest sampled |x|/r0 along the flight of an ion entering at ξ0 with (x0, x0') in units of r0. */
export function sampledExcursion(hull: Float64Array, x0: number, slope0: number): number {
  let m = 0;
  for (let i = 0; i < hull.length; i += 2) m = Math.max(m, Math.abs(hull[i] * x0 + hull[i + 1] * slope0));
  return m;
}

/** Upper boundary x0'max(x0) of a centrally symmetric convex polygon, as increasing x with heights. */
export interface UpperChain {
  /** Vertices xs[0..count), hs[0..count) (the buffers may be longer). */
  xs: Float64Array;
  hs: Float64Array;
  count: number;
  /** Half-width of the polygon in x. */
  extent: number;
}

export function upperChain(polygon: Float64Array, scale = 1): UpperChain {
  const chain: UpperChain = { xs: new Float64Array(0), hs: new Float64Array(0), count: 0, extent: 0 };
  upperChainInto(polygon, polygon.length / 2, scale, chain);
  return chain;
}

/** upperChain of polygon[0..2m) into `chain`'s buffers (grown when short). */
function upperChainInto(polygon: Float64Array, m: number, scale: number, chain: UpperChain): void {
  let right = 0;
  let left = 0;
  for (let i = 1; i < m; i++) {
    const x = polygon[2 * i];
    const y = polygon[2 * i + 1];
    if (x > polygon[2 * right] || (x === polygon[2 * right] && y > polygon[2 * right + 1])) right = i;
    if (x < polygon[2 * left]) left = i;
  }
  const minX = polygon[2 * left];
  // Walk counter-clockwise from the rightmost vertex over the top to the leftmost.
  let k = 0;
  for (let j = 0; ; j++) {
    const i = (right + j) % m;
    k = j + 1;
    if (polygon[2 * i] === minX) break;
    if (k > m) break;
  }
  reserveChain(chain, k);
  const { xs, hs } = chain;
  for (let t = 0; t < k; t++) {
    const i = (right + (k - 1 - t)) % m;
    xs[t] = scale * polygon[2 * i];
    hs[t] = scale * polygon[2 * i + 1];
  }
  chain.count = k;
  chain.extent = scale * polygon[2 * right];
}

/** `chain` scaled by `scale` into `out`. */
function scaleChainInto(chain: UpperChain, scale: number, out: UpperChain): void {
  reserveChain(out, chain.count);
  for (let t = 0; t < chain.count; t++) {
    out.xs[t] = scale * chain.xs[t];
    out.hs[t] = scale * chain.hs[t];
  }
  out.count = chain.count;
  out.extent = scale * chain.extent;
}

/** The part of a chain over [−limit, limit] (limit ≤ extent), ends interpolated; `extent` is kept. */
export function clipChain(chain: UpperChain, limit: number): UpperChain {
  const out: UpperChain = { xs: new Float64Array(0), hs: new Float64Array(0), count: 0, extent: 0 };
  return clipChainInto(chain, limit, out);
}

/** clipChain into `out` (returns `chain` itself when nothing is cut). */
function clipChainInto(chain: UpperChain, limit: number, out: UpperChain): UpperChain {
  const { xs, hs } = chain;
  if (limit >= chain.extent || chain.count < 2) return chain;
  const k0 = segmentOf(xs, chain.count, -limit);
  const k1 = segmentOf(xs, chain.count, limit);
  const n = k1 - k0 + 2;
  reserveChain(out, n);
  const cx = out.xs;
  const ch = out.hs;
  const first = heightAt(chain, -limit);
  const last = heightAt(chain, limit);
  cx[0] = -limit;
  ch[0] = first;
  for (let k = k0 + 1; k <= k1; k++) {
    cx[k - k0] = xs[k];
    ch[k - k0] = hs[k];
  }
  cx[n - 1] = limit;
  ch[n - 1] = last;
  out.count = n;
  out.extent = chain.extent;
  return out;
}

/** Index k with xs[k] ≤ x ≤ xs[k+1] (clamped), over xs[0..count). */
function segmentOf(xs: Float64Array, count: number, x: number): number {
  let lo = 0;
  let hi = count - 1;
  if (x <= xs[0]) return 0;
  if (x >= xs[hi]) return Math.max(0, hi - 1);
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (xs[mid] <= x) lo = mid;
    else hi = mid;
  }
  return lo;
}

function heightAt(chain: UpperChain, x: number): number {
  const { xs, hs, count } = chain;
  if (count === 1) return hs[0];
  const k = segmentOf(xs, count, x);
  const dx = xs[k + 1] - xs[k];
  if (dx <= 0) return Math.max(hs[k], hs[k + 1]);
  const t = Math.min(1, Math.max(0, (x - xs[k]) / dx));
  return hs[k] + t * (hs[k + 1] - hs[k]);
}

/** Φ(h/s), with the s = 0 limit (no transverse velocity) as a step. */
function cdfRatio(h: number, s: number): number {
  if (s > 0) return normalCdf(h / s);
  return h > 0 ? 1 : h < 0 ? 0 : 0.5;
}

/** Mean of Φ(h/s) for h linear from h0 to h1. */
function segmentMean(h0: number, h1: number, s: number): number {
  if (s > 0) return meanNormalCdf(h0 / s, h1 / s);
  if (h0 >= 0 && h1 >= 0) return 1;
  if (h0 <= 0 && h1 <= 0) return 0;
  return Math.max(h0, h1) / Math.abs(h1 - h0);
}

/** Velocity-integrated survival P(x0) = Φ(hi(x0)/s) − Φ(lo(x0)/s), lo(x) = −hi(−x) by symmetry. */
export function survivalAt(chain: UpperChain, x: number, s: number): number {
  if (Math.abs(x) >= chain.extent) return 0;
  const value = cdfRatio(heightAt(chain, x), s) + cdfRatio(heightAt(chain, -x), s) - 1;
  return value > 0 ? value : 0;
}

/**
 * F(y) = ∫_{−Y0}^{y} Φ(hi(t)/s) dt along a (clipped) chain, in closed form per linear piece:
 * ∫Φ(τ)dt = (Ψ(τ1) − Ψ(τ0))·Δt/Δτ with Ψ cached at the vertices (Ψ = max(τ, 0) + excess, see transmissionMath).
 */
interface ChainIntegral {
  chain: UpperChain;
  s: number;
  /** F at the vertices. */
  f: Float64Array;
  /** τ = h/s and the Ψ excess at the vertices (s > 0 only). */
  tau: Float64Array;
  psi: Float64Array;
}

const integralScratch: ChainIntegral = {
  chain: { xs: new Float64Array(0), hs: new Float64Array(0), count: 0, extent: 0 },
  s: 0,
  f: new Float64Array(128),
  tau: new Float64Array(128),
  psi: new Float64Array(128),
};

/** The chain's integral in the shared scratch (one at a time: phaseTransmission uses it and keeps nothing). */
function chainIntegral(chain: UpperChain, s: number): ChainIntegral {
  const { xs, hs, count: n } = chain;
  const integral = integralScratch;
  if (integral.f.length < n) {
    integral.f = new Float64Array(2 * n);
    integral.tau = new Float64Array(2 * n);
    integral.psi = new Float64Array(2 * n);
  }
  integral.chain = chain;
  integral.s = s;
  const { f, tau, psi } = integral;
  f[0] = 0;
  if (s > 0) for (let k = 0; k < n; k++) {
    tau[k] = hs[k] / s;
    psi[k] = psiExcess(tau[k]);
  }
  else for (let k = 0; k < n; k++) {
    tau[k] = 0;
    psi[k] = 0;
  }
  for (let k = 0; k + 1 < n; k++) f[k + 1] = f[k] + pieceIntegral(integral, k, xs[k + 1] - xs[k], hs[k + 1], tau[k + 1], psi[k + 1]);
  return integral;
}

/** ∫ from vertex k over a length dy to a point of height h (τ, Ψ excess given when known, else NaN). */
function pieceIntegral(g: ChainIntegral, k: number, dy: number, h: number, tauEnd: number, psiEnd: number): number {
  if (dy <= 0) return 0;
  const s = g.s;
  const h0 = g.chain.hs[k];
  if (!(s > 0)) return dy * segmentMean(h0, h, 0);
  const t0 = g.tau[k];
  const t1 = Number.isNaN(tauEnd) ? h / s : tauEnd;
  if (Math.abs(t1 - t0) < 0.1) return dy * meanNormalCdf(t0, t1);
  const p1 = Number.isNaN(psiEnd) ? psiExcess(t1) : psiEnd;
  return (dy * (Math.max(t1, 0) - Math.max(t0, 0) + p1 - g.psi[k])) / (t1 - t0);
}

function cumulativeAt(g: ChainIntegral, y: number): number {
  const { xs, count } = g.chain;
  if (count === 1) return 0;
  const k = segmentOf(xs, count, y);
  const dy = y - xs[k];
  if (dy <= 0) return g.f[k];
  return g.f[k] + pieceIntegral(g, k, dy, heightAt(g.chain, y), Number.NaN, Number.NaN);
}

/** C(Y) = ∫_0^Y P(y) dy = F(Y) − F(−Y) − Y for Y inside the polygon's extent, constant beyond. */
function chordIntegral(g: ChainIntegral, Y: number): number {
  const y = Math.min(Y, g.chain.extent);
  if (y <= 0) return 0;
  const value = cumulativeAt(g, y) - cumulativeAt(g, -y) - y;
  return value > 0 ? value : 0;
}

/**
 * Where P changes character: the chain ends, and every x at which hi(x) (or hi(−x)) crosses one of the levels
 * 0, ±k·s (k in `levels`) — the Gaussian velocity weight switches over there, so panels are cut at those x.
 * Level crossings adapt to the local steepness of the chain, however curved it is.
 */
function chainFeatures(chain: UpperChain, s: number, out: NumberList, levels: readonly number[]): void {
  const { xs, hs, count } = chain;
  pushNumber(out, chain.extent);
  const targets = s > 0 ? 1 + 2 * levels.length : 1;
  for (let l = 0; l < targets; l++) {
    const level = l === 0 ? 0 : (l % 2 === 1 ? 1 : -1) * levels[(l - 1) >> 1] * s;
    for (let k = 0; k + 1 < count; k++) {
      const h0 = hs[k] - level;
      const h1 = hs[k + 1] - level;
      if ((h0 > 0) !== (h1 > 0)) {
        const x = xs[k] + (h0 / (h0 - h1)) * (xs[k + 1] - xs[k]);
        pushNumber(out, x);
        pushNumber(out, -x);
      }
    }
  }
}

const ruleCache = new Map<number, { nodes: Float64Array; weights: Float64Array }>();
function rule(order: number): { nodes: Float64Array; weights: Float64Array } {
  let r = ruleCache.get(order);
  if (!r) {
    r = gaussLegendre(order);
    ruleCache.set(order, r);
  }
  return r;
}

/**
 * Transmission at one entry phase: (1/πb²)∫∫_disc P_x(x) P_y(y) dx dy
 *   = (4/πb) ∫_0^Θ P_x(b sin θ) C_y(b cos θ) cos θ dθ, using evenness of P_x and P_y.
 */
// Scratch for phaseTransmission (emptied or overwritten on each call; nothing keeps them).
interface NumberList {
  values: Float64Array;
  count: number;
}
const featureScratchX: NumberList = { values: new Float64Array(256), count: 0 };
const featureScratchY: NumberList = { values: new Float64Array(256), count: 0 };
let cutScratch = new Float64Array(256);
let cutCount = 0;
function pushCut(t: number): void {
  if (cutCount === cutScratch.length) {
    const grown = new Float64Array(2 * cutCount);
    grown.set(cutScratch);
    cutScratch = grown;
  }
  cutScratch[cutCount++] = t;
}
function pushNumber(list: NumberList, v: number): void {
  if (list.count === list.values.length) {
    const grown = new Float64Array(2 * list.count);
    grown.set(list.values);
    list.values = grown;
  }
  list.values[list.count++] = v;
}
const clipScratchX: UpperChain = { xs: new Float64Array(128), hs: new Float64Array(128), count: 0, extent: 0 };
const clipScratchY: UpperChain = { xs: new Float64Array(128), hs: new Float64Array(128), count: 0, extent: 0 };

export function phaseTransmission(
  fullX: UpperChain,
  fullY: UpperChain,
  beamRadius: number,
  s: number,
  order: number,
  maxPanel = Math.PI / 8,
  levels: readonly number[] = [0.5, 1, 2, 4],
): number {
  const b = beamRadius;
  const limit = Math.min(b, fullX.extent);
  if (limit <= 0 || fullY.extent <= 0) return 0;
  // Only the parts of the chains inside the beam matter.
  const chainX = clipChainInto(fullX, limit, clipScratchX);
  const chainY = clipChainInto(fullY, Math.min(b, fullY.extent), clipScratchY);
  const fy = chainIntegral(chainY, s);
  const thetaMax = Math.asin(Math.min(1, limit / b));
  cutCount = 0;
  pushCut(0);
  pushCut(thetaMax);
  const xFeatures = featureScratchX;
  xFeatures.count = 0;
  chainFeatures(chainX, s, xFeatures, levels);
  for (let i = 0; i < xFeatures.count; i++) {
    const x = xFeatures.values[i];
    if (x > 0 && x < limit) pushCut(Math.asin(x / b));
  }
  const yFeatures = featureScratchY;
  yFeatures.count = 0;
  chainFeatures(chainY, s, yFeatures, levels);
  for (let i = 0; i < yFeatures.count; i++) {
    const y = yFeatures.values[i];
    if (y > 0 && y < b) {
      const t = Math.acos(y / b);
      if (t < thetaMax) pushCut(t);
    }
  }
  // Ascending (insertion sort: a few dozen cuts).
  const cuts = cutScratch;
  for (let i = 1; i < cutCount; i++) {
    const v = cuts[i];
    let j = i - 1;
    while (j >= 0 && cuts[j] > v) {
      cuts[j + 1] = cuts[j];
      j--;
    }
    cuts[j + 1] = v;
  }
  const { nodes, weights } = rule(order);
  let sum = 0;
  for (let i = 0; i + 1 < cutCount; i++) {
    const t0 = cuts[i];
    const t1 = cuts[i + 1];
    if (t1 - t0 < 1e-15) continue;
    const pieces = Math.max(1, Math.ceil((t1 - t0) / maxPanel));
    const width = (t1 - t0) / pieces;
    for (let piece = 0; piece < pieces; piece++) {
      const a = t0 + piece * width;
      const half = width / 2;
      const mid = a + half;
      let panel = 0;
      for (let k = 0; k < nodes.length; k++) {
        const theta = mid + half * nodes[k];
        const c = Math.cos(theta);
        const px = survivalAt(chainX, b * Math.sin(theta), s);
        if (px === 0) continue;
        panel += weights[k] * px * chordIntegral(fy, b * c) * c;
      }
      sum += panel * half;
    }
  }
  return (4 / (Math.PI * b)) * sum;
}

export interface FastContext {
  model: FlightModel;
  x: AxisFlight;
  y: AxisFlight;
  options: Required<FastTransmissionOptions>;
}

export function resolveOptions(options: FastTransmissionOptions = {}): Required<FastTransmissionOptions> {
  const resolved = { ...FAST_DEFAULTS, ...options };
  requireInteger('phases', resolved.phases, 1, 4096);
  requireInteger('samplesPerPeriod', resolved.samplesPerPeriod, 4, 1 << 16);
  requireInteger('quadratureOrder', resolved.quadratureOrder, 2, 64);
  requireInteger('substeps', resolved.substeps, 1, 64);
  requireFinite('hullTolerance', resolved.hullTolerance, 0, 0.01, 'none');
  requireInteger('hullKeep', resolved.hullKeep, 3, 1 << 20);
  if (!Array.isArray(resolved.panelLevels) || resolved.panelLevels.length > 16 || !resolved.panelLevels.every((k) => Number.isFinite(k) && k > 0 && k <= 64)) {
    throw new InputRangeError('panelLevels', resolved.panelLevels, 'a list of up to 16 numbers > 0 and ≤ 64');
  }
  if (typeof resolved.scaledInner !== 'boolean') throw new InputRangeError('scaledInner', resolved.scaledInner, 'true or false');
  return resolved;
}

export function prepareFlight(model: FlightModel, options: Required<FastTransmissionOptions>): FastContext {
  const { samplesPerPeriod: S, substeps, hullTolerance, hullKeep } = options;
  return {
    model,
    x: prepareAxis(model.a, model.q, model.cycles, S, substeps, hullTolerance, hullKeep),
    y: prepareAxis(-model.a, -model.q, model.cycles, S, substeps, hullTolerance, hullKeep),
    options,
  };
}

/** Outer (sampled) and inner ((1 − ε)-scaled) transmission at one entry phase (0 for a negligible phase). */
export function phaseBracket(ctx: FastContext, entryPhase: number): { outer: number; inner: number } {
  const chains = phaseChains(ctx, entryPhase);
  if ('bound' in chains) return { outer: 0, inner: 0 };
  const { beamRadius, slopeSigma } = ctx.model;
  const outer = phaseTransmission(chains.x, chains.y, beamRadius, slopeSigma, ctx.options.quadratureOrder, undefined, ctx.options.panelLevels);
  return { outer, inner: innerTransmission(ctx, chains, outer) };
}

/**
 * Entry-phase values on the grid ξ0 = kπ/P. Outer (sampled polygon) at every phase; inner ((1 − ε)-scaled)
 * at the even phases only, since the sampling bracket varies slowly with phase.
 */
export interface PhaseValues {
  phases: number;
  outer: Float64Array;
  inner: Float64Array;
  /** Per phase: bound on T where an axis's acceptance was negligible (counted as 0), else 0. */
  negligible: Float64Array;
}

interface PhaseChains {
  x: UpperChain;
  y: UpperChain;
}

/**
 * The acceptance chains of both axes at one phase (in the per-axis scratch: valid until the next phase is
 * evaluated), or the bound of a negligible phase.
 */
function phaseChains(ctx: FastContext, entry: number): PhaseChains | { bound: number } {
  const { beamRadius, slopeSigma } = ctx.model;
  const mx = acceptanceInto(ctx.x, entry, beamRadius, slopeSigma, scratchX);
  if (mx < 0) return { bound: -mx - 1 };
  const my = acceptanceInto(ctx.y, entry, beamRadius, slopeSigma, scratchY);
  if (my < 0) return { bound: -my - 1 };
  upperChainInto(scratchX.polar, mx, 1, scratchX.chain);
  upperChainInto(scratchY.polar, my, 1, scratchY.chain);
  return { x: scratchX.chain, y: scratchY.chain };
}

function innerTransmission(ctx: FastContext, chains: PhaseChains, outer: number): number {
  const { beamRadius, slopeSigma } = ctx.model;
  if (ctx.options.scaledInner) {
    const d = slopeSigma > 0 ? 2 : 1;
    return Math.pow((1 - ctx.x.epsilon) * (1 - ctx.y.epsilon), d) * outer;
  }
  scaleChainInto(chains.x, 1 - ctx.x.epsilon, scratchX.inner);
  scaleChainInto(chains.y, 1 - ctx.y.epsilon, scratchY.inner);
  return phaseTransmission(
    scratchX.inner,
    scratchY.inner,
    beamRadius,
    slopeSigma,
    ctx.options.quadratureOrder,
    undefined,
    ctx.options.panelLevels,
  );
}

/** Evaluate (or refine to) P phases, reusing the P/2 values of `previous`. */
export function evaluatePhases(ctx: FastContext, phases: number, previous: PhaseValues | null = null): PhaseValues {
  const outer = new Float64Array(phases);
  const inner = new Float64Array(phases).fill(Number.NaN);
  const negligible = new Float64Array(phases);
  const reuse = previous && previous.phases * 2 === phases ? previous : null;
  const { beamRadius, slopeSigma } = ctx.model;
  for (let k = 0; k < phases; k++) {
    if (reuse && k % 2 === 0) {
      outer[k] = reuse.outer[k / 2];
      negligible[k] = reuse.negligible[k / 2];
      if (k % 4 === 0) {
        inner[k] = reuse.inner[k / 2];
        continue;
      }
      if (negligible[k] > 0 || outer[k] === 0) {
        inner[k] = 0;
        continue;
      }
    }
    const chains = phaseChains(ctx, (k * Math.PI) / phases);
    if ('bound' in chains) {
      outer[k] = 0;
      inner[k] = 0;
      negligible[k] = chains.bound;
      continue;
    }
    if (!(reuse && k % 2 === 0)) {
      outer[k] = phaseTransmission(chains.x, chains.y, beamRadius, slopeSigma, ctx.options.quadratureOrder, undefined, ctx.options.panelLevels);
    }
    if (k % 2 === 0) inner[k] = innerTransmission(ctx, chains, outer[k]);
  }
  return { phases, outer, inner, negligible };
}

/**
 * Result from phase values. T_out(P) = mean of the outer values (trapezoid rule, periodic); the sampling bracket
 * T_out − T_in is taken from the even phases; the phase-rule error is estimated by |T_out(P) − T_out(P/2)|
 * (the P/2 rule is the even subset; for a smooth periodic integrand the P rule's error is far below this).
 * transmission = T_out(P) − bracket/2; errorBound = bracket/2 + phase-rule estimate.
 */
export function summarisePhases(values: PhaseValues): TransmissionResult & { phaseError: number; samplingError: number } {
  const P = values.phases;
  let outer = 0;
  let outerEven = 0;
  let innerEven = 0;
  for (let k = 0; k < P; k++) {
    outer += values.outer[k];
    if (k % 2 === 0) {
      outerEven += values.outer[k];
      innerEven += values.inner[k];
    }
  }
  const half = Math.max(1, Math.ceil(P / 2));
  outer /= P;
  outerEven /= half;
  innerEven /= half;
  let negligible = 0;
  for (let k = 0; k < P; k++) negligible += values.negligible[k];
  negligible /= P;
  const samplingError = 0.5 * Math.max(0, outerEven - innerEven);
  const phaseError = P >= 2 ? Math.abs(outer - outerEven) : outer;
  const transmission = Math.min(1, Math.max(0, outer - samplingError));
  return { transmission, uncertainty: 0, errorBound: samplingError + phaseError + negligible, phaseError, samplingError };
}

/** Phase-averaged transmission, doubling the phases from 16 until the error estimate meets `tolerance`. */
export function flightTransmission(ctx: FastContext, tolerance: number = Number.POSITIVE_INFINITY): TransmissionResult {
  let values = evaluatePhases(ctx, ctx.options.phases);
  let result = summarisePhases(values);
  while (result.errorBound > tolerance && values.phases < MAX_PHASES) {
    values = evaluatePhases(ctx, values.phases * 2, values);
    result = summarisePhases(values);
  }
  return { transmission: result.transmission, uncertainty: 0, errorBound: result.errorBound };
}

/** Upper limit of entry phases for the adaptive rule. */
export const MAX_PHASES = 512;

/**
 * Transmitted fraction of the ion ensemble (see the model and method above). SI inputs; m/z in u per e.
 * Throws InputRangeError naming the field and accepted range on bad input.
 */
export function transmission(p: TransmissionParams, options: FastTransmissionOptions & { relativeTolerance?: number } = {}): TransmissionResult {
  const model = flightModel(p);
  const resolved = resolveOptions(options);
  const relative = options.relativeTolerance ?? 1e-3;
  const ctx = prepareFlight(model, resolved);
  // Refine until the bound is below relativeTolerance·T (with a floor of 1e-6 absolute for T near 0).
  let values = evaluatePhases(ctx, resolved.phases);
  let result = summarisePhases(values);
  while (result.errorBound > relative * Math.max(result.transmission, 1e-3) && values.phases < MAX_PHASES) {
    values = evaluatePhases(ctx, values.phases * 2, values);
    result = summarisePhases(values);
  }
  return { transmission: result.transmission, uncertainty: 0, errorBound: result.errorBound };
}
