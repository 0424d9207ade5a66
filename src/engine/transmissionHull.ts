/**
 * Planar convex hulls for the acceptance computation. Points are interleaved [x0, y0, x1, y1, …].
 *
 * Why hulls: an ion (x0, x0') survives iff |c·(x0, x0')| < r0 for every sampled row c = (u(ξ), w(ξ)) of the
 * fundamental matrix; |c·z| is convex in c, so only the vertices of the hull of ±c matter, and the accepted set
 * is the polar polygon of that hull (scaled by r0).
 */

/** Convex hull, counter-clockwise, no repeated or collinear vertices (Andrew's monotone chain, 1979). */
export function convexHull(points: Float64Array, count: number): Float64Array {
  const keep = prefilter(points, count);
  const n = keep.length;
  if (n <= 2) {
    const out = new Float64Array(2 * n);
    for (let i = 0; i < n; i++) {
      out[2 * i] = points[2 * keep[i]];
      out[2 * i + 1] = points[2 * keep[i] + 1];
    }
    return out;
  }
  sortByXY(points, keep, 0, n);
  const out = new Float64Array(2 * n);
  const m = monotoneChain(points, keep, n, out);
  return m === n ? out : out.slice(0, 2 * m);
}

/** (x, y) order of points a and b: negative, 0 or positive. */
function compareXY(points: Float64Array, a: number, b: number): number {
  return points[2 * a] - points[2 * b] || points[2 * a + 1] - points[2 * b + 1];
}

/** Sort order[from, to) by (x, y): insertion sort for short runs, the built-in sort otherwise. */
function sortByXY(points: Float64Array, order: Uint32Array, from: number, to: number): void {
  if (to - from > 32) {
    order.subarray(from, to).sort((i, j) => points[2 * i] - points[2 * j] || points[2 * i + 1] - points[2 * j + 1]);
    return;
  }
  for (let i = from + 1; i < to; i++) {
    const v = order[i];
    const vx = points[2 * v];
    const vy = points[2 * v + 1];
    let j = i - 1;
    while (j >= from) {
      const w = order[j];
      const wx = points[2 * w];
      if (wx < vx || (wx === vx && points[2 * w + 1] <= vy)) break;
      order[j + 1] = w;
      j--;
    }
    order[j + 1] = v;
  }
}

let chainScratch = new Uint32Array(0);

/**
 * Andrew's monotone chain over points already in (x, y) order (order[0..n)); writes the hull vertices,
 * counter-clockwise from the lowest (x, y), into `out` (room for 2n numbers), cleaned as cleanHull does.
 * Returns the vertex count.
 */
function monotoneChain(points: Float64Array, order: Uint32Array, n: number, out: Float64Array): number {
  if (n <= 2) {
    for (let i = 0; i < n; i++) {
      out[2 * i] = points[2 * order[i]];
      out[2 * i + 1] = points[2 * order[i] + 1];
    }
    return n;
  }
  if (chainScratch.length < 2 * n + 1) chainScratch = new Uint32Array(4 * n + 2);
  const hull = chainScratch;
  let k = 0;
  for (let t = 0; t < n; t++) {
    const p = order[t];
    while (k >= 2 && cross(points, hull[k - 2], hull[k - 1], p) <= 0) k--;
    hull[k++] = p;
  }
  const lowerSize = k + 1;
  for (let t = n - 2; t >= 0; t--) {
    const p = order[t];
    while (k >= lowerSize && cross(points, hull[k - 2], hull[k - 1], p) <= 0) k--;
    hull[k++] = p;
  }
  k--; // last point repeats the first
  for (let i = 0; i < k; i++) {
    out[2 * i] = points[2 * hull[i]];
    out[2 * i + 1] = points[2 * hull[i] + 1];
  }
  return cleanHullInPlace(out, k);
}

/**
 * Indices offset..offset+m−1 of a convex polygon (counter-clockwise, in `points`) written to order[at..at+m) in
 * (x, y) order, in linear time: the lower chain (lowest to highest vertex, counter-clockwise) and the upper chain
 * (the other way round) are each already in order, so they are merged. False if rounding left a chain out of
 * order (the caller then sorts).
 */
function convexOrder(points: Float64Array, offset: number, m: number, order: Uint32Array, at: number): boolean {
  if (m === 0) return true;
  let low = 0;
  let high = 0;
  for (let i = 1; i < m; i++) {
    if (compareXY(points, offset + i, offset + low) < 0) low = i;
    if (compareXY(points, offset + i, offset + high) > 0) high = i;
  }
  // Lower chain: low, low + 1, …, high. Upper chain, reversed: low − 1, low − 2, …, high + 1.
  const lowerLength = ((high - low + m) % m) + 1;
  const upperLength = m - lowerLength;
  let a = 0; // steps taken along the lower chain
  let b = 0; // along the upper chain
  let out = at;
  let previous = -1;
  while (a < lowerLength || b < upperLength) {
    const ia = a < lowerLength ? offset + ((low + a) % m) : -1;
    const ib = b < upperLength ? offset + ((low - 1 - b + 2 * m) % m) : -1;
    let next: number;
    if (ib < 0 || (ia >= 0 && compareXY(points, ia, ib) <= 0)) {
      next = ia;
      a++;
    } else {
      next = ib;
      b++;
    }
    if (previous >= 0 && compareXY(points, previous, next) > 0) return false;
    order[out++] = next;
    previous = next;
  }
  return true;
}

/** Merge the sorted runs order[0..na) and order[na..na+nb) into `into` (another buffer). */
function mergeOrders(points: Float64Array, order: Uint32Array, na: number, nb: number, into: Uint32Array): void {
  let a = 0;
  let b = na;
  const endB = na + nb;
  let t = 0;
  while (a < na && b < endB) into[t++] = compareXY(points, order[a], order[b]) <= 0 ? order[a++] : order[b++];
  while (a < na) into[t++] = order[a++];
  while (b < endB) into[t++] = order[b++];
}

let orderScratch = new Uint32Array(0);
let mergedScratch = new Uint32Array(0);
function orderBuffers(n: number): void {
  if (orderScratch.length < n) {
    orderScratch = new Uint32Array(2 * n);
    mergedScratch = new Uint32Array(2 * n);
  }
}

/**
 * Hull of points[0..na) ∪ points[na..na+nb), where the first run is a convex polygon (counter-clockwise) and the
 * second either a convex polygon too (`secondConvex`) or a few loose points. Linear time apart from sorting the
 * loose points: each polygon's vertices come out in (x, y) order from its two chains, the runs are merged, and
 * one monotone chain gives the hull — the same vertices as convexHull on the union. Writes into `out` (room for
 * 2(na + nb) numbers) and returns the vertex count.
 */
export function hullOfConvexAndPoints(points: Float64Array, na: number, nb: number, secondConvex: boolean, out: Float64Array): number {
  const n = na + nb;
  orderBuffers(n);
  const order = orderScratch;
  let sorted = convexOrder(points, 0, na, order, 0);
  if (sorted) {
    if (secondConvex) sorted = convexOrder(points, na, nb, order, na);
    else {
      for (let i = 0; i < nb; i++) order[na + i] = na + i;
      sortByXY(points, order, na, n);
    }
  }
  if (!sorted) {
    for (let i = 0; i < n; i++) order[i] = i;
    sortByXY(points, order, 0, n);
    return monotoneChain(points, order, n, out);
  }
  mergeOrders(points, order, na, nb, mergedScratch);
  return monotoneChain(points, mergedScratch, n, out);
}

/**
 * Remove vertices that rounding left nearly coincident with, or nearly on the line through, their neighbours
 * (relative 1e-10): they would make the polar vertex 0/0 or ∞ and change the polygon by nothing measurable.
 * Works in place on hull[0..2m) and returns the new vertex count.
 */
function cleanHullInPlace(hull: Float64Array, count: number): number {
  let m = count;
  if (m < 3) return m;
  let clean = true;
  for (let i = 0; i < m && clean; i++) if (!vertexClean(hull, m, i)) clean = false;
  if (clean) return m;
  let changed = true;
  while (changed && m > 3) {
    changed = false;
    for (let i = 0; i < m && m > 3; i++) {
      if (!vertexClean(hull, m, i)) {
        hull.copyWithin(2 * i, 2 * i + 2, 2 * m);
        m--;
        changed = true;
        i--;
      }
    }
  }
  return m;
}

/** Vertex i of hull[0..2m) is neither (nearly) on its predecessor nor (nearly) on the line through its neighbours. */
function vertexClean(hull: Float64Array, m: number, i: number): boolean {
  const p = (i + m - 1) % m;
  const n = (i + 1) % m;
  const ax = hull[2 * i] - hull[2 * p];
  const ay = hull[2 * i + 1] - hull[2 * p + 1];
  const bx = hull[2 * n] - hull[2 * i];
  const by = hull[2 * n + 1] - hull[2 * i + 1];
  const lengthA = Math.sqrt(ax * ax + ay * ay);
  const size = Math.max(Math.sqrt(hull[2 * i] * hull[2 * i] + hull[2 * i + 1] * hull[2 * i + 1]), 1e-300);
  return !(lengthA <= 1e-10 * size || ax * by - ay * bx <= 1e-10 * lengthA * Math.sqrt(bx * bx + by * by));
}

function cleanHull(hull: Float64Array): Float64Array {
  const m = cleanHullInPlace(hull, hull.length / 2);
  return m === hull.length / 2 ? hull : hull.slice(0, 2 * m);
}

function cross(points: Float64Array, o: number, a: number, b: number): number {
  const ox = points[2 * o];
  const oy = points[2 * o + 1];
  return (points[2 * a] - ox) * (points[2 * b + 1] - oy) - (points[2 * a + 1] - oy) * (points[2 * b] - ox);
}

/**
 * Akl–Toussaint prefilter: drop points strictly inside the polygon of the extreme points in eight directions
 * (S. G. Akl, G. T. Toussaint, Inf. Process. Lett. 7 (1978) 219). It only removes points that cannot be vertices.
 */
function prefilter(points: Float64Array, count: number): Uint32Array {
  if (count < 16) return Uint32Array.from({ length: count }, (_, i) => i);
  // Directions (1, 0), (1, 1), (0, 1), (−1, 1), (−1, 0), (−1, −1), (0, −1), (1, −1), unrolled.
  const best = new Int32Array(8);
  let b0 = -Infinity, b1 = -Infinity, b2 = -Infinity, b3 = -Infinity, b4 = -Infinity, b5 = -Infinity, b6 = -Infinity, b7 = -Infinity;
  for (let i = 0; i < count; i++) {
    const x = points[2 * i];
    const y = points[2 * i + 1];
    if (x > b0) { b0 = x; best[0] = i; }
    if (x + y > b1) { b1 = x + y; best[1] = i; }
    if (y > b2) { b2 = y; best[2] = i; }
    if (y - x > b3) { b3 = y - x; best[3] = i; }
    if (-x > b4) { b4 = -x; best[4] = i; }
    if (-x - y > b5) { b5 = -x - y; best[5] = i; }
    if (-y > b6) { b6 = -y; best[6] = i; }
    if (x - y > b7) { b7 = x - y; best[7] = i; }
  }
  // The extreme points in angular order of their directions form a convex polygon (possibly with repeats).
  const ring: number[] = [];
  for (let d = 0; d < 8; d++) if (ring.length === 0 || ring[ring.length - 1] !== best[d]) ring.push(best[d]);
  if (ring.length > 1 && ring[0] === ring[ring.length - 1]) ring.pop();
  const out = new Uint32Array(count);
  let kept = 0;
  const m = ring.length;
  if (m < 3) {
    for (let i = 0; i < count; i++) out[i] = i;
    return out;
  }
  // Edge data once per edge (the same arithmetic as cross(), tolerance 1e-12·|edge|²).
  const ex = new Float64Array(m);
  const ey = new Float64Array(m);
  const dx = new Float64Array(m);
  const dy = new Float64Array(m);
  const tol = new Float64Array(m);
  for (let e = 0; e < m; e++) {
    const a = ring[e];
    const b = ring[(e + 1) % m];
    ex[e] = points[2 * a];
    ey[e] = points[2 * a + 1];
    dx[e] = points[2 * b] - ex[e];
    dy[e] = points[2 * b + 1] - ey[e];
    tol[e] = 1e-12 * (dx[e] * dx[e] + dy[e] * dy[e]);
  }
  for (let i = 0; i < count; i++) {
    const x = points[2 * i];
    const y = points[2 * i + 1];
    let inside = true;
    // Strictly left of every edge (counter-clockwise ring) → strictly inside.
    for (let e = 0; e < m && inside; e++) {
      if (dx[e] * (y - ey[e]) - dy[e] * (x - ex[e]) <= tol[e]) inside = false;
    }
    if (!inside) out[kept++] = i;
  }
  return out.slice(0, kept);
}

/** Points p·B for row vectors p and a row-major 2×2 matrix B (appended into `into` at `offset`). */
export function transformRows(points: Float64Array, count: number, b: Float64Array, into: Float64Array, offset: number): number {
  for (let i = 0; i < count; i++) {
    const x = points[2 * i];
    const y = points[2 * i + 1];
    into[2 * (offset + i)] = x * b[0] + y * b[2];
    into[2 * (offset + i) + 1] = x * b[1] + y * b[3];
  }
  return offset + count;
}

/**
 * Polar polygon {z : c·z < 1 for every vertex c} of a convex polygon containing the origin, counter-clockwise.
 * The vertex between edges c_i and c_{i+1} solves c_i·z = 1, c_{i+1}·z = 1.
 */
export function polarPolygon(hull: Float64Array): Float64Array {
  const m = hull.length / 2;
  const out = new Float64Array(2 * m);
  polarInto(hull, m, out);
  return out;
}

/** polarPolygon of hull[0..2m) into out[0..2m). */
export function polarInto(hull: Float64Array, m: number, out: Float64Array): void {
  for (let i = 0; i < m; i++) {
    const j = i + 1 === m ? 0 : i + 1;
    const ax = hull[2 * i];
    const ay = hull[2 * i + 1];
    const bx = hull[2 * j];
    const by = hull[2 * j + 1];
    const det = ax * by - ay * bx;
    out[2 * i] = (by - ay) / det;
    out[2 * i + 1] = (ax - bx) / det;
  }
}

/**
 * O(log m) strict-inside test for a convex polygon (counter-clockwise) that contains the origin: find the wedge
 * from the origin that holds the point by binary search on angle (ordered from vertex 0), then test that edge.
 */
export class ConvexIndex {
  private readonly xs: Float64Array;
  private readonly ys: Float64Array;
  private readonly halves: Uint8Array;
  readonly size: number;
  constructor(polygon: Float64Array) {
    const m = polygon.length / 2;
    this.size = m;
    this.xs = new Float64Array(m);
    this.ys = new Float64Array(m);
    this.halves = new Uint8Array(m);
    for (let i = 0; i < m; i++) {
      this.xs[i] = polygon[2 * i];
      this.ys[i] = polygon[2 * i + 1];
    }
    for (let i = 0; i < m; i++) this.halves[i] = this.half(this.xs[i], this.ys[i]);
  }

  /** 0 for angles [θ0, θ0 + π) measured from vertex 0, 1 for the rest. */
  private half(x: number, y: number): number {
    const c = this.xs[0] * y - this.ys[0] * x;
    if (c > 0) return 0;
    if (c < 0) return 1;
    return this.xs[0] * x + this.ys[0] * y > 0 ? 0 : 1;
  }

  /**
   * The wedge from the origin that holds direction (x, y): the last vertex i whose angle, counted counter-clockwise
   * from vertex 0, is ≤ the point's (so the point lies between vertices i and i + 1, cyclically).
   */
  wedge(x: number, y: number): number {
    const m = this.size;
    const h = this.half(x, y);
    let lo = 0;
    let hi = m - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      const hm = this.halves[mid];
      const before = hm < h || (hm === h && this.xs[mid] * y - this.ys[mid] * x >= 0);
      if (before) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  }

  /** Strictly inside the edge of wedge i. */
  insideEdge(i: number, x: number, y: number): boolean {
    const j = i + 1 === this.size ? 0 : i + 1;
    const ex = this.xs[j] - this.xs[i];
    const ey = this.ys[j] - this.ys[i];
    const cross = ex * (y - this.ys[i]) - ey * (x - this.xs[i]);
    return cross > 1e-12 * (Math.abs(ex) + Math.abs(ey)) * (Math.abs(x) + Math.abs(y));
  }

  contains(x: number, y: number): boolean {
    if (this.size < 3) return false;
    return this.insideEdge(this.wedge(x, y), x, y);
  }
}

/** True when no vertex of the polygon would be removed by the hull routines' clean-up (see cleanHullInPlace). */
export function isCleanHull(hull: Float64Array): boolean {
  const m = hull.length / 2;
  if (m < 3) return true;
  for (let i = 0; i < m; i++) if (!vertexClean(hull, m, i)) return false;
  return true;
}

let sequenceScratch = new Float64Array(0);
let sequenceIds = new Int32Array(0);
let extraOrder = new Int32Array(0);
let stackScratch = new Int32Array(0);

/**
 * Hull of a convex polygon `core` (m vertices, counter-clockwise, containing the origin, with `index` its
 * ConvexIndex) and k extra points outside it whose wedges (ConvexIndex.wedge) are given. The extras are slotted
 * into the core's vertex sequence by wedge and angle, which keeps the sequence in angular order about the origin,
 * an interior point; one scan that drops every vertex without a strict left turn, started at the highest (x, y)
 * point (a hull vertex), gives the hull (J. Sklansky, Pattern Recognit. Lett. 1 (1982) 79, for polygons
 * star-shaped from an interior point). O(m + k²) with k small. Cleaned as cleanHullInPlace does; when
 * `coreClean`, only vertices whose neighbours changed are checked. Writes `out`, returns the vertex count.
 */
export function insertIntoConvex(
  core: Float64Array,
  m: number,
  coreClean: boolean,
  extras: Float64Array,
  wedges: Int32Array,
  k: number,
  out: Float64Array,
): number {
  const total = m + k;
  if (sequenceIds.length < total + 1) {
    sequenceScratch = new Float64Array(4 * total + 4);
    sequenceIds = new Int32Array(2 * total + 2);
    stackScratch = new Int32Array(2 * total + 2);
  }
  if (extraOrder.length < k) extraOrder = new Int32Array(2 * k);
  // Extras by wedge, then counter-clockwise within the wedge (a wedge spans less than π).
  const order = extraOrder;
  for (let e = 0; e < k; e++) {
    let j = e - 1;
    const we = wedges[e];
    const ex = extras[2 * e];
    const ey = extras[2 * e + 1];
    while (j >= 0) {
      const f = order[j];
      const wf = wedges[f];
      if (wf < we || (wf === we && extras[2 * f] * ey - extras[2 * f + 1] * ex >= 0)) break;
      order[j + 1] = f;
      j--;
    }
    order[j + 1] = e;
  }
  const seq = sequenceScratch;
  const ids = sequenceIds;
  let n = 0;
  let t = 0;
  for (let i = 0; i < m; i++) {
    seq[2 * n] = core[2 * i];
    seq[2 * n + 1] = core[2 * i + 1];
    ids[n++] = i;
    while (t < k && wedges[order[t]] === i) {
      const e = order[t++];
      seq[2 * n] = extras[2 * e];
      seq[2 * n + 1] = extras[2 * e + 1];
      ids[n++] = m + e;
    }
  }
  // Start at the highest (x, y) point: always a hull vertex.
  let start = 0;
  for (let i = 1; i < n; i++) {
    if (seq[2 * i] > seq[2 * start] || (seq[2 * i] === seq[2 * start] && seq[2 * i + 1] > seq[2 * start + 1])) start = i;
  }
  const stack = stackScratch;
  let top = 0;
  stack[top++] = start;
  for (let j = 1; j <= n; j++) {
    const p = start + j >= n ? start + j - n : start + j;
    const px = seq[2 * p];
    const py = seq[2 * p + 1];
    while (top >= 2) {
      const o = stack[top - 2];
      const a = stack[top - 1];
      const ox = seq[2 * o];
      const oy = seq[2 * o + 1];
      if ((seq[2 * a] - ox) * (py - oy) - (seq[2 * a + 1] - oy) * (px - ox) > 0) break;
      top--;
    }
    stack[top++] = p;
  }
  top--; // the start again
  for (let i = 0; i < top; i++) {
    out[2 * i] = seq[2 * stack[i]];
    out[2 * i + 1] = seq[2 * stack[i] + 1];
  }
  if (top < 3) return cleanHullInPlace(out, top);
  // Clean-up: a core vertex between its own core neighbours is as clean as in the core.
  let clean = true;
  for (let i = 0; i < top && clean; i++) {
    const id = ids[stack[i]];
    if (coreClean && id < m) {
      const before = ids[stack[i === 0 ? top - 1 : i - 1]];
      const after = ids[stack[i + 1 === top ? 0 : i + 1]];
      if (before === (id === 0 ? m - 1 : id - 1) && after === (id + 1 === m ? 0 : id + 1)) continue;
    }
    if (!vertexClean(out, top, i)) clean = false;
  }
  return clean ? top : cleanHullInPlace(out, top);
}

/**
 * Hull of a convex polygon (counter-clockwise) and a few extra points, by inserting the points one at a time:
 * the edges a point sees form one run; they are replaced by two edges through the point. O(m) per point, in two
 * scratch buffers (no allocation per point).
 */
let scratchA = new Float64Array(0);
let scratchB = new Float64Array(0);
export function insertIntoHull(polygon: Float64Array, extra: Float64Array, extraCount: number): Float64Array {
  const capacity = polygon.length + 2 * extraCount;
  if (scratchA.length < capacity) {
    scratchA = new Float64Array(2 * capacity);
    scratchB = new Float64Array(2 * capacity);
  }
  let poly = scratchA;
  let next = scratchB;
  poly.set(polygon);
  let m = polygon.length / 2;
  let changed = false;
  for (let e = 0; e < extraCount; e++) {
    const px = extra[2 * e];
    const py = extra[2 * e + 1];
    // Edge i (vertex i → i + 1) is seen from p when p is strictly to its right.
    let first = -1;
    for (let i = 0; i < m; i++) {
      const j = i + 1 === m ? 0 : i + 1;
      if ((poly[2 * j] - poly[2 * i]) * (py - poly[2 * i + 1]) - (poly[2 * j + 1] - poly[2 * i + 1]) * (px - poly[2 * i]) < 0) {
        first = i;
        break;
      }
    }
    if (first < 0) continue;
    // Walk back to the start of the visible run, then forward to its end.
    let start = first;
    for (;;) {
      const i = start === 0 ? m - 1 : start - 1;
      if (i === first) break;
      const j = start;
      if (!((poly[2 * j] - poly[2 * i]) * (py - poly[2 * i + 1]) - (poly[2 * j + 1] - poly[2 * i + 1]) * (px - poly[2 * i]) < 0)) break;
      start = i;
    }
    let end = first;
    for (;;) {
      const i = end + 1 === m ? 0 : end + 1;
      if (i === start) break;
      const j = i + 1 === m ? 0 : i + 1;
      if (!((poly[2 * j] - poly[2 * i]) * (py - poly[2 * i + 1]) - (poly[2 * j + 1] - poly[2 * i + 1]) * (px - poly[2 * i]) < 0)) break;
      end = i;
    }
    // Keep vertices from end+1 round to start (inclusive), then the new point.
    const kept = ((start - (end + 1) + 2 * m) % m) + 1;
    for (let t = 0, i = (end + 1) % m; t < kept; t++, i = i + 1 === m ? 0 : i + 1) {
      next[2 * t] = poly[2 * i];
      next[2 * t + 1] = poly[2 * i + 1];
    }
    next[2 * kept] = px;
    next[2 * kept + 1] = py;
    m = kept + 1;
    const swap = poly;
    poly = next;
    next = swap;
    changed = true;
  }
  return changed ? cleanHull(poly.slice(0, 2 * m)) : polygon;
}

/**
 * Drop vertices of a convex polygon around the origin (counter-clockwise) while keeping H ⊆ (1 + δ)·H',
 * H' the result (a subset of the vertices, so H' ⊆ H). A vertex v between kept neighbours a, b is dropped only if
 * n·v ≤ (1 + δ)·n·a for the outward normal n of ab — then v lies in the triangle 0, (1+δ)a, (1+δ)b.
 * Long flights of stable ions give hulls with ~2 vertices per RF cycle on a smooth curve; this bounds the count.
 */
export function simplifyHull(hull: Float64Array, delta: number, maxRun = 64, minVertices = 256): Float64Array {
  const m = hull.length / 2;
  // Small hulls cost little downstream: keep them exact.
  if (m <= minVertices || delta <= 0) return hull;
  const out = new Float64Array(2 * m);
  const kept = simplifyInto(hull, m, delta, maxRun, minVertices, out);
  return out.slice(0, 2 * kept);
}

/** simplifyHull of hull[0..2m) into `out` (not `hull`; room for 2m numbers); returns the kept vertex count. */
export function simplifyInto(hull: Float64Array, m: number, delta: number, maxRun: number, minVertices: number, out: Float64Array): number {
  if (m <= minVertices || delta <= 0) {
    out.set(hull.subarray(0, 2 * m));
    return m;
  }
  // Start from the vertex farthest from the origin (always kept).
  let start = 0;
  let far = -1;
  for (let i = 0; i < m; i++) {
    const r = hull[2 * i] * hull[2 * i] + hull[2 * i + 1] * hull[2 * i + 1];
    if (r > far) {
      far = r;
      start = i;
    }
  }
  let a = 0; // offset from start
  let kept = 0;
  out[0] = hull[2 * start];
  out[1] = hull[2 * start + 1];
  kept = 1;
  while (a < m) {
    let best = a + 1;
    for (let b = a + 2; b <= m && b - a <= maxRun; b++) {
      const ia = (start + a) % m;
      const ib = (start + b) % m;
      const ax = hull[2 * ia];
      const ay = hull[2 * ia + 1];
      const nx = hull[2 * ib + 1] - ay;
      const ny = -(hull[2 * ib] - ax);
      const d = nx * ax + ny * ay;
      if (!(d > 0)) break;
      let ok = true;
      for (let t = a + 1; t < b && ok; t++) {
        const it = (start + t) % m;
        if (nx * hull[2 * it] + ny * hull[2 * it + 1] > (1 + delta) * d) ok = false;
      }
      if (!ok) break;
      best = b;
    }
    a = best;
    if (a < m) {
      const i = (start + a) % m;
      out[2 * kept] = hull[2 * i];
      out[2 * kept + 1] = hull[2 * i + 1];
      kept++;
    }
  }
  return kept;
}
