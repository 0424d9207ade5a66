import { describe, expect, it } from 'vitest';
import { InputRangeError, scanPlan, scansForGain } from '../../../src/engine/index';
import { expectClose } from './close';

describe('scan planning', () => {
  it('counts points with both ends and sums dwell and settle per point', () => {
    const plan = scanPlan({ mzStart: 50, mzEnd: 550, step: 0.1, dwell: 0.002, scans: 1 });
    expect(plan.points).toBe(5001);
    expectClose(plan.timePerScan, 10.002, 1e-12, '5001 points × 2 ms', 'relative');
    const settled = scanPlan({ mzStart: 1, mzEnd: 100, step: 1, dwell: 0.1, scans: 4, settle: 0.02 });
    expect(settled.points).toBe(100);
    expectClose(settled.timePerScan, 12, 1e-12, '100 × 0.12 s', 'relative');
    expectClose(settled.totalTime, 48, 1e-12, '4 scans', 'relative');
  });
  it('S/N gain of N averaged scans is √N — counting statistics, RSD = 1/√N (G. F. Knoll, Radiation Detection and Measurement, 4th ed. 2010, ch. 3)', () => {
    for (const n of [1, 4, 16, 100]) expectClose(scanPlan({ mzStart: 1, mzEnd: 2, step: 1, dwell: 1, scans: n }).signalToNoiseGain, Math.sqrt(n), 1e-15, `N=${n}`);
    expect(scansForGain(3)).toBe(9);
    expect(scansForGain(2.5)).toBe(7);
  });
  it('counts per point and RSD: 100 counts → 10 %, 10 000 → 1 % (Knoll, Radiation Detection and Measurement, 4th ed., 2010)', () => {
    const a = scanPlan({ mzStart: 1, mzEnd: 2, step: 1, dwell: 0.1, scans: 1, countRate: 1000 });
    expectClose(a.countsPerPoint!, 100, 1e-9, '1000/s × 0.1 s');
    expectClose(a.relativeStandardDeviation!, 0.1, 1e-12, '100 counts');
    const b = scanPlan({ mzStart: 1, mzEnd: 2, step: 1, dwell: 0.1, scans: 100, countRate: 1000 });
    expectClose(b.relativeStandardDeviation!, 0.01, 1e-12, '10 000 counts');
    expect(scanPlan({ mzStart: 1, mzEnd: 2, step: 1, dwell: 1, scans: 1 }).countsPerPoint).toBeNull();
  });
  it('names the field for bad input', () => {
    expect(() => scanPlan({ mzStart: 100, mzEnd: 50, step: 1, dwell: 1, scans: 1 })).toThrow(/mzEnd/);
    expect(() => scanPlan({ mzStart: 1, mzEnd: 50, step: 0, dwell: 1, scans: 1 })).toThrow(InputRangeError);
    expect(() => scanPlan({ mzStart: 1, mzEnd: 50, step: 1, dwell: 1, scans: 2.5 })).toThrow(/scans/);
  });
});
