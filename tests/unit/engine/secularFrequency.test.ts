import { describe, expect, it } from 'vitest';
import { operatingPoint, secularFrequencies, secularFrequency, stabilityExponent } from '../../../src/engine/index';
import { expectClose } from './close';

describe('secular frequencies f_sec = β·f/2 (Floquet theory; DLMF 28.2(iii))', () => {
  it('β = 1 gives f/2, β = 0 gives 0', () => {
    expect(secularFrequency(1, 1e6)).toBe(5e5);
    expect(secularFrequency(0, 1e6)).toBe(0);
  });
  it('x and y from the operating point; RF-only: both equal and near q/√8·f for small q (adiabatic limit β ≈ q/√2, from memory)', () => {
    const p = { mz: 500, r0: 4e-3, frequency: 1e6, dc: 0, rf: 20 };
    const point = operatingPoint(p);
    const f = secularFrequencies(p);
    expect(f.x).toBe(f.y);
    expectClose(f.x!, (stabilityExponent(point.a, point.q)! * 1e6) / 2, 1e-15, 'β f/2', 'relative');
    expectClose(f.x!, (point.q / Math.SQRT2) * 5e5, 0.01, 'small-q limit', 'relative');
  });
  it('null in an unstable direction', () => {
    const f = secularFrequencies({ mz: 100, r0: 4e-3, frequency: 1e6, dc: 30, rf: 100 });
    expect(f.x === null || f.y === null).toBe(true);
  });
});
