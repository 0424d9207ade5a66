// The mass filter's link between volts and Mathieu parameters (convention of Dawson 1976: rod pair x at
// +(U + V cos Ωt), pair y at −(U + V cos Ωt), per rod to ground, V zero-to-peak):
//   a = 8eU/(m r0² Ω²),  q = 4eV/(m r0² Ω²),  Ω = 2πf,  m = (m/z)·u per elementary charge.
import { ATOMIC_MASS_CONSTANT, ELEMENTARY_CHARGE } from './constants';
import { checkNumber, checkPositive } from './validate';

/** Accepted ranges shared by the public functions (SI). */
export const LIMITS = {
  mz: { min: 0, minExclusive: true, max: 1e7, unit: 'u' },
  r0: { min: 0, minExclusive: true, max: 1, unit: 'm' },
  frequency: { min: 0, minExclusive: true, max: 1e9, unit: 'Hz' },
  dc: { min: -1e6, max: 1e6, unit: 'V' },
  rf: { min: 0, max: 1e6, unit: 'V' },
  rfPositive: { min: 0, minExclusive: true, max: 1e6, unit: 'V' },
} as const;

/** q·(m/z) per volt of V: q = qMassPerVolt · V / (m/z), in u/V. */
export function qMassPerVolt(r0: number, frequency: number): number {
  const omega = 2 * Math.PI * frequency;
  return (4 * ELEMENTARY_CHARGE) / (ATOMIC_MASS_CONSTANT * r0 * r0 * omega * omega);
}

export interface MathieuParameters {
  a: number;
  q: number;
}

/** a and q for an ion of m/z (u) in a filter of field radius r0 (m) at frequency f (Hz), U = dc, V = rf (V). */
export function mathieuParameters(p: { mz: number; r0: number; frequency: number; dc: number; rf: number }): MathieuParameters {
  const mz = checkNumber('mz', p?.mz, LIMITS.mz);
  const r0 = checkNumber('r0', p?.r0, LIMITS.r0);
  const frequency = checkNumber('frequency', p?.frequency, LIMITS.frequency);
  const dc = checkNumber('dc', p?.dc, LIMITS.dc);
  const rf = checkNumber('rf', p?.rf, LIMITS.rf);
  const k = qMassPerVolt(r0, frequency) / mz;
  return { a: 2 * k * dc, q: k * rf };
}

/** Ω = 2πf in rad/s. */
export function angularFrequency(frequency: number): number {
  return 2 * Math.PI * checkPositive('frequency', frequency, 'Hz', 1e9);
}
