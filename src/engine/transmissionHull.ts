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
  keep.sort((i, j) => points[2 * i] - points[2 * j] || points[2 * i + 1] - points[2 * j + 1]);
  const hull = new Uint32Array(2 * n + 1);
  let k = 0;
  for (let t = 0; t < n; t++) {
    const p = keep[t];
    while (k >= 2 && cross(points, hull[k - 2], hull[k - 1], p) <= 0) k--;
    hull[k++] = p;
  }
  const lowerSize = k + 1;
  for (let t = n - 2; t >= 0; t--) {
    const p = keep[t];
    while (k >= lowerSize && cross(points, hull[k - 2], hull[k - 1], p) <= 0) k--;
    hull[k++] = p;
  }
  k--; // last point repeats the first
  const out = new Float64Array(2 * k);
  for (let i = 0; i < k; i++) {
    out[2 * i] = points[2 * hull[i]];
    out[2 * i + 1] = points[2 * hull[i] + 1];
  }
  return out;
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
  const directions = [1, 0, 1, 1, 0, 1, -1, 1, -1, 0, -1, -1, 0, -1, 1, -1];
  const best = new Int32Array(8);
  const bestValue = new Float64Array(8).fill(-Infinity);
  for (let i = 0; i < count; i++) {
    const x = points[2 * i];
    const y = points[2 * i + 1];
    for (let d = 0; d < 8; d++) {
      const v = directions[2 * d] * x + directions[2 * d + 1] * y;
      if (v > bestValue[d]) {
        bestValue[d] = v;
        best[d] = i;
      }
    }
  }
  // The extreme points in angular order of their directions form a convex polygon (possibly with repeats).
  const ring: number[] = [];
  for (let d = 0; d < 8; d++) if (ring.length === 0 || ring[ring.length - 1] !== best[d]) ring.push(best[d]);
  if (ring.length > 1 && ring[0] === ring[ring.length - 1]) ring.pop();
  const out = new Uint32Array(count);
  let kept = 0;
  const m = ring.length;
  for (let i = 0; i < count; i++) {
    let inside = m >= 3;
    for (let e = 0; e < m && inside; e++) {
      const a = ring[e];
      const b = ring[(e + 1) % m];
      // Strictly left of every edge (counter-clockwise ring) → strictly inside.
      if (cross(points, a, b, i) <= 1e-12 * scaleOf(points, a, b)) inside = false;
    }
    if (!inside) out[kept++] = i;
  }
  return out.slice(0, kept);
}

function scaleOf(points: Float64Array, a: number, b: number): number {
  const dx = points[2 * b] - points[2 * a];
  const dy = points[2 * b + 1] - points[2 * a + 1];
  return dx * dx + dy * dy;
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
  for (let i = 0; i < m; i++) {
    const j = (i + 1) % m;
    const ax = hull[2 * i];
    const ay = hull[2 * i + 1];
    const bx = hull[2 * j];
    const by = hull[2 * j + 1];
    const det = ax * by - ay * bx;
    out[2 * i] = (by - ay) / det;
    out[2 * i + 1] = (ax - bx) / det;
  }
  return out;
}
