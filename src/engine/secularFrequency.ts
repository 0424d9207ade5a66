// Secular (macro-motion) frequency of an ion: ω = β·Ω/2, i.e. f_sec = β·f/2 (Floquet theory,
// DLMF 28.2(iii)), for each direction of the mass filter: β_x = β(a, q), β_y = β(−a, −q).
import { exponentUnchecked } from './characteristicExponent';
import { mathieuParameters } from './mathieuScale';
import { checkNumber } from './validate';

/** f_sec = β·f/2 in Hz for a given β ≥ 0 and RF frequency f (Hz). */
export function secularFrequency(beta: number, frequency: number): number {
  checkNumber('beta', beta, { min: 0, max: 1000 });
  checkNumber('frequency', frequency, { min: 0, minExclusive: true, max: 1e9, unit: 'Hz' });
  return (beta * frequency) / 2;
}

/** Secular frequencies (Hz) in x and y for an ion in the filter; null in a direction that is unstable. */
export function secularFrequencies(p: { mz: number; r0: number; frequency: number; dc: number; rf: number }): {
  x: number | null;
  y: number | null;
} {
  const { a, q } = mathieuParameters(p);
  checkNumber('a', a, { min: -1000, max: 1000 });
  checkNumber('q', q, { min: -1000, max: 1000 });
  const bx = exponentUnchecked(a, q).beta;
  const by = exponentUnchecked(-a, -q).beta;
  return { x: bx === null ? null : (bx * p.frequency) / 2, y: by === null ? null : (by * p.frequency) / 2 };
}
