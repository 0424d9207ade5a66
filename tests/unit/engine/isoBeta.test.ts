import { describe, expect, it } from 'vitest';
import { firstRegionApex, firstRegionBoundary, InputRangeError, isoBetaCurve, stabilityExponent } from '../../../src/engine/index';
import { expectClose } from './close';

describe('iso-β lines of the first region', () => {
  it('q = 0: β = √a, so the line starts at a = ν² (DLMF 28.2.22 limit, λ_ν(0) = ν²)', () => {
    for (const nu of [0.1, 0.25, 0.5, 0.9]) expectClose(isoBetaCurve({ beta: nu, direction: 'x', q: [0] }).a[0], nu * nu, 1e-12, `ν=${nu}`);
  });
  it('small q: a ≈ ν² + q²/(2(ν²−1)) + (5ν²+7)q⁴/(32(ν²−1)³(ν²−4)) (A&S 20.3.15, from memory)', () => {
    for (const nu of [0.3, 0.5, 0.7]) {
      const q = 0.02; // the first term left out is O(q⁶) ≈ 1e-10 here
      const n2 = nu * nu;
      const series = n2 + (q * q) / (2 * (n2 - 1)) + ((5 * n2 + 7) * q ** 4) / (32 * (n2 - 1) ** 3 * (n2 - 4));
      expectClose(isoBetaCurve({ beta: nu, direction: "x", q: [q] }).a[0], series, 1e-9, `ν=${nu}, q=${q}`);
    }
  });
  it('along each line β_x (or β_y) equals ν, computed independently by the Hill-determinant exponent', () => {
    const qs = [0.1, 0.3, 0.5, 0.7, 0.85];
    for (const nu of [0.2, 0.5, 0.8]) {
      const x = isoBetaCurve({ beta: nu, direction: 'x', q: qs });
      const y = isoBetaCurve({ beta: nu, direction: 'y', q: qs });
      qs.forEach((q, i) => {
        expectClose(stabilityExponent(x.a[i], q)!, nu, 1e-9, `β_x at q=${q}`);
        expectClose(stabilityExponent(-y.a[i], -q)!, nu, 1e-9, `β_y at q=${q}`);
      });
    }
  });
  it('lines stay inside the region edges: ν → 0 approaches the a0 edge, ν → 1 the b1 edge', () => {
    const b = firstRegionBoundary(50);
    const qs = Array.from(b.q).slice(1, -1);
    const near0 = isoBetaCurve({ beta: 1e-6, direction: 'x', q: qs });
    const near1 = isoBetaCurve({ beta: 1 - 1e-6, direction: 'x', q: qs });
    qs.forEach((q, i) => {
      // −yEdge = a0(q); xEdge = b1(q)
      expectClose(near0.a[i], -b.yEdge[i + 1], 1e-6, `ν→0 at q=${q}`, 'mixed');
      expectClose(near1.a[i], b.xEdge[i + 1], 1e-6, `ν→1 at q=${q}`, 'mixed');
    });
    // At the apex both edges meet: β_x → 1 and β_y → 0 there.
    const apex = firstRegionApex();
    expect(stabilityExponent(apex.a * 0.999, apex.q)!).toBeGreaterThan(0.9);
  });
  it('names the field for bad input', () => {
    expect(() => isoBetaCurve({ beta: 1, direction: 'x', q: [0.1] })).toThrow(InputRangeError);
    expect(() => isoBetaCurve({ beta: 0.5, direction: 'z' as 'x', q: [0.1] })).toThrow(/direction/);
    expect(() => isoBetaCurve({ beta: 0.5, direction: 'x', q: [0.1, NaN] })).toThrow(/q\[1\]/);
  });
});
