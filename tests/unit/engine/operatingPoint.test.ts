import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  apexRatio,
  firstRegionApex,
  mathieuParameters,
  operatingPoint,
  passBand,
  passBandDetail,
  rfForMass,
  rfOnlyLowMassCutoff,
  stabilityExponent,
} from '../../../src/engine/index';
import { expectClose } from './close';

const r0 = 4e-3;
const frequency = 1e6;

describe('operating point: Mathieu parameters', () => {
  it('a = 8eU/(m r0²Ω²), q = 4eV/(m r0²Ω²) with CODATA 2018 constants (convention of Dawson 1976)', () => {
    const e = 1.602176634e-19;
    const u = 1.6605390666e-27;
    const omega = 2 * Math.PI * frequency;
    const m = 100 * u;
    const p = mathieuParameters({ mz: 100, r0, frequency, dc: 20, rf: 120 });
    expectClose(p.a, (8 * e * 20) / (m * r0 * r0 * omega * omega), 1e-15, 'a', 'relative');
    expectClose(p.q, (4 * e * 120) / (m * r0 * r0 * omega * omega), 1e-15, 'q', 'relative');
    expectClose(p.a / (2 * p.q), 20 / 120, 1e-15, 'U/V = a/(2q)', 'relative');
  });
  it('β_x = β(a, q), β_y = β(−a, −q); stable inside the first region', () => {
    const rf = rfForMass({ mz: 100, r0, frequency });
    const point = operatingPoint({ mz: 100, r0, frequency, dc: 0.16 * rf, rf });
    expect(point.betaX).toBe(stabilityExponent(point.a, point.q));
    expect(point.betaY).toBe(stabilityExponent(-point.a, -point.q));
    expect(point.stable).toBe(true);
    expect(point.firstRegion).toBe(true);
    expect(point.cut).toEqual([]);
    expect(point.cutSide).toBeNull();
    expectClose(point.secularFrequencyX, (point.betaX! * frequency) / 2, 1e-9, 'f_sec,x = β f/2', 'relative');
    expect(point.marginX).toBeGreaterThan(0);
    expect(point.marginY).toBeGreaterThan(0);
  });
  it('x/y symmetry: reversing the DC sign swaps β_x and β_y ((a, q) ↔ (−a, −q))', () => {
    fc.assert(
      fc.property(fc.double({ min: 20, max: 2000, noNaN: true }), fc.double({ min: -0.2, max: 0.2, noNaN: true }), (mz, ratio) => {
        const rf = rfForMass({ mz: 500, r0, frequency });
        const plus = operatingPoint({ mz, r0, frequency, dc: ratio * rf, rf });
        const minus = operatingPoint({ mz, r0, frequency, dc: -ratio * rf, rf });
        return plus.betaX === minus.betaY && plus.betaY === minus.betaX && plus.stable === minus.stable;
      }),
      { numRuns: 100 },
    );
  });
  it('no RF: q = 0, unstable in the direction the DC defocuses (x or y by DC sign)', () => {
    const point = operatingPoint({ mz: 100, r0, frequency, dc: 5, rf: 0 });
    expect(point.q).toBe(0);
    expect(point.stable).toBe(false);
    expect(point.cut).toEqual(['y']);
    expect(Number.isFinite(point.dcToRfRatio)).toBe(true);
  });
});

describe('pass band', () => {
  const rf = rfForMass({ mz: 500, r0, frequency });
  it('closed at and above the apex ratio (null); open below it', () => {
    expect(passBand({ dc: apexRatio() * rf, rf, r0, frequency })).toBeNull();
    expect(passBand({ dc: 0.2 * rf, rf, r0, frequency })).toBeNull();
    expect(passBand({ dc: 0.1678 * rf, rf, r0, frequency })).not.toBeNull();
  });
  it('RF-only: low = RF-only cut-off at q = 0.908, high = Infinity (no NaN)', () => {
    const band = passBand({ dc: 0, rf, r0, frequency })!;
    expectClose(band.low, rfOnlyLowMassCutoff({ rf, r0, frequency }), 1e-12, 'low', 'relative');
    expect(band.high).toBe(Infinity);
  });
  it('edges agree with the operating point: stable just inside, x cuts the low-mass side, y the high-mass side', () => {
    for (const ratio of [0.1, 0.16, 0.167, 0.1678]) {
      const dc = ratio * rf;
      const band = passBand({ dc, rf, r0, frequency })!;
      const inside = (m: number) => operatingPoint({ mz: m, r0, frequency, dc, rf });
      expect(inside(band.low * (1 + 1e-7)).stable, `just above low, ratio ${ratio}`).toBe(true);
      expect(inside(band.high * (1 - 1e-7)).stable, `just below high, ratio ${ratio}`).toBe(true);
      const lighter = inside(band.low * (1 - 1e-7));
      expect(lighter.stable).toBe(false);
      expect(lighter.cut).toEqual(['x']);
      expect(lighter.cutSide).toBe('low-mass side');
      const heavier = inside(band.high * (1 + 1e-7));
      expect(heavier.stable).toBe(false);
      expect(heavier.cut).toEqual(['y']);
      expect(heavier.cutSide).toBe('high-mass side');
      expect(heavier.growthPerPeriodY).toBeGreaterThan(1);
    }
  });
  it('contains its centre and shrinks (nested) as U/V rises (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.001, max: 0.1678, noNaN: true }),
        fc.double({ min: 0.001, max: 0.1678, noNaN: true }),
        fc.double({ min: 1, max: 5000, noNaN: true }),
        (r1, r2, v) => {
          fc.pre(Math.abs(r1 - r2) > 1e-9);
          const [lo, hi] = r1 < r2 ? [r1, r2] : [r2, r1];
          const wide = passBandDetail({ dc: lo * v, rf: v, r0, frequency })!;
          const narrow = passBandDetail({ dc: hi * v, rf: v, r0, frequency })!;
          const centre = operatingPoint({ mz: narrow.centre, r0, frequency, dc: hi * v, rf: v });
          return (
            centre.stable &&
            narrow.low > narrow.centre - narrow.width &&
            narrow.width < wide.width &&
            narrow.low > wide.low &&
            narrow.high < wide.high
          );
        },
      ),
      { numRuns: 150 },
    );
  });
  it('same band for ±U (the diagram is symmetric in a)', () => {
    expect(passBand({ dc: -0.15 * rf, rf, r0, frequency })).toEqual(passBand({ dc: 0.15 * rf, rf, r0, frequency }));
  });
  it('centre, width and ideal resolution are consistent; apex q lies inside the band near the apex', () => {
    const band = passBandDetail({ dc: 0.1677 * rf, rf, r0, frequency })!;
    expectClose(band.centre, (band.low + band.high) / 2, 1e-15, 'centre', 'relative');
    expectClose(band.resolution, band.centre / band.width, 1e-9, 'R = centre/width', 'relative');
    expect(band.qHighMassEdge).toBeLessThan(firstRegionApex().q);
    expect(band.qLowMassEdge).toBeGreaterThan(firstRegionApex().q);
  });
});
