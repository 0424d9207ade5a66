import { describe, expect, it } from 'vitest';
import { InputRangeError, massError, proportionalityCheck, rfForMass } from '../../../src/engine/index';
import { expectClose } from './close';

describe('proportionality check (V(m2) = V(m1)·m2/m1, Dawson 1976 — from memory)', () => {
  it('exact apex voltages of 69/219/502 (r0 4.5 mm, 1 MHz) are proportional: k = 1.46240 V/u, zero deviation', () => {
    const readings = [69, 219, 502].map((mz) => ({ mz, rf: rfForMass({ mz, r0: 4.5e-3, frequency: 1e6 }) }));
    const r = proportionalityCheck(readings);
    // Apex scan law V0p = 0.072218·M·r0²·f² (Dawson 1976, CODATA 2018; computed) → 0.072218 · 20.25 = 1.46241 V/u.
    expectClose(r.constant, 0.072218 * 20.25, 5e-5, 'k', 'relative');
    expect(r.maxDeviation).toBeLessThan(1e-12);
    expect(r.withinTolerance).toBe(true);
    expectClose(r.line!.intercept, 0, 1e-9, 'intercept', 'absolute');
  });
  it('a read-back 2 % high at m/z 502 is flagged beyond the ±1 % practice tolerance', () => {
    const r = proportionalityCheck([{ mz: 69, rf: 100 }, { mz: 502, rf: (100 * 502) / 69 * 1.02 }]);
    expect(r.withinTolerance).toBe(false);
    // Least squares through the origin spreads the error: 502 dominates Σm², so its own deviation is small
    // and m/z 69 carries most of it; the hand-computed fit gives −1.96 % at 69.
    const k = (69 * 100 + 502 * ((100 * 502) / 69) * 1.02) / (69 * 69 + 502 * 502);
    expectClose(r.perReading[0].deviation, 100 / (k * 69) - 1, 1e-12, 'deviation at 69');
    expect(r.line).toBeNull();
  });
  it('a straight line with an offset shows in the intercept (three readings)', () => {
    const r = proportionalityCheck([{ mz: 50, rf: 2 * 50 + 5 }, { mz: 100, rf: 205 }, { mz: 200, rf: 405 }]);
    expectClose(r.line!.slope, 2, 1e-12, 'slope');
    expectClose(r.line!.intercept, 5, 1e-10, 'intercept');
    expect(r.line!.maxResidualFraction).toBeLessThan(1e-12);
    expect(r.withinTolerance).toBe(false);
  });
  it('names the reading and field for bad input', () => {
    expect(() => proportionalityCheck([{ mz: 69, rf: 100 }])).toThrow(InputRangeError);
    expect(() => proportionalityCheck([{ mz: 69, rf: 100 }, { mz: 69, rf: 120 }])).toThrow(/readings\[1\]\.mz/);
    try {
      proportionalityCheck([{ mz: 69, rf: 100 }, { mz: 219, rf: -1 }]);
    } catch (e) {
      expect((e as InputRangeError).field).toBe('readings[1].rf');
    }
  });
  it('mass error in u and ppm', () => {
    const e = massError({ setMz: 500, passedMz: 500.1 });
    expectClose(e.error, 0.1, 1e-12, 'u');
    expectClose(e.ppm, 200, 1e-8, 'ppm');
  });
});
