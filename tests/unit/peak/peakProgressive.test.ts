// Coarse-then-refined peak (peakProfileProgressive) and the cheaper options behind the coarse stage
// (src/engine/peakProfile.ts, src/engine/transmission.ts).
import { describe, expect, it } from 'vitest';
import {
  COARSE_PROFILE_OPTIONS,
  PeakCancelledError,
  peakProfile,
  peakProfileProgressive,
  profileWithin,
  stableInterval,
  type PeakProfile,
} from '../../../src/engine/peakProfile';
import { evaluatePhases, phaseBracket, prepareFlight, resolveOptions, summarisePhases } from '../../../src/engine/transmission';
import { flightModel } from '../../../src/engine/peakInput';
import { InputRangeError } from '../../../src/engine/validate';
import { ATOMIC_MASS_CONSTANT, ELEMENTARY_CHARGE } from '../../../src/engine/constants';
import { settingsFor } from './helpers';

const R0 = 4e-3;
const F = 1e6;
const OMEGA = 2 * Math.PI * F;
/** m/z 100 near the apex (q = 0.706, U/V 0.16784 − 0.126/200: R ≈ 200 by the 0.126 rule, Dawson 1976, from memory), 20 V. */
function quickCase() {
  const rf = (0.706 * 100 * ATOMIC_MASS_CONSTANT * R0 * R0 * OMEGA * OMEGA) / (4 * ELEMENTARY_CHARGE);
  const settings = { r0: R0, frequency: F, dc: (0.16784 - 0.126 / 200) * rf, rf, rodLength: 0.2, axialVoltage: 20, beamRadius: 0.4e-3, transverseEnergy: 0.2 };
  const band = stableInterval(settings, 100)!;
  const width = band.high - band.low;
  return { ...settings, mzFrom: band.low - 0.5 * width, mzTo: band.high + 0.5 * width, points: 41 };
}

describe('peakProfileProgressive', () => {
  const params = quickCase();
  const coarseSeen: PeakProfile[] = [];
  const fractions: number[] = [];
  const refined = peakProfileProgressive(params, { onCoarse: (c) => coarseSeen.push(c), onProgress: (f) => fractions.push(f) });

  it('hands over one complete coarse profile whose bound is within 1 % of its peak, then returns the refined one', () => {
    expect(coarseSeen).toHaveLength(1);
    const coarse = coarseSeen[0];
    expect(coarse.mz).toEqual(refined.mz);
    expect(coarse.transmission).toHaveLength(41);
    expect(profileWithin(coarse, 1e-2)).toBe(true);
    expect(profileWithin(refined, 1e-3)).toBe(true);
    // The refined stage is exactly the ordinary profile.
    const direct = peakProfile(params);
    expect(Array.from(refined.transmission)).toEqual(Array.from(direct.transmission));
    expect(Array.from(refined.errorBound)).toEqual(Array.from(direct.errorBound));
  });

  it('the coarse values lie within their own bound (plus the refined bound) of the refined values', () => {
    const coarse = coarseSeen[0];
    for (let i = 0; i < refined.mz.length; i++) {
      const gap = Math.abs(coarse.transmission[i] - refined.transmission[i]);
      expect(gap, `m/z ${refined.mz[i]}`).toBeLessThanOrEqual(coarse.errorBound[i] + refined.errorBound[i]);
    }
    expect(Math.abs(coarse.peakTransmission - refined.peakTransmission)).toBeLessThanOrEqual(1e-2 * refined.peakTransmission);
  });

  it('progress runs from the coarse stage to 1 without going back', () => {
    expect(fractions[fractions.length - 1]).toBe(1);
    for (let i = 1; i < fractions.length; i++) expect(fractions[i]).toBeGreaterThanOrEqual(fractions[i - 1] - 1e-12);
    expect(fractions.some((f) => f > 0 && f <= 0.35)).toBe(true);
  });

  it('stops when asked, in either stage', () => {
    let calls = 0;
    expect(() => peakProfileProgressive(params, { onCoarse: () => undefined, shouldStop: () => ++calls > 3 })).toThrow(PeakCancelledError);
    let coarseDone = false;
    expect(() =>
      peakProfileProgressive(params, { onCoarse: () => (coarseDone = true), shouldStop: () => coarseDone }),
    ).toThrow(PeakCancelledError);
    expect(coarseDone).toBe(true);
  });
});

describe('coarse-stage options', () => {
  it('the scaled inner end never exceeds the integrated inner end (density non-increasing along rays)', () => {
    for (const [a, q, te] of [[0.2, 0.7, 0.2], [0.23, 0.706, 1], [0.1, 0.5, 0], [0.236, 0.706, 0.05]] as const) {
      const model = flightModel(settingsFor({ a, q, cycles: 60, beamFraction: 0.1, transverseEnergy: te }));
      const integrated = prepareFlight(model, resolveOptions());
      const scaled = prepareFlight(model, resolveOptions({ scaledInner: true }));
      for (let k = 0; k < 8; k++) {
        const phase = (k * Math.PI) / 8;
        const exact = phaseBracket(integrated, phase);
        const cheap = phaseBracket(scaled, phase);
        expect(cheap.outer).toBe(exact.outer);
        expect(cheap.inner).toBeLessThanOrEqual(exact.inner + 1e-15);
        expect(cheap.inner).toBeLessThanOrEqual(cheap.outer);
      }
    }
  });

  it('panels cut at ±s and ±2s only change the transmission by < 3e-4 of the value (against the full cut set)', () => {
    // Measured here rather than assumed: the coarse stage's 1 % budget leaves room for it.
    for (const [a, q, te, beam] of [[0.2, 0.7, 0.2, 0.1], [0.23, 0.706, 1, 0.2], [0.236, 0.706, 0.05, 0.05]] as const) {
      const model = flightModel(settingsFor({ a, q, cycles: 80, beamFraction: beam, transverseEnergy: te }));
      const full = summarisePhases(evaluatePhases(prepareFlight(model, resolveOptions()), 32));
      const few = summarisePhases(evaluatePhases(prepareFlight(model, resolveOptions({ panelLevels: [1, 2] })), 32));
      expect(full.transmission).toBeGreaterThan(0.01);
      expect(Math.abs(few.transmission - full.transmission)).toBeLessThan(3e-4 * full.transmission);
    }
  });

  it('rejects bad option values, naming the field', () => {
    expect(() => resolveOptions({ panelLevels: [] })).not.toThrow();
    expect(() => resolveOptions({ panelLevels: [-1] })).toThrow(InputRangeError);
    expect(() => resolveOptions({ hullTolerance: 0.5 })).toThrow(/hullTolerance/);
    expect(() => resolveOptions({ hullKeep: 1 })).toThrow(/hullKeep/);
    expect(() => resolveOptions({ scaledInner: 'yes' as unknown as boolean })).toThrow(/scaledInner/);
    expect(COARSE_PROFILE_OPTIONS.relativeTolerance).toBe(1e-2);
  });
});
