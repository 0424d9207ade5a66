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
 * each phase then adds its own partial first and last periods.
 * For each x0 the accepted x0' is an interval [lo, hi] of a piecewise-linear concave chain, so the Gaussian
 * velocity integral is Φ(hi/s) − Φ(lo/s); the y-side integral over the chord of the disc has a closed form
 * (∫Φ = τΦ + φ on each linear piece); the remaining integral over x0 uses Gauss–Legendre panels split at every
 * feature (chain zero crossings and ends), after x0 = b sin θ removes the square root at the rim of the disc.
 * The entry phase is averaged with the trapezoid rule on a uniform periodic grid (exponentially convergent for
 * smooth periodic integrands; checked against twice the phases in the tests).
 *
 * ERROR BOUND. Between two samples ξ_k, ξ_k + h, e = x − (chord) satisfies e'' = −g·x, |g| ≤ G = |a| + 2|q|, so
 * max|x| ≤ max(|x_k|, |x_k+1|) + h²G/8·max|x|. With ε = h²G/8 (h = π/S) the true acceptance lies between the
 * sampled polygon A and (1 − ε)·A. Both are integrated: T_in ≤ T ≤ T_out. We return the midpoint and the
 * half-width as `errorBound` (rigorous for the sampling; the Magnus tables, erfc and quadrature add < 1e-7,
 * checked by convergence tests). `uncertainty` is 0: nothing here is random.
 */
import { convexHull, polarPolygon, transformRows } from './transmissionHull';
import { gaussLegendre, meanNormalCdf, normalCdf } from './transmissionMath';
import { fundamentalAt, monodromy, multiply2, periodTable, power2, type PeriodTable } from './trajectoryMathieu';
import { flightModel, requireInteger, type FlightModel, type TransmissionParams } from './peakInput';

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
  /** Entry phases averaged; default 32. */
  phases?: number;
  /** Gauss–Legendre order per panel; default 8. */
  quadratureOrder?: number;
  /** Magnus steps between samples; default 2. */
  substeps?: number;
}

export const FAST_DEFAULTS = { samplesPerPeriod: 128, phases: 32, quadratureOrder: 8, substeps: 2 } as const;

/** A c-space hull beyond this size means the acceptance is thinner than 1e-80 of the beam: T = 0 (documented). */
const COLLAPSE_LIMIT = 1e80;

/** Everything about one transverse axis that does not depend on the entry phase. */
export interface AxisFlight {
  table: PeriodTable;
  monodromy: Float64Array;
  cycles: number;
  /** Hull (r-space, phase-0 frame) of whole periods 1..coreEnd, or null if none. */
  core: Float64Array | null;
  coreEnd: number;
  /** The motion grows so fast that nothing survives (see COLLAPSE_LIMIT). */
  collapsed: boolean;
  /** Relative overshoot bound ε = h²G/8 between samples. */
  epsilon: number;
}

export function prepareAxis(A: number, Q: number, cycles: number, samples: number, substeps: number): AxisFlight {
  const table = periodTable(A, Q, samples, substeps);
  const m = monodromy(table);
  const h = Math.PI / samples;
  const epsilon = (h * h * (Math.abs(A) + 2 * Math.abs(Q))) / 8;
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
  let collapsed = false;
  if (coreEnd >= 1) {
    // D_k = hull of periods 0..k−1; binary doubling from the top bit of coreEnd.
    let d = h1;
    let mk = m; // M^k
    const bits = coreEnd.toString(2);
    for (let i = 1; i < bits.length && !collapsed; i++) {
      d = mergeHull(d, d, mk);
      mk = multiply2(mk, mk);
      if (bits[i] === '1') {
        d = mergeHull(d, h1, mk);
        mk = multiply2(mk, m);
      }
      if (maxAbs(mk) > COLLAPSE_LIMIT || maxAbs(d) > COLLAPSE_LIMIT) collapsed = true;
    }
    if (!collapsed) {
      const shifted = new Float64Array(d.length);
      transformRows(d, d.length / 2, m, shifted, 0);
      core = convexHull(shifted, shifted.length / 2);
    }
  }
  return { table, monodromy: m, cycles, core, coreEnd, collapsed, epsilon };
}

function mergeHull(d: Float64Array, e: Float64Array, b: Float64Array): Float64Array {
  const nd = d.length / 2;
  const ne = e.length / 2;
  const all = new Float64Array(2 * (nd + ne));
  all.set(d);
  transformRows(e, ne, b, all, nd);
  return convexHull(all, nd + ne);
}

function maxAbs(v: Float64Array): number {
  let m = 0;
  for (let i = 0; i < v.length; i++) m = Math.max(m, Math.abs(v[i]));
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
 * Hull of ±c(ξ) over the sampled flight for entry phase ξ0 (c-space: x(ξ)/r0 = c·(x0, x0')/r0), counter-clockwise;
 * null if the axis collapsed. max over its vertices of |c·z| is the largest sampled |x|/r0 of the ion z.
 */
export function constraintHull(axis: AxisFlight, entryPhase: number): Float64Array | null {
  if (axis.collapsed) return null;
  const { table, cycles } = axis;
  const S = table.samples;
  const spacing = Math.PI / S;
  const end = entryPhase + cycles * Math.PI;
  const lastPeriod = Math.floor(end / Math.PI);
  const firstExtra = Math.max(1, axis.coreEnd + 1);
  const extraPeriods = Math.max(0, lastPeriod - firstExtra + 1);
  const coreCount = axis.core ? axis.core.length / 2 : 0;
  const capacity = coreCount + 2 * ((S + 2) * (1 + extraPeriods) + 2);
  const pts = new Float64Array(2 * capacity);
  let count = 0;
  if (axis.core) {
    pts.set(axis.core);
    count = coreCount;
  }
  const push = (x: number, y: number): void => {
    pts[2 * count] = x;
    pts[2 * count + 1] = y;
    pts[2 * count + 2] = -x;
    pts[2 * count + 3] = -y;
    count += 2;
  };
  const entry = new Float64Array(4);
  fundamentalAt(table, entryPhase, entry);
  push(entry[0], entry[1]);
  // Period 0: samples after the entry, up to the exit if the flight ends in this period.
  const j0 = Math.floor(entryPhase / spacing) + 1;
  for (let j = j0; j <= S; j++) {
    if (j * spacing > end) break;
    push(table.u[j], table.w[j]);
  }
  // Periods after the core, up to the exit.
  let mp = power2(axis.monodromy, firstExtra);
  for (let p = firstExtra; p <= lastPeriod; p++) {
    const m0 = mp[0];
    const m1 = mp[1];
    const m2 = mp[2];
    const m3 = mp[3];
    for (let j = 0; j < S; j++) {
      if (p * Math.PI + j * spacing > end) break;
      const u = table.u[j];
      const w = table.w[j];
      push(u * m0 + w * m2, u * m1 + w * m3);
    }
    if (p < lastPeriod) mp = multiply2(mp, axis.monodromy);
  }
  // Exit point.
  const exit = new Float64Array(4);
  const lastStart = lastPeriod * Math.PI;
  const mEnd = power2(axis.monodromy, lastPeriod);
  fundamentalAt(table, end - lastStart, exit);
  push(exit[0] * mEnd[0] + exit[1] * mEnd[2], exit[0] * mEnd[1] + exit[1] * mEnd[3]);

  const hull = convexHull(pts, count);
  if (maxAbs(hull) > COLLAPSE_LIMIT) return null;
  // c = r·Φ(ξ0)⁻¹, Φ⁻¹ = [[w', −w], [−u', u]] (det Φ = 1).
  const inverse = Float64Array.of(entry[3], -entry[1], -entry[2], entry[0]);
  const c = new Float64Array(hull.length);
  transformRows(hull, hull.length / 2, inverse, c, 0);
  return c;
}

/** Largest sampled |x|/r0 along the flight of an ion entering at ξ0 with (x0, x0') in units of r0. */
export function sampledExcursion(hull: Float64Array, x0: number, slope0: number): number {
  let m = 0;
  for (let i = 0; i < hull.length; i += 2) m = Math.max(m, Math.abs(hull[i] * x0 + hull[i + 1] * slope0));
  return m;
}

/** Upper boundary x0'max(x0) of a centrally symmetric convex polygon, as increasing x with heights. */
export interface UpperChain {
  xs: Float64Array;
  hs: Float64Array;
  /** Half-width of the polygon in x. */
  extent: number;
}

export function upperChain(polygon: Float64Array, scale = 1): UpperChain {
  const m = polygon.length / 2;
  let right = 0;
  let left = 0;
  for (let i = 1; i < m; i++) {
    const x = polygon[2 * i];
    const y = polygon[2 * i + 1];
    if (x > polygon[2 * right] || (x === polygon[2 * right] && y > polygon[2 * right + 1])) right = i;
    if (x < polygon[2 * left]) left = i;
  }
  const minX = polygon[2 * left];
  const indices: number[] = [];
  for (let i = right; ; i = (i + 1) % m) {
    indices.push(i);
    if (polygon[2 * i] === minX) break;
    if (indices.length > m) break;
  }
  const k = indices.length;
  const xs = new Float64Array(k);
  const hs = new Float64Array(k);
  for (let t = 0; t < k; t++) {
    const i = indices[k - 1 - t];
    xs[t] = scale * polygon[2 * i];
    hs[t] = scale * polygon[2 * i + 1];
  }
  return { xs, hs, extent: scale * polygon[2 * right] };
}

/** Index k with xs[k] ≤ x ≤ xs[k+1] (clamped). */
function segmentOf(xs: Float64Array, x: number): number {
  let lo = 0;
  let hi = xs.length - 1;
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
  const { xs, hs } = chain;
  if (xs.length === 1) return hs[0];
  const k = segmentOf(xs, x);
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

/** Cumulative F(y) = ∫_{−extent}^{y} Φ(hi(t)/s) dt at the chain vertices (closed form per linear piece). */
function cumulative(chain: UpperChain, s: number): Float64Array {
  const { xs, hs } = chain;
  const f = new Float64Array(xs.length);
  for (let k = 0; k + 1 < xs.length; k++) f[k + 1] = f[k] + (xs[k + 1] - xs[k]) * segmentMean(hs[k], hs[k + 1], s);
  return f;
}

function cumulativeAt(chain: UpperChain, f: Float64Array, s: number, y: number): number {
  const { xs, hs } = chain;
  if (xs.length === 1) return 0;
  const k = segmentOf(xs, y);
  const dy = y - xs[k];
  if (dy <= 0) return f[k];
  return f[k] + dy * segmentMean(hs[k], heightAt(chain, y), s);
}

/** C(Y) = ∫_0^Y P(y) dy = F(Y) − F(−Y) − Y for Y inside the polygon's extent, constant beyond. */
function chordIntegral(chain: UpperChain, f: Float64Array, s: number, Y: number): number {
  const y = Math.min(Y, chain.extent);
  if (y <= 0) return 0;
  const value = cumulativeAt(chain, f, s, y) - cumulativeAt(chain, f, s, -y) - y;
  return value > 0 ? value : 0;
}

/** Zero crossings of the chain height (features of P where Φ(hi/s) switches) with the local |slope|. */
function chainFeatures(chain: UpperChain, s: number, out: number[]): void {
  const { xs, hs } = chain;
  out.push(chain.extent);
  for (let k = 0; k + 1 < xs.length; k++) {
    if ((hs[k] > 0) !== (hs[k + 1] > 0)) {
      const dx = xs[k + 1] - xs[k];
      const slope = (hs[k + 1] - hs[k]) / dx;
      const x = xs[k] - hs[k] / slope;
      const width = s / Math.abs(slope);
      for (const sign of [1, -1]) {
        const at = sign * x;
        out.push(at);
        if (s > 0) out.push(at - width, at + width, at - 3 * width, at + 3 * width);
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
export function phaseTransmission(chainX: UpperChain, chainY: UpperChain, beamRadius: number, s: number, order: number): number {
  const b = beamRadius;
  const fy = cumulative(chainY, s);
  const limit = Math.min(b, chainX.extent);
  if (limit <= 0 || chainY.extent <= 0) return 0;
  const thetaMax = Math.asin(Math.min(1, limit / b));
  const xFeatures: number[] = [];
  chainFeatures(chainX, s, xFeatures);
  const yFeatures: number[] = [];
  chainFeatures(chainY, s, yFeatures);
  const cuts: number[] = [0, thetaMax];
  for (const x of xFeatures) if (x > 0 && x < limit) cuts.push(Math.asin(x / b));
  for (const y of yFeatures) if (y > 0 && y < b) {
    const t = Math.acos(y / b);
    if (t < thetaMax) cuts.push(t);
  }
  cuts.sort((p, q) => p - q);
  const { nodes, weights } = rule(order);
  const maxPanel = Math.PI / 16;
  let sum = 0;
  for (let i = 0; i + 1 < cuts.length; i++) {
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
        panel += weights[k] * px * chordIntegral(chainY, fy, s, b * c) * c;
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
  return resolved;
}

export function prepareFlight(model: FlightModel, options: Required<FastTransmissionOptions>): FastContext {
  const { samplesPerPeriod: S, substeps } = options;
  return {
    model,
    x: prepareAxis(model.a, model.q, model.cycles, S, substeps),
    y: prepareAxis(-model.a, -model.q, model.cycles, S, substeps),
    options,
  };
}

/** Outer (sampled) and inner ((1 − ε)-scaled) transmission at one entry phase. */
export function phaseBracket(ctx: FastContext, entryPhase: number): { outer: number; inner: number } {
  const px = acceptancePolygon(ctx.x, entryPhase);
  const py = px ? acceptancePolygon(ctx.y, entryPhase) : null;
  if (!px || !py) return { outer: 0, inner: 0 };
  const { beamRadius, slopeSigma } = ctx.model;
  const order = ctx.options.quadratureOrder;
  const outer = phaseTransmission(upperChain(px), upperChain(py), beamRadius, slopeSigma, order);
  const inner = phaseTransmission(upperChain(px, 1 - ctx.x.epsilon), upperChain(py, 1 - ctx.y.epsilon), beamRadius, slopeSigma, order);
  return { outer, inner };
}

/** Phase-averaged bracket for a prepared flight. */
export function flightTransmission(ctx: FastContext): TransmissionResult {
  if (ctx.x.collapsed || ctx.y.collapsed) return { transmission: 0, uncertainty: 0, errorBound: 0 };
  const P = ctx.options.phases;
  let outer = 0;
  let inner = 0;
  for (let k = 0; k < P; k++) {
    const r = phaseBracket(ctx, (k * Math.PI) / P);
    outer += r.outer;
    inner += r.inner;
  }
  outer /= P;
  inner /= P;
  return { transmission: 0.5 * (outer + inner), uncertainty: 0, errorBound: 0.5 * Math.abs(outer - inner) };
}

/**
 * Transmitted fraction of the ion ensemble (see the model and method above). SI inputs; m/z in u per e.
 * Throws PeakInputError naming the field and accepted range on bad input.
 */
export function transmission(p: TransmissionParams, options: FastTransmissionOptions = {}): TransmissionResult {
  const model = flightModel(p);
  const resolved = resolveOptions(options);
  return flightTransmission(prepareFlight(model, resolved));
}
