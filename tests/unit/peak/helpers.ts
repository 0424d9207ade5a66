// Shared settings for the peak tests: build SI settings that give chosen Mathieu a, q and flight length n.
import { ATOMIC_MASS_CONSTANT, ELEMENTARY_CHARGE } from '../../../src/engine/constants';
import type { TransmissionParams } from '../../../src/engine/peakInput';

export const MZ = 100;
export const R0 = 4e-3;
export const FREQUENCY = 1e6;
export const ROD_LENGTH = 0.2;

/** Settings for m/z = 100 (r0 4 mm, 1 MHz, 20 cm rods) with Mathieu (a, q) and n RF cycles. */
export function settingsFor(p: {
  a: number;
  q: number;
  cycles: number;
  beamFraction?: number;
  transverseEnergy?: number;
  mz?: number;
}): TransmissionParams {
  const mz = p.mz ?? MZ;
  const mass = mz * ATOMIC_MASS_CONSTANT;
  const omega = 2 * Math.PI * FREQUENCY;
  const scale = (mass * R0 * R0 * omega * omega) / ELEMENTARY_CHARGE;
  const axialSpeed = (FREQUENCY * ROD_LENGTH) / p.cycles;
  return {
    mz,
    r0: R0,
    frequency: FREQUENCY,
    rodLength: ROD_LENGTH,
    dc: (p.a * scale) / 8,
    rf: (p.q * scale) / 4,
    axialVoltage: (mass * axialSpeed * axialSpeed) / (2 * ELEMENTARY_CHARGE),
    beamRadius: (p.beamFraction ?? 0.1) * R0,
    transverseEnergy: p.transverseEnergy ?? 0.1,
  };
}

/** |actual − expected| ≤ tolerance, with a message that prints input, difference and tolerance. */
export function near(label: string, actual: number, expected: number, tolerance: number): void {
  const difference = Math.abs(actual - expected);
  if (!(difference <= tolerance)) {
    throw new Error(`${label}: got ${actual}, expected ${expected}, |Δ| = ${difference} > tolerance ${tolerance}`);
  }
}
