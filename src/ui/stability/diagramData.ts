// Chart-ready columns for the stability diagram: the first region's two edges, told apart, and the operating
// line a = 2(U/V)·q on which every m/z sits at the current U and V. The boundary comes from the engine once.
import { useEffect, useState } from 'preact/hooks';
import { firstRegionBoundary, firstRegionBoundarySteps, isoBetaCurve, type FirstRegionBoundary } from '../../engine';
import { runInSteps } from '../../records';

/** Samples of the drawn boundary, and how many are computed per task when it is computed in steps. */
const BOUNDARY_POINTS = 400;
const BOUNDARY_STEP = 25;

let boundary: FirstRegionBoundary | null = null;
let pending: Promise<FirstRegionBoundary> | null = null;

/** The engine's boundary at 400 samples, computed once per session (at once, if no stepped run got there first). */
export function boundaryOnce(): FirstRegionBoundary {
  if (!boundary) boundary = firstRegionBoundary(BOUNDARY_POINTS);
  return boundary;
}

/**
 * The same boundary, computed 25 samples per task (800 eigenvalue searches in all, tens of ms on a phone: in one
 * piece it would hold the page still while the screen first draws).
 */
export function boundaryInSteps(): Promise<FirstRegionBoundary> {
  if (boundary) return Promise.resolve(boundary);
  return (pending ??= runInSteps(firstRegionBoundarySteps(BOUNDARY_POINTS, BOUNDARY_STEP)).then((b) => (boundary ??= b)));
}

/** The boundary once it is there (null meanwhile: the chart keeps its space). */
export function useBoundary(): FirstRegionBoundary | null {
  const [ready, setReady] = useState<FirstRegionBoundary | null>(boundary);
  useEffect(() => {
    if (ready) return;
    let live = true;
    void boundaryInSteps().then((b) => live && setReady(b));
    return () => {
      live = false;
    };
  }, [ready]);
  return ready;
}

/** q beyond the region's a = 0 edge shown on the chart, so points just outside stay visible. */
export const Q_MAX = 1.0;

/**
 * [q, yEdge (left of apex), xEdge (right of apex), operating line, β_x lines…, β_y lines…]; null marks where a
 * series is not drawn.
 * `slope` is a/q of an engine operating point at the current U and V: every m/z lies on that ray.
 */
/** β values of the optional iso-β lines, for x and for y. */
export const ISO_BETAS = [0.25, 0.5, 0.75] as const;
/** Every STRIDE-th boundary sample carries an iso-β point; the chart spans the gaps. */
const STRIDE = 8;

type Series = (number | null)[];
type Columns = Series[];
let lastColumns: { key: string; columns: Columns } | null = null;
let isoCache: Series[] | null = null;

/** Iso-β lines on the chart's q samples, kept only inside the first region (a few tens of ms, once). */
function isoLines(q: number[]): Series[] {
  if (isoCache) return isoCache;
  const b = boundaryOnce();
  const indices = q.map((_, i) => i).filter((i) => i < b.q.length && (i % STRIDE === 0 || i === b.apexIndex || i === b.q.length - 1));
  const lines: Series[] = [];
  for (const direction of ['x', 'y'] as const) {
    for (const beta of ISO_BETAS) {
      const curve = isoBetaCurve({ beta, direction, q: indices.map((i) => q[i]) });
      const column: Series = q.map(() => null);
      indices.forEach((i, k) => {
        const a = curve.a[k];
        if (Math.abs(a) <= b.upper[i]) column[i] = a;
      });
      lines.push(column);
    }
  }
  isoCache = lines;
  return lines;
}

export function diagramColumns(slope: number | null, withIsoBeta = false): Columns {
  // Same inputs, same arrays: the chart only calls setData when something changed.
  const key = `${slope}|${withIsoBeta}`;
  if (lastColumns && lastColumns.key === key) return lastColumns.columns;
  const b = boundaryOnce();
  const q: number[] = Array.from(b.q);
  const last = q[q.length - 1];
  for (let i = 1; i <= 10; i++) q.push(last + ((Q_MAX - last) * i) / 10);
  const yEdge = q.map((_, i) => (i <= b.apexIndex ? b.yEdge[i] : null));
  const xEdge = q.map((_, i) => (i >= b.apexIndex && i < b.q.length ? b.xEdge[i] : null));
  const line = q.map((qi) => (slope === null ? null : slope * qi));
  const iso = withIsoBeta ? isoLines(q) : ISO_BETAS.flatMap(() => [q.map(() => null), q.map(() => null)]);
  const columns: Columns = [q, yEdge, xEdge, line, ...iso];
  lastColumns = { key, columns };
  return columns;
}

/** A label's box on the canvas (device px). */
export interface LabelBox { x: number; y: number; w: number; h: number }

function overlaps(a: LabelBox, b: LabelBox): boolean {
  return a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
}

/**
 * Where to write each point's label so no two labels (nor a label and `taken`, e.g. the apex mark's) overlap:
 * the first free spot of below-right, above-right, below-left, above-left of the marker (radius r), else null —
 * the point is then named only in the list under the chart. Labels are placed in the order given (the set m/z
 * first, so it keeps its label). Returns the text's left/baseline position for fillText.
 */
export function placeLabels(points: readonly { x: number; y: number; r: number; w: number; h: number }[], taken: readonly LabelBox[] = []): ({ x: number; y: number } | null)[] {
  const used: LabelBox[] = [...taken];
  return points.map((p) => {
    const gap = 3;
    const spots: LabelBox[] = [
      { x: p.x + p.r + gap, y: p.y + p.r, w: p.w, h: p.h },
      { x: p.x + p.r + gap, y: p.y - p.r - p.h, w: p.w, h: p.h },
      { x: p.x - p.r - gap - p.w, y: p.y + p.r, w: p.w, h: p.h },
      { x: p.x - p.r - gap - p.w, y: p.y - p.r - p.h, w: p.w, h: p.h },
    ];
    const free = spots.find((s) => !used.some((u) => overlaps(s, u)));
    if (!free) return null;
    used.push(free);
    return { x: free.x, y: free.y + free.h };
  });
}
