// Planar hull helpers (src/engine/transmissionHull.ts) against brute-force definitions on seeded random sets.
import { describe, expect, it } from 'vitest';
import { ConvexIndex, convexHull, insertIntoHull, polarPolygon, simplifyHull } from '../../../src/engine/transmissionHull';
import { seededRandom } from '../../../src/engine/peakRandom';

function symmetricCloud(seed: number, n: number, stretch = 1): Float64Array {
  const r = seededRandom(seed);
  const pts = new Float64Array(4 * n);
  for (let i = 0; i < n; i++) {
    const x = stretch * r.normal();
    const y = r.normal() + 0.3 * x;
    pts.set([x, y, -x, -y], 4 * i);
  }
  return pts;
}

/** Largest c·p over the hull's edges' support, i.e. p inside iff for every edge cross ≥ −tol. */
function insideHull(hull: Float64Array, x: number, y: number, tol = 1e-9): boolean {
  const m = hull.length / 2;
  for (let i = 0; i < m; i++) {
    const j = (i + 1) % m;
    const ex = hull[2 * j] - hull[2 * i];
    const ey = hull[2 * j + 1] - hull[2 * i + 1];
    if (ex * (y - hull[2 * i + 1]) - ey * (x - hull[2 * i]) < -tol * Math.hypot(ex, ey)) return false;
  }
  return true;
}

describe('convexHull', () => {
  it('contains every input point, is counter-clockwise and its vertices are input points', () => {
    for (const seed of [1, 2, 3]) {
      const pts = symmetricCloud(seed, 300, seed);
      const hull = convexHull(pts, pts.length / 2);
      for (let i = 0; i < pts.length; i += 2) expect(insideHull(hull, pts[i], pts[i + 1])).toBe(true);
      let area = 0;
      const m = hull.length / 2;
      for (let i = 0; i < m; i++) {
        const j = (i + 1) % m;
        area += hull[2 * i] * hull[2 * j + 1] - hull[2 * j] * hull[2 * i + 1];
        let found = false;
        for (let k = 0; k < pts.length && !found; k += 2) found = pts[k] === hull[2 * i] && pts[k + 1] === hull[2 * i + 1];
        expect(found).toBe(true);
      }
      expect(area).toBeGreaterThan(0);
    }
  });

  it('insertIntoHull equals the hull of the union', () => {
    const base = convexHull(symmetricCloud(4, 200), 400);
    const extra = Float64Array.from([5, 1, -5, -1, 0.1, 0.1, 0, 6, 0, -6]);
    const inserted = insertIntoHull(base, extra, 5);
    const all = new Float64Array(base.length + extra.length);
    all.set(base);
    all.set(extra, base.length);
    const direct = convexHull(all, all.length / 2);
    expect(inserted.length).toBe(direct.length);
    for (let i = 0; i < direct.length; i += 2) expect(insideHull(inserted, direct[i], direct[i + 1])).toBe(true);
    for (let i = 0; i < inserted.length; i += 2) expect(insideHull(direct, inserted[i], inserted[i + 1])).toBe(true);
  });
});

describe('polarPolygon', () => {
  it('each polar vertex z satisfies c·z ≤ 1 for every hull vertex c, with equality on its two edges', () => {
    const hull = convexHull(symmetricCloud(5, 100, 3), 200);
    const polar = polarPolygon(hull);
    const m = hull.length / 2;
    for (let i = 0; i < m; i++) {
      const zx = polar[2 * i];
      const zy = polar[2 * i + 1];
      let max = -Infinity;
      for (let k = 0; k < m; k++) max = Math.max(max, hull[2 * k] * zx + hull[2 * k + 1] * zy);
      expect(Math.abs(max - 1)).toBeLessThan(1e-12);
      const j = (i + 1) % m;
      expect(Math.abs(hull[2 * i] * zx + hull[2 * i + 1] * zy - 1)).toBeLessThan(1e-12);
      expect(Math.abs(hull[2 * j] * zx + hull[2 * j + 1] * zy - 1)).toBeLessThan(1e-12);
    }
  });
});

describe('ConvexIndex.contains', () => {
  it('agrees with the brute-force edge test away from the boundary', () => {
    const hull = convexHull(symmetricCloud(6, 300, 2), 600);
    const index = new ConvexIndex(hull);
    const r = seededRandom(9);
    for (let i = 0; i < 5000; i++) {
      const x = 4 * r.normal();
      const y = 4 * r.normal();
      const brute = insideHull(hull, x, y, 1e-6) && insideHull(hull, x, y, -1e-6);
      const outside = !insideHull(hull, x, y, 1e-6);
      if (brute) expect(index.contains(x, y)).toBe(true);
      if (outside) expect(index.contains(x, y)).toBe(false);
    }
  });
});

describe('simplifyHull', () => {
  it('keeps a subset whose (1 + δ) scaling contains every original vertex', () => {
    // A fine ellipse: 4000 vertices on a smooth curve, like the core hull of a long stable flight.
    const n = 4000;
    const pts = new Float64Array(2 * n);
    for (let i = 0; i < n; i++) {
      const t = (2 * Math.PI * i) / n;
      pts[2 * i] = 3 * Math.cos(t) + 0.5 * Math.sin(t);
      pts[2 * i + 1] = Math.sin(t);
    }
    const hull = convexHull(pts, n);
    for (const delta of [1e-5, 1e-4]) {
      const thin = simplifyHull(hull, delta);
      expect(thin.length).toBeLessThan(hull.length);
      const scaled = thin.map((v) => v * (1 + delta));
      for (let i = 0; i < hull.length; i += 2) expect(insideHull(scaled, hull[i], hull[i + 1], 1e-12)).toBe(true);
      for (let i = 0; i < thin.length; i += 2) expect(insideHull(hull, thin[i], thin[i + 1], 1e-12)).toBe(true);
    }
  });
});
