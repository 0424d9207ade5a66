// Iso-β lines of the first stability region: the a(q) along which β_x (or β_y) keeps a fixed value ν in (0, 1).
// Inside the first zone β(a, q) rises monotonically with a from 0 on the a0(q) edge to 1 on the b1(q) edge
// (DLMF 28.2(v): a = λ_ν(q) is the characteristic value of fractional order ν), so each point is one bracketed
// root. β_y = β(−a, −q) = β(−a, q), so the y lines are the x lines mirrored in a.
// At q = 0, β = √a (DLMF 28.2.22 limit: λ_ν(0) = ν²).
import { a0Unchecked, b1Unchecked } from './characteristicValues';
import { exponentUnchecked } from './characteristicExponent';
import { brentRoot } from './rootFinding';
import { checkChoice, checkNumber, InputRangeError } from './validate';

export interface IsoBetaCurve {
  q: Float64Array;
  /** a on the line at each q (every q is checked first, so every a is finite). */
  a: Float64Array;
}

/** β in zone 0 at (a, q), with the zone's edges taken as exactly 0 and 1. */
function betaZeroZone(a: number, q: number, low: number, high: number): number {
  if (a <= low) return 0;
  if (a >= high) return 1;
  return exponentUnchecked(a, q).beta ?? (a - low < high - a ? 0 : 1);
}

/**
 * The iso-β line β_direction = beta over the given q values (each 0 ≤ q ≤ 5).
 * @param beta ν, 0 < ν < 1
 * @param direction 'x' (β_x = β(a, q)) or 'y' (β_y = β(−a, −q))
 * @param q q samples (1 to 10 000 of them)
 */
export function isoBetaCurve(p: { beta: number; direction: 'x' | 'y'; q: ArrayLike<number> }): IsoBetaCurve {
  const beta = checkNumber('beta', p?.beta, { min: 0, minExclusive: true, max: 1, maxExclusive: true });
  const direction = checkChoice('direction', p?.direction, ['x', 'y'] as const);
  const samples = p?.q;
  if (!samples || typeof samples.length !== 'number' || samples.length < 1 || samples.length > 10_000) {
    throw new InputRangeError('q', samples, 'an array of 1 to 10 000 q values');
  }
  const q = Float64Array.from(samples as ArrayLike<number>);
  q.forEach((value, i) => checkNumber(`q[${i}]`, value, { min: 0, max: 5 }));
  const a = new Float64Array(q.length);
  const sign = direction === 'x' ? 1 : -1;
  for (let i = 0; i < q.length; i++) {
    const qi = q[i];
    const low = a0Unchecked(qi);
    const high = b1Unchecked(qi);
    const root = brentRoot((x) => betaZeroZone(x, qi, low, high) - beta, low, high, 1e-13);
    a[i] = sign * root;
  }
  return { q, a };
}
