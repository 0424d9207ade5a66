/**
 * Inputs of the peak simulation: the refusal of bad input (the engine's InputRangeError, naming field, value and
 * range; CODATA 2018 constants from constants.ts), and the Mathieu parameters
 * that follow from a set of instrument settings.
 *
 * Convention (the engine's one): rod pair x at +(U + V cos Ωt), rod pair y at −(U + V cos Ωt), U and V per rod
 * to ground, V zero-to-peak. a = 8zeU/(m r0² Ω²), q = 4zeV/(m r0² Ω²), ξ = Ωt/2;
 * x'' + (a − 2q cos 2ξ) x = 0 and y'' − (a − 2q cos 2ξ) y = 0 (DLMF 28.2.1 with (a, q) and (−a, −q)).
 */

import { ATOMIC_MASS_CONSTANT, ELEMENTARY_CHARGE } from './constants';
import { InputRangeError } from './validate';

export function requireFinite(field: string, value: number, min: number, max: number, open: 'min' | 'none' = 'min'): number {
  const ok =
    typeof value === 'number' &&
    Number.isFinite(value) &&
    (open === 'min' ? value > min : value >= min) &&
    value <= max;
  if (!ok) {
    const lower = open === 'min' ? `> ${min}` : `≥ ${min}`;
    throw new InputRangeError(field, value, `a finite number ${lower} and ≤ ${max}`);
  }
  return value;
}

export function requireInteger(field: string, value: number, min: number, max: number): number {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min || value > max) {
    throw new InputRangeError(field, value, `an integer from ${min} to ${max}`);
  }
  return value;
}

/** Instrument and beam settings shared by every peak-simulation call (SI units; energies in eV). */
export interface BeamSettings {
  /** Field radius r0, m. */
  r0: number;
  /** RF frequency f, Hz (Ω = 2πf). */
  frequency: number;
  /** DC per rod to ground U, V (x pair at +U). */
  dc: number;
  /** RF amplitude per rod to ground V, volts zero-to-peak. */
  rf: number;
  /** Rod length L, m (ideal field over the whole length, no fringe fields). */
  rodLength: number;
  /** Ion acceleration voltage V_z into the rods, V: axial energy z·e·V_z. */
  axialVoltage: number;
  /** Radius of the uniformly filled entrance disc, m. */
  beamRadius: number;
  /**
   * Mean transverse kinetic energy ε⊥, eV: v_x, v_y independent Gaussians with σ = √(e·ε⊥/m),
   * so ½m⟨v_x²⟩ = ½m⟨v_y²⟩ = ε⊥/2 and ½m⟨v_x² + v_y²⟩ = ε⊥ (an energy, so independent of the charge).
   */
  transverseEnergy: number;
  /** Charge number z (default 1); m/z is given, so m = (m/z)·|z|·u. */
  charge?: number;
}

/** Settings for one ion species: m/z in u per elementary charge. */
export interface TransmissionParams extends BeamSettings {
  mz: number;
}

/** The largest flight the simulation accepts, in RF cycles (cost grows only as log n, but keep it bounded). */
export const PEAK_MAX_CYCLES = 1e6;

export function validateBeamSettings(p: BeamSettings): void {
  if (p === null || typeof p !== 'object') throw new InputRangeError('params', p, 'an object of instrument settings');
  requireFinite('r0', p.r0, 0, 0.1);
  requireFinite('frequency', p.frequency, 0, 1e9);
  requireFinite('dc', p.dc, -1e5, 1e5, 'none');
  requireFinite('rf', p.rf, 0, 1e5, 'none');
  requireFinite('rodLength', p.rodLength, 0, 10);
  requireFinite('axialVoltage', p.axialVoltage, 0, 1e5);
  requireFinite('beamRadius', p.beamRadius, 0, 0.1);
  requireFinite('transverseEnergy', p.transverseEnergy, 0, 1e4, 'none');
  if (p.charge !== undefined) {
    requireInteger('charge', p.charge, -100, 100);
    if (p.charge === 0) throw new InputRangeError('charge', 0, 'a non-zero integer from -100 to 100');
  }
}

/** Dimensionless description of one species in the filter (everything the transmission integral needs). */
export interface FlightModel {
  /** Mathieu a and q of the x motion (y has −a, −q). */
  a: number;
  q: number;
  /** Flight length in RF cycles n = f·L/v_z (not rounded); ξ runs over n·π. */
  cycles: number;
  /** Beam radius and the spread of x' = dx/dξ, both in units of r0 (so the aperture is |x| < 1). */
  beamRadius: number;
  slopeSigma: number;
}

/** Mathieu parameters, flight length and scaled beam for one species; throws InputRangeError on bad input. */
export function flightModel(p: TransmissionParams): FlightModel {
  validateBeamSettings(p);
  requireFinite('mz', p.mz, 0, 1e7);
  const z = Math.abs(p.charge ?? 1);
  const mass = p.mz * z * ATOMIC_MASS_CONSTANT;
  const charge = z * ELEMENTARY_CHARGE;
  const omega = 2 * Math.PI * p.frequency;
  const scale = charge / (mass * p.r0 * p.r0 * omega * omega);
  // A negative ion sees (−a, −q) in x, i.e. the roles of x and y swap; the round beam makes that irrelevant.
  const sign = (p.charge ?? 1) < 0 ? -1 : 1;
  const a = sign * 8 * scale * p.dc;
  const q = sign * 4 * scale * p.rf;
  const axialSpeed = Math.sqrt((2 * charge * p.axialVoltage) / mass);
  const cycles = (p.frequency * p.rodLength) / axialSpeed;
  if (!(cycles >= 0.5 && cycles <= PEAK_MAX_CYCLES)) {
    throw new InputRangeError(
      'cycles',
      cycles,
      `a flight of 0.5 to ${PEAK_MAX_CYCLES} RF cycles (n = f·L·√(m/(2zeV_z)); change frequency, rodLength or axialVoltage)`,
    );
  }
  // dx/dξ = (2/Ω)·v_x; σ_v = √(e·ε⊥/m).
  const velocitySigma = Math.sqrt((ELEMENTARY_CHARGE * p.transverseEnergy) / mass);
  return {
    a,
    q,
    cycles,
    beamRadius: p.beamRadius / p.r0,
    slopeSigma: ((2 / omega) * velocitySigma) / p.r0,
  };
}
