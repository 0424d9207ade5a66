// Apparent mass shift from drifts in frequency, field radius and RF amplitude, from m ∝ V/(r0² f²) at fixed q:
// δm/m ≈ 2·δf/f + 2·δr0/r0 − δV/V (first order, derived from q = 4eV/(m r0²Ω²); Dawson 1976). Positive: ions appear
// at a higher displayed m/z.
import { checkNumber } from './validate';

/** Apparent shift (u) at m/z for relative changes of frequency, field radius and RF amplitude (each as a fraction). */
export function apparentMassShift(p: {
  mz: number;
  frequencyChange?: number;
  r0Change?: number;
  rfChange?: number;
}): number {
  const mz = checkNumber('mz', p?.mz, { min: 0, minExclusive: true, max: 1e7, unit: 'u' });
  const range = { min: -0.5, max: 0.5 };
  const df = checkNumber('frequencyChange', p.frequencyChange ?? 0, range);
  const dr = checkNumber('r0Change', p.r0Change ?? 0, range);
  const dv = checkNumber('rfChange', p.rfChange ?? 0, range);
  return mz * (2 * df + 2 * dr - dv);
}
