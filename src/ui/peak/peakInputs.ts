// Peak screen inputs (kept as typed) → engine parameters. Pure, so the mapping is unit-tested without a browser.
import {
  flightModel, passBand, ratioForExactResolution, rfForMass, type PeakProfileParams,
} from '../../engine';
import type { InstrumentProfile } from '../../store';
import { parseNumber } from '../bench/inputs';
import { tryEngine, type FieldErrors } from '../bench/engineErrors';

export type PeakInputs = {
  mz: string;
  resolution: string;
  axialVoltage: string;
  beamRadiusMm: string;
  transverseEnergy: string;
};

export function peakDefaults(p: InstrumentProfile | null): PeakInputs {
  const rga = p?.kind === 'rga';
  const beam = p ? Math.min(0.4, 0.1 * p.rodFieldRadius * 1e3) : 0.4;
  return {
    mz: rga ? '28' : '219',
    resolution: rga ? '100' : '1000',
    axialVoltage: String(p?.axialEnergy ?? 5),
    beamRadiusMm: String(Number(beam.toPrecision(2))),
    transverseEnergy: '0.2',
  };
}

/** Slider ranges (the number fields accept anything the engine accepts). */
export const SLIDERS = {
  axialVoltage: { min: 0.5, max: 50, step: 0.5 },
  beamRadiusMm: { min: 0.02, max: 2, step: 0.02 },
  transverseEnergy: { min: 0, max: 2, step: 0.02 },
} as const;

export interface PeakRun {
  params: PeakProfileParams;
  /** U/V from the chosen ideal resolution (exact stability edges) and V for the m/z at the apex q. */
  ratio: number;
  dc: number;
  rf: number;
  cycles: number;
  band: { low: number; high: number };
  /** Stable key: identical runs share it (a re-render does not restart the simulation). */
  key: string;
}

export const PROFILE_POINTS = 101;

/** Build the run, or null with messages filed under the screen's field names. */
export function buildPeakRun(inputs: PeakInputs, profile: InstrumentProfile, errors: FieldErrors): PeakRun | null {
  const mz = parseNumber(inputs.mz, 'm/z', '219');
  const resolution = parseNumber(inputs.resolution, 'Ideal resolution m/Δm', '1000');
  const axial = parseNumber(inputs.axialVoltage, 'Ion energy', '5');
  const beam = parseNumber(inputs.beamRadiusMm, 'Beam radius', '0.4');
  const transverse = parseNumber(inputs.transverseEnergy, 'Transverse energy', '0.2');
  if (!mz.ok) errors.mz = mz.message;
  if (!resolution.ok) errors.resolution = resolution.message;
  else if (resolution.value < 2 || resolution.value > 100000) errors.resolution = 'Ideal resolution m/Δm: enter a value from 2 to 100 000.';
  if (!axial.ok) errors.axialVoltage = axial.message;
  if (!beam.ok) errors.beamRadiusMm = beam.message;
  else if (beam.value * 1e-3 >= profile.rodFieldRadius) {
    errors.beamRadiusMm = `Beam radius: must be below the field radius r0 = ${profile.rodFieldRadius * 1e3} mm.`;
  }
  if (!transverse.ok) errors.transverseEnergy = transverse.message;
  if (!mz.ok || !resolution.ok || !axial.ok || !beam.ok || !transverse.ok || errors.resolution || errors.beamRadiusMm) return null;

  const map = {
    mz: 'mz', resolution: 'resolution', axialVoltage: 'axialVoltage', cycles: 'axialVoltage', beamRadius: 'beamRadiusMm',
    transverseEnergy: 'transverseEnergy', r0: 'profile', frequency: 'profile', rodLength: 'profile', dc: 'resolution', rf: 'mz',
  };
  const ratio = tryEngine(() => ratioForExactResolution(resolution.value), map, errors, 'resolution');
  const rf = tryEngine(() => rfForMass({ mz: mz.value, r0: profile.rodFieldRadius, frequency: profile.rfFrequency }), map, errors, 'mz');
  if (ratio === null || rf === null) return null;
  const dc = ratio * rf;
  const band = tryEngine(() => passBand({ dc, rf, r0: profile.rodFieldRadius, frequency: profile.rfFrequency }), map, errors, 'resolution');
  if (!band || !Number.isFinite(band.high)) {
    if (!errors.resolution) errors.resolution = 'No pass band at this U/V: lower the resolution.';
    return null;
  }
  const width = band.high - band.low;
  const beamSettings = {
    r0: profile.rodFieldRadius,
    frequency: profile.rfFrequency,
    dc,
    rf,
    rodLength: profile.rodLength,
    axialVoltage: axial.value,
    beamRadius: beam.value * 1e-3,
    transverseEnergy: transverse.value,
  };
  const model = tryEngine(() => flightModel({ ...beamSettings, mz: mz.value }), map, errors, 'profile');
  if (!model) return null;
  // Window: the ideal band plus room for the finite-flight tails (base width ≈ m·K/n², K ≈ 12–20).
  const margin = 0.6 * width + (mz.value * 12) / (model.cycles * model.cycles);
  const params: PeakProfileParams = {
    ...beamSettings,
    mzFrom: Math.max(band.low - margin, 0.5 * band.low),
    mzTo: band.high + margin,
    points: PROFILE_POINTS,
  };
  return { params, ratio, dc, rf, cycles: model.cycles, band, key: JSON.stringify(params) };
}
