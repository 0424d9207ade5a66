// Synthetic measured peaks made from the engine's own ideal peak at a known U/V and ion energy: the scan at set
// m/z m sees the ion M at m′ = M²/m of the fixed-V profile (see src/spectrum/peakFit.ts), so the profile is
// computed on a uniform m′ grid and each point is written at m = M²/m′ — exact engine values, no interpolation.
import { peakProfile, ratioForResolution, scanPoint, seededRandom } from '../../../src/engine/index';
import type { PeakFitInstrument } from '../../../src/spectrum/index';

export const INSTRUMENT: PeakFitInstrument = { r0: 4e-3, frequency: 1.2e6, rodLength: 0.15, beamRadius: 0.5e-3, transverseEnergy: 0.2 };

export interface CleanPeak {
  mz: Float64Array;
  /** Transmission normalised to a top of 1. */
  shape: Float64Array;
  ratio: number;
  axialVoltage: number;
  ionMz: number;
  bandWidth: number;
}

export function cleanPeak(p: { ionMz: number; bandResolution: number; axialVoltage: number; points: number }): CleanPeak {
  const ratio = ratioForResolution(p.bandResolution).exact;
  const point = scanPoint({ line: { slope: ratio, offset: 0 }, mz: p.ionMz, r0: INSTRUMENT.r0, frequency: INSTRUMENT.frequency })!;
  const half = 3 * point.width;
  const profile = peakProfile(
    { ...INSTRUMENT, dc: point.dc, rf: point.rf, axialVoltage: p.axialVoltage, mzFrom: p.ionMz - half, mzTo: p.ionMz + half, points: p.points },
    { relativeTolerance: 1e-3 },
  );
  const n = p.points;
  const mz = new Float64Array(n);
  const shape = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    // Reverse so that m rises as m′ falls.
    const j = n - 1 - i;
    mz[i] = (p.ionMz * p.ionMz) / profile.mz[j];
    shape[i] = profile.transmission[j] / profile.peakTransmission;
  }
  return { mz, shape, ratio, axialVoltage: p.axialVoltage, ionMz: p.ionMz, bandWidth: point.width };
}

/** The clean peak × height + baseline + extra(m) + seeded Gaussian noise, moved by `shift` u. */
export function measured(
  peak: CleanPeak,
  o: { height: number; baseline: number; noise: number; seed: number; shift?: number; extra?: (m: number, shape: number) => number },
): { mz: Float64Array; intensity: Float64Array } {
  const random = seededRandom(o.seed);
  const mz = Float64Array.from(peak.mz, (m) => m + (o.shift ?? 0));
  const intensity = Float64Array.from(peak.shape, (s, i) => o.baseline + o.height * s + (o.extra?.(mz[i], s) ?? 0) + o.noise * random.normal());
  return { mz, intensity };
}
