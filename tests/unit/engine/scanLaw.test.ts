import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  apexScanLine,
  apparentMassShift,
  constantResolutionScanLine,
  constantWidthScanLine,
  convertDc,
  convertRf,
  dcForMass,
  massForRf,
  massForScanRf,
  massRangeTop,
  rfForMass,
  rfOnlyLowMassCutoff,
  scanPoint,
  type RfForm,
  RF_FORMS,
} from '../../../src/engine/index';
import { expectClose } from './close';

const MM = 1e-3;
const MHZ = 1e6;

describe('RF and DC for a mass', () => {
  it('the 7.22 V rule: V0p = 7.22·(m/z)·f[MHz]²·r0[cm]² at q = 0.706 (Dawson 1976; Miller & Denton 1986 — from memory)', () => {
    // The rule is quoted to three figures; the exact constant is 7.2218, 0.03 % above.
    expectClose(rfForMass({ mz: 1, r0: 0.01, frequency: MHZ, q: 0.706 }), 7.22, 5e-4, '7.22 rule', 'relative');
    expectClose(rfForMass({ mz: 250, r0: 0.005, frequency: 2.5 * MHZ, q: 0.706 }), 7.22 * 250 * 6.25 * 0.25, 5e-4, 'rule at 250 u, 0.5 cm, 2.5 MHz', 'relative');
  });
  it('the exact constant from CODATA 2018: V0p/(M f² r0²) = q·π²·u·10⁸/e (u, MHz, cm) — computed', () => {
    const e = 1.602176634e-19;
    const u = 1.6605390666e-27;
    const exact = (0.706 * Math.PI ** 2 * u * 1e8) / e;
    expectClose(rfForMass({ mz: 1, r0: 0.01, frequency: MHZ, q: 0.706 }), exact, 1e-14, 'exact constant', 'relative');
    expectClose(exact, 7.22176, 1e-6, 'exact constant to 6 figures', 'relative');
  });
  it('apex RF and DC test vectors (Dawson 1976 formula, CODATA 2018; computed; tolerance ± 0.05 %)', () => {
    const cases = [
      { mz: 69, r0: 4.5, rf: 100.91, dc: 16.94 },
      { mz: 502, r0: 4.5, rf: 734.13 },
      { mz: 1000, r0: 4.0, rf: 1155.5, dc: 193.9 },
      { mz: 28, r0: 3.0, f: 2.5, rf: 113.7 },
      { mz: 219, r0: 4.5, rf: 320.3 },
    ];
    for (const c of cases) {
      const frequency = (c.f ?? 1) * MHZ;
      expectClose(rfForMass({ mz: c.mz, r0: c.r0 * MM, frequency }), c.rf, 5e-4, `V at m/z ${c.mz}`, 'relative');
      if (c.dc) expectClose(dcForMass({ mz: c.mz, r0: c.r0 * MM, frequency }), c.dc, 5e-4, `U at m/z ${c.mz}`, 'relative');
    }
  });
  it('RF-only cut-off (q = 0.908, Dawson 1976): at V0p = 500 V, r0 = 4 mm, f = 1 MHz → 336.4 u ± 0.1 %', () => {
    expectClose(rfOnlyLowMassCutoff({ rf: 500, r0: 4 * MM, frequency: MHZ }), 336.4, 1e-3, 'RF-only cut-off', 'relative');
  });
  it('V(m2) = V(m1)·m2/m1 at fixed geometry (Dawson 1976)', () => {
    const v1 = rfForMass({ mz: 69, r0: 4.5 * MM, frequency: MHZ });
    const v2 = rfForMass({ mz: 502, r0: 4.5 * MM, frequency: MHZ });
    expectClose(v2, (v1 * 502) / 69, 1e-14, 'proportionality', 'relative');
  });
  it('round trip m/z → V → m/z (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e5, noNaN: true }),
        fc.double({ min: 1e-3, max: 0.02, noNaN: true }),
        fc.double({ min: 1e5, max: 1e7, noNaN: true }),
        fc.double({ min: 0.05, max: 0.9, noNaN: true }),
        (mz, r0, frequency, q) => {
          const rf = rfForMass({ mz, r0, frequency, q });
          fc.pre(rf <= 1e5 && rfForMass({ mz, r0, frequency }) <= 1e5); // accepted rf is ≤ 1 MV
          const back = massForRf({ rf, r0, frequency, q });
          const backDefault = massForRf({ rf: rfForMass({ mz, r0, frequency }), r0, frequency });
          return Math.abs(back - mz) <= 1e-12 * mz && Math.abs(backDefault - mz) <= 1e-12 * mz;
        },
      ),
    );
  });
  it('top of the mass range from the supply’s largest V (apex scan law, Dawson 1976, computed: 1155.5 V ↔ m/z 1000 at 4 mm, 1 MHz)', () => {
    expectClose(massRangeTop({ maxRf: 1155.5, r0: 4 * MM, frequency: MHZ }), 1000, 5e-4, 'top of range', 'relative');
  });
  it('δm/m = 2·δf/f (derived from Dawson 1976): δf/f = 1e-4 at m/z 1000 → +0.20 u', () => {
    expectClose(apparentMassShift({ mz: 1000, frequencyChange: 1e-4 }), 0.2, 1e-12, 'δm/m = 2·δf/f');
    // The same from the scan law itself: the instrument sets V for m/z 1000 at f, the real f is 1e-4 higher.
    const rf = rfForMass({ mz: 1000, r0: 4 * MM, frequency: MHZ });
    const truePassed = massForRf({ rf, r0: 4 * MM, frequency: MHZ * (1 + 1e-4) });
    expectClose(1000 - truePassed, 0.2, 1e-4, 'shift from the scan law (first order)');
  });
});

describe('scan lines', () => {
  const geometry = { r0: 4 * MM, frequency: MHZ };
  it('constant resolution (U = λV): the exact R holds at every mass', () => {
    const line = constantResolutionScanLine(1000);
    expect(line.offset).toBe(0);
    for (const mz of [10, 69, 502, 2000]) {
      const point = scanPoint({ line, mz, ...geometry })!;
      expectClose(point.resolution, 1000, 1e-8, `R at m/z ${mz}`, 'relative');
      expectClose((point.low + point.high) / 2, mz, 1e-9, `centre at m/z ${mz}`, 'relative');
      expectClose(point.dc, line.slope * point.rf, 1e-12, 'U = λV', 'relative');
    }
  });
  it('constant width (U = λ_apex·V − δ): exact at the reference, within 3 % from m/z 50 to 2000 (common practice)', () => {
    const line = constantWidthScanLine({ width: 0.7, referenceMz: 500, ...geometry });
    expect(line.offset).toBeGreaterThan(0);
    expectClose(scanPoint({ line, mz: 500, ...geometry })!.width, 0.7, 1e-8, 'width at reference', 'relative');
    for (const mz of [50, 200, 1000, 2000]) {
      expectClose(scanPoint({ line, mz, ...geometry })!.width, 0.7, 0.03, `width at m/z ${mz}`, 'relative');
    }
  });
  it('inverse: measured V → m/z passed is the mass the scan point was solved for', () => {
    const line = constantWidthScanLine({ width: 1, referenceMz: 300, ...geometry });
    fc.assert(
      fc.property(fc.double({ min: 20, max: 3000, noNaN: true }), (mz) => {
        const point = scanPoint({ line, mz, ...geometry });
        if (!point) return false;
        const back = massForScanRf({ line, rf: point.rf, ...geometry })!;
        return Math.abs(back - mz) < 1e-8 * mz;
      }),
      { numRuns: 60 },
    );
  });
  it('the apex line passes nothing (zero ideal width): null, never NaN', () => {
    expect(scanPoint({ line: apexScanLine(), mz: 100, ...geometry })).toBeNull();
    expect(massForScanRf({ line: apexScanLine(), rf: 100, ...geometry })).toBeNull();
  });
});

describe('voltage conventions (Dawson 1976; March & Todd, 2nd ed., 2005)', () => {
  it('per rod zero-to-peak V → 2V peak-to-peak, V/√2 rms; between pairs 2V, 4V pp', () => {
    expect(convertRf(100, 'zeroToPeakPerRod', 'peakToPeakPerRod')).toBe(200);
    expectClose(convertRf(100, 'zeroToPeakPerRod', 'rmsPerRod'), 70.71067811865476, 1e-14, 'rms');
    expect(convertRf(100, 'zeroToPeakPerRod', 'zeroToPeakBetweenPairs')).toBe(200);
    expect(convertRf(100, 'zeroToPeakPerRod', 'peakToPeakBetweenPairs')).toBe(400);
    expect(convertDc(16.94, 'perRod', 'betweenPairs')).toBe(33.88);
    expect(convertDc(-10, 'betweenPairs', 'perRod')).toBe(-5);
  });
  it('every pair of forms round-trips', () => {
    for (const from of RF_FORMS) {
      for (const to of RF_FORMS) {
        expectClose(convertRf(convertRf(123.4, from, to), to as RfForm, from), 123.4, 1e-14, `${from}→${to}→${from}`, 'relative');
      }
    }
  });
});
