import { describe, expect, it } from 'vitest';
import { leastSquares } from '../../../src/engine/linearFit';
import { buildTrend, catalogueType, projectToLimit, SECONDS_PER_MONTH, type Reading, type Visit } from '../../../src/records';

describe('least-squares line', () => {
  it('matches a hand-worked example', () => {
    // x = 0..4, y = 1,3,2,5,4: x̄ = 2, ȳ = 3, Sxy = 8, Sxx = 10 → slope 0.8, intercept 1.4;
    // residuals −0.4, 0.8, −1.0, 1.2, −0.6 → SSres 3.6, SStot 10 → r² 0.64, s = √(3.6/3).
    const f = leastSquares([0, 1, 2, 3, 4], [1, 3, 2, 5, 4])!;
    expect(f.slope).toBeCloseTo(0.8, 12);
    expect(f.intercept).toBeCloseTo(1.4, 12);
    expect(f.r2).toBeCloseTo(0.64, 12);
    expect(f.residualStd).toBeCloseTo(Math.sqrt(1.2), 12);
  });
  it('keeps its digits with epoch-second x values (centred sums)', () => {
    const t0 = 1.7e9;
    const xs = [0, 1, 2, 3, 4].map((i) => t0 + i * 86400 * 30);
    const ys = xs.map((x) => 1500 + 15 * ((x - t0) / (86400 * 30)));
    const f = leastSquares(xs, ys)!;
    expect(f.slope * 86400 * 30).toBeCloseTo(15, 9);
    expect(f.r2).toBeCloseTo(1, 12);
  });
  it('is undefined for fewer than two points or a single x', () => {
    expect(leastSquares([1], [2])).toBeUndefined();
    expect(leastSquares([3, 3, 3], [1, 2, 3])).toBeUndefined();
  });
});

describe('multiplier voltage projection (linear ageing, common practice)', () => {
  it('3000 V limit, 2400 V now, rising 15 V/month → about 40 months (computed: (3000 − 2400)/15 = 40)', () => {
    const m = SECONDS_PER_MONTH;
    const xs = [0, 6, 12, 18].map((k) => k * m);
    const ys = [2130, 2220, 2310, 2400];
    const p = projectToLimit(leastSquares(xs, ys)!, xs[3], ys[3], 3000);
    expect(p.ratePerMonth).toBeCloseTo(15, 9);
    expect(p.monthsFromLast).toBeCloseTo(40, 9);
    expect(p.assumption).toMatch(/linear ageing/);
  });
  it('no date for a flat or falling trend; now when already at the limit', () => {
    const flat = projectToLimit(leastSquares([0, 1, 2], [1500, 1500, 1500])!, 2, 1500, 3000);
    expect(flat.reachesAt).toBeNull();
    const falling = projectToLimit(leastSquares([0, 1, 2], [1600, 1550, 1500])!, 2, 1500, 3000);
    expect(falling.reachesAt).toBeNull();
    const past = projectToLimit(leastSquares([0, 1], [2900, 3100])!, 1, 3100, 3000);
    expect(past.monthsFromLast).toBe(0);
  });
});

describe('trend columns for the chart', () => {
  const visit = (id: string, startedAt: string): Visit => ({
    id, instrumentId: 'i', startedAt, site: '', engineer: 'e', reason: 'preventive', notes: '', partsUsed: '', createdAt: startedAt, updatedAt: startedAt,
  });
  const reading = (visitId: string, typeId: string, phase: Reading['phase'], value: number, context?: Reading['context']): Reading => ({
    id: `${visitId}-${typeId}-${phase}-${value}`, visitId, instrumentId: 'i', typeId, phase, value, entered: { text: String(value), unit: 'V' },
    ...(context ? { context } : {}), note: '', takenAt: '2025-01-01T00:00:00.000Z', origin: 'entered',
  });
  it('one row per visit in time order, null for a missing phase, line fitted to as-left', () => {
    const visits = [visit('b', '2025-07-01T00:00:00.000Z'), visit('a', '2025-01-01T00:00:00.000Z'), visit('c', '2026-01-01T00:00:00.000Z')];
    const readings = [
      reading('a', 'multiplier-voltage', 'as-found', 1490), reading('a', 'multiplier-voltage', 'as-left', 1500),
      reading('b', 'multiplier-voltage', 'as-left', 1590), reading('c', 'multiplier-voltage', 'as-found', 1700),
      reading('c', 'multiplier-voltage', 'as-left', 1680), reading('c', 'vacuum-high', 'as-left', 1e-3),
    ];
    const t = buildTrend(catalogueType('multiplier-voltage')!, visits, readings, { limit: 2000 });
    expect(t.visitIds).toEqual(['a', 'b', 'c']);
    expect(t.x).toEqual(['2025-01-01', '2025-07-01', '2026-01-01'].map((d) => Date.parse(d) / 1000));
    expect(t.asFound).toEqual([1490, null, 1700]);
    expect(t.asLeft).toEqual([1500, 1590, 1680]);
    expect(t.fittedPhase).toBe('as-left');
    expect(t.fit.every((y) => typeof y === 'number')).toBe(true);
    expect(t.projection?.reachesAt).not.toBeNull();
    expect(t.projection!.ratePerMonth).toBeGreaterThan(14);
    expect(t.projection!.ratePerMonth).toBeLessThan(16);
  });
  it('keeps series apart by context (parked m/z) and fits pressure on a log scale', () => {
    const visits = [visit('a', '2025-01-01T00:00:00.000Z'), visit('b', '2026-01-01T00:00:00.000Z')];
    const rf = [reading('a', 'rf-amplitude', 'as-left', 100, { mz: 69 }), reading('a', 'rf-amplitude', 'as-left', 730, { mz: 502 }),
      reading('b', 'rf-amplitude', 'as-left', 101, { mz: 69 })];
    expect(buildTrend(catalogueType('rf-amplitude')!, visits, rf, { context: { mz: 69 } }).asLeft).toEqual([100, 101]);
    const vac = [reading('a', 'vacuum-high', 'as-left', 1e-3, { gaugeGas: 'N2-equivalent' }), reading('b', 'vacuum-high', 'as-left', 1e-2, { gaugeGas: 'N2-equivalent' })];
    const t = buildTrend(catalogueType('vacuum-high')!, visits, vac);
    expect(t.scale).toBe('log');
    expect(t.fit[0]).toBeCloseTo(1e-3, 12);
    expect(t.fit[1]).toBeCloseTo(1e-2, 12);
  });
  it('honours the time window', () => {
    const visits = [visit('a', '2019-01-01T00:00:00.000Z'), visit('b', '2026-01-01T00:00:00.000Z')];
    const rs = [reading('a', 'multiplier-voltage', 'as-left', 1000), reading('b', 'multiplier-voltage', 'as-left', 1500)];
    expect(buildTrend(catalogueType('multiplier-voltage')!, visits, rs, { since: '2021-01-01T00:00:00.000Z' }).visitIds).toEqual(['b']);
  });
});
