// Chart-ready columns for the stability diagram: the first region's two edges, told apart, and the operating
// line a = 2(U/V)·q on which every m/z sits at the current U and V. The boundary comes from the engine once.
import { firstRegionBoundary, type FirstRegionBoundary } from '../../engine';

let boundary: FirstRegionBoundary | null = null;

/** The engine's boundary at 400 samples (a few ms), computed once per session. */
export function boundaryOnce(): FirstRegionBoundary {
  if (!boundary) boundary = firstRegionBoundary(400);
  return boundary;
}

/** q beyond the region's a = 0 edge shown on the chart, so points just outside stay visible. */
export const Q_MAX = 1.0;

/**
 * [q, yEdge (left of apex), xEdge (right of apex), operating line]; null marks where a series is not drawn.
 * `slope` is a/q of an engine operating point at the current U and V: every m/z lies on that ray.
 */
type Columns = [number[], (number | null)[], (number | null)[], (number | null)[]];
let lastColumns: { slope: number | null; columns: Columns } | null = null;

export function diagramColumns(slope: number | null): Columns {
  // Same slope, same arrays: the chart only calls setData when something changed.
  if (lastColumns && lastColumns.slope === slope) return lastColumns.columns;
  const b = boundaryOnce();
  const q: number[] = Array.from(b.q);
  const last = q[q.length - 1];
  for (let i = 1; i <= 10; i++) q.push(last + ((Q_MAX - last) * i) / 10);
  const yEdge = q.map((_, i) => (i <= b.apexIndex ? b.yEdge[i] : null));
  const xEdge = q.map((_, i) => (i >= b.apexIndex && i < b.q.length ? b.xEdge[i] : null));
  const line = q.map((qi) => (slope === null ? null : slope * qi));
  const columns: Columns = [q, yEdge, xEdge, line];
  lastColumns = { slope, columns };
  return columns;
}
