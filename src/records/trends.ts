// Trends across visits: chart-ready columns (uPlot's [xs, ...ys] with null for gaps), an ordinary
// least-squares line, and for the multiplier voltage the date the trend reaches the supply's limit.
// Pure: the store gathers the records, this module only computes.
import { leastSquares, type LinearFit } from '../engine/linearFit';
import type { ReadingType } from './catalogue';
import { contextMatches, type ReadingContext } from './judge';
import type { Reading, Visit } from './types';

/** Mean Gregorian month, s (365.2425 d / 12). */
export const SECONDS_PER_MONTH = (365.2425 / 12) * 86400;

/** Used when a profile does not state its multiplier supply's limit: top of the usual discrete-dynode range (common practice). */
export const DEFAULT_MULTIPLIER_LIMIT = 3000;

export interface Projection {
  limit: number;
  /** ISO date the fitted line reaches the limit; null when it never does (flat or falling). */
  reachesAt: string | null;
  /** Months from the last point to that date; 0 when already at or past the limit. */
  monthsFromLast: number | null;
  /** Rate, base unit per month. */
  ratePerMonth: number;
  assumption: string;
}

export interface TrendData {
  typeId: string;
  label: string;
  baseUnit: string;
  scale: 'linear' | 'log';
  /** Columns for uPlot: x (s since 1970), as-found, as-left, fitted line. One row per visit, sorted by time. */
  x: number[];
  asFound: (number | null)[];
  asLeft: (number | null)[];
  fit: (number | null)[];
  visitIds: string[];
  /** The fit in base units per second (on log10 of the value for log-scale types). */
  line?: LinearFit;
  /** Which phase the line was fitted to. */
  fittedPhase: 'as-found' | 'as-left';
  projection?: Projection;
}

export interface TrendOptions {
  /** Only readings whose matching context equals this (e.g. { mz: 69 }). */
  context?: ReadingContext;
  /** Only visits on or after this time. */
  since?: string;
  /** Projection limit for the multiplier voltage. */
  limit?: number;
}

function lastOf(rows: Reading[]): Reading | undefined {
  let best: Reading | undefined;
  for (const r of rows) if (!best || r.takenAt > best.takenAt) best = r;
  return best;
}

/**
 * Build the trend of one reading type across an instrument's visits. `readings` may hold any types and
 * contexts; only the matching ones are used. The line is fitted to as-left values where there are at
 * least two (the state the instrument was left in), otherwise to as-found values.
 */
export function buildTrend(type: ReadingType, visits: readonly Visit[], readings: readonly Reading[], opts: TrendOptions = {}): TrendData {
  const since = opts.since ? Date.parse(opts.since) : -Infinity;
  const byVisit = new Map<string, Reading[]>();
  for (const r of readings) {
    if (r.typeId !== type.id) continue;
    if (opts.context && !contextMatches(type, r.context, opts.context)) continue;
    let list = byVisit.get(r.visitId);
    if (!list) byVisit.set(r.visitId, (list = []));
    list.push(r);
  }
  const rows = visits
    .filter((v) => byVisit.has(v.id) && Date.parse(v.startedAt) >= since)
    .map((v) => ({ v, t: Date.parse(v.startedAt) / 1000 }))
    .sort((a, b) => a.t - b.t);
  const out: TrendData = {
    typeId: type.id, label: type.label, baseUnit: type.baseUnit, scale: type.trendScale,
    x: [], asFound: [], asLeft: [], fit: [], visitIds: [], fittedPhase: 'as-left',
  };
  for (const { v, t } of rows) {
    const list = byVisit.get(v.id)!;
    out.x.push(t);
    out.visitIds.push(v.id);
    out.asFound.push(lastOf(list.filter((r) => r.phase === 'as-found'))?.value ?? null);
    out.asLeft.push(lastOf(list.filter((r) => r.phase === 'as-left'))?.value ?? null);
  }
  const log = type.trendScale === 'log';
  const pick = (col: (number | null)[]) => {
    const xs: number[] = [], ys: number[] = [];
    col.forEach((y, i) => {
      if (y === null || (log && !(y > 0))) return;
      xs.push(out.x[i]);
      ys.push(log ? Math.log10(y) : y);
    });
    return { xs, ys };
  };
  let chosen = pick(out.asLeft);
  if (chosen.xs.length < 2) {
    chosen = pick(out.asFound);
    out.fittedPhase = 'as-found';
  }
  const line = leastSquares(chosen.xs, chosen.ys);
  out.fit = out.x.map((x) => (line ? (log ? 10 ** (line.intercept + line.slope * x) : line.intercept + line.slope * x) : null));
  if (line) out.line = line;
  if (line && type.id === 'multiplier-voltage') {
    out.projection = projectToLimit(line, chosen.xs[chosen.xs.length - 1], chosen.ys[chosen.ys.length - 1], opts.limit ?? DEFAULT_MULTIPLIER_LIMIT);
  }
  return out;
}

/**
 * When does the fitted line reach the limit? Assumes linear ageing: the voltage the instrument sets for its gain rises at a
 * steady rate (end of life = (V_max − V_now)/(dV/dt); common practice). Real multipliers often speed up near the end,
 * so treat the date as the latest sensible time to order a replacement, not a promise.
 */
export function projectToLimit(line: LinearFit, lastX: number, lastY: number, limit: number): Projection {
  const ratePerMonth = line.slope * SECONDS_PER_MONTH;
  const assumption =
    'Assumes linear ageing: the multiplier voltage keeps rising at the fitted rate. Multipliers often age faster near the end, so order a replacement before this date.';
  if (lastY >= limit) return { limit, reachesAt: new Date(lastX * 1000).toISOString(), monthsFromLast: 0, ratePerMonth, assumption };
  if (!(line.slope > 0)) return { limit, reachesAt: null, monthsFromLast: null, ratePerMonth, assumption };
  const xLimit = (limit - line.intercept) / line.slope;
  const months = Math.max(0, (xLimit - lastX) / SECONDS_PER_MONTH);
  const reachesAt = Number.isFinite(xLimit) && Math.abs(xLimit) < 8.64e12 ? new Date(xLimit * 1000).toISOString() : null;
  return { limit, reachesAt, monthsFromLast: reachesAt ? months : null, ratePerMonth, assumption };
}

/** The distinct contexts a type was recorded under (e.g. each parked m/z), for choosing a series. */
export function seriesOf(type: ReadingType, readings: readonly Reading[]): ReadingContext[] {
  const seen = new Map<string, ReadingContext>();
  for (const r of readings) {
    if (r.typeId !== type.id) continue;
    const key: ReadingContext = {};
    for (const k of type.matchContext) if (r.context?.[k] !== undefined) key[k] = r.context[k];
    seen.set(JSON.stringify(key), key);
  }
  return [...seen.values()];
}
