// One-period fundamental matrix of the Mathieu equation (Magnus, 4th order).
// References: Floquet theory, cos πβ = ½ tr M (DLMF §28.2(iv), 28.2.16) with β from the engine's own
// Hill-determinant exponent (characteristicExponent.ts); exact solutions for q = 0; Liouville: det M = 1.
import { describe, expect, it } from 'vitest';
import { characteristicExponent } from '../../../src/engine/characteristicExponent';
import { monodromy, periodTable } from '../../../src/engine/trajectoryMathieu';
import { near } from './helpers';

describe('periodTable / monodromy', () => {
  it('free motion (a = q = 0): Φ(ξ) = [[1, ξ], [0, 1]] exactly', () => {
    const t = periodTable(0, 0, 32, 2);
    for (let j = 0; j <= 32; j++) {
      near(`u(${j})`, t.u[j], 1, 1e-15);
      near(`w(${j})`, t.w[j], (j * Math.PI) / 32, 1e-14);
    }
  });

  it('constant coefficient (q = 0, a = 0.3): u = cos √a ξ, w = sin(√a ξ)/√a (the Magnus step is exact)', () => {
    const a = 0.3;
    const t = periodTable(a, 0, 64, 1);
    for (let j = 0; j <= 64; j += 8) {
      const xi = (j * Math.PI) / 64;
      near(`u(${xi})`, t.u[j], Math.cos(Math.sqrt(a) * xi), 1e-13);
      near(`w(${xi})`, t.w[j], Math.sin(Math.sqrt(a) * xi) / Math.sqrt(a), 1e-13);
    }
  });

  it('keeps det M = 1 (Liouville; traceless generator) to 1e-12', () => {
    for (const [a, q] of [
      [0.237, 0.706],
      [-0.237, -0.706],
      [0.4, 0.9],
      [0, 0.95],
    ]) {
      const m = monodromy(periodTable(a, q, 128, 2));
      near(`det M at (${a}, ${q})`, m[0] * m[3] - m[1] * m[2], 1, 1e-12);
    }
  });

  it('½ tr M = cos πβ with β from the engine Hill-determinant exponent (DLMF 28.2.16), to 1e-8', () => {
    for (const [a, q] of [
      [0, 0.5],
      [0.1, 0.5],
      [0.2, 0.7],
      [-0.2, -0.7],
      [0.23, 0.706],
      [0, 0.85],
    ]) {
      const r = characteristicExponent(a, q);
      const m = monodromy(periodTable(a, q, 128, 2));
      expect(r.stable).toBe(true);
      near(`½ tr M at (${a}, ${q})`, 0.5 * (m[0] + m[3]), Math.cos(Math.PI * (r.beta as number)), 1e-8);
      near(`½ tr M vs engine halfTrace at (${a}, ${q})`, 0.5 * (m[0] + m[3]), r.halfTrace, 1e-8);
    }
  });

  it('converges: 2 vs 32 Magnus steps per sample agree to 1e-8 over one period (measured ≈ 3e-9: 4th order at h = π/256)', () => {
    const coarse = monodromy(periodTable(0.236, 0.706, 128, 2));
    const fine = monodromy(periodTable(0.236, 0.706, 128, 32));
    for (let i = 0; i < 4; i++) near(`M[${i}]`, coarse[i], fine[i], 1e-8 * (1 + Math.abs(fine[i])));
  });
});
