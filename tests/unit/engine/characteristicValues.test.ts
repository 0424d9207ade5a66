import { describe, expect, it } from 'vitest';
import { mathieuA, mathieuB, InputRangeError } from '../../../src/engine/index';
import fixture from './fixtures/mathieu-scipy.json';
import { expectClose } from './close';

describe('characteristic values: special values', () => {
  it('q = 0 gives a_n = b_n = n² (DLMF 28.2.22 limit; A&S 20.2.25 constant terms)', () => {
    for (let n = 0; n <= 10; n++) expectClose(mathieuA(n, 0), n * n, 1e-12, `a_${n}(0)`, 'mixed');
    for (let n = 1; n <= 10; n++) expectClose(mathieuB(n, 0), n * n, 1e-12, `b_${n}(0)`, 'mixed');
  });
  it('negative q: a_2n(−q) = a_2n(q), b_2n(−q) = b_2n(q), a_2n+1(−q) = b_2n+1(q) (DLMF 28.2.21)', () => {
    for (const q of [0.3, 1.7, 12, 80]) {
      for (let k = 0; k <= 3; k++) {
        expectClose(mathieuA(2 * k, -q), mathieuA(2 * k, q), 1e-11, `a_${2 * k}(±${q})`, 'mixed');
        expectClose(mathieuA(2 * k + 1, -q), mathieuB(2 * k + 1, q), 1e-11, `a_${2 * k + 1}(−${q})`, 'mixed');
        expectClose(mathieuB(2 * k + 1, -q), mathieuA(2 * k + 1, q), 1e-11, `b_${2 * k + 1}(−${q})`, 'mixed');
        expectClose(mathieuB(2 * k + 2, -q), mathieuB(2 * k + 2, q), 1e-11, `b_${2 * k + 2}(±${q})`, 'mixed');
      }
    }
  });
  it('ordering a0 < b1 < a1 < b2 < a2 < … for q > 0 (DLMF 28.2.23)', () => {
    for (const q of [0.1, 0.5, 3, 10]) // beyond q ≈ 20, a_n and b_{n+1} agree to rounding (DLMF 28.8.2)
      {
      const chain = [mathieuA(0, q)];
      for (let n = 1; n <= 6; n++) chain.push(mathieuB(n, q), mathieuA(n, q));
      for (let i = 1; i < chain.length; i++) expect(chain[i], `q=${q} position ${i}`).toBeGreaterThan(chain[i - 1]);
    }
  });
});

describe('characteristic values: small q against A&S eq. 20.2.25 (same as DLMF 28.6.1–28.6.5)', () => {
  // Coefficients as recalled (from memory); agreement to O(q^10) below confirms every one of them.
  // Series truncated after q^8; the remainder is O(q^10) (about 1.2e-3·q^10 for a0), so the tolerance is
  // 2e-3·q^10 + 1e-13: 2e-10 at q = 0.2, far tighter below.
  const series: Record<string, (q: number) => number> = {
    a0: (q) => -(q ** 2) / 2 + (7 * q ** 4) / 128 - (29 * q ** 6) / 2304 + (68687 * q ** 8) / 18874368,
    b1: (q) =>
      1 - q - q ** 2 / 8 + q ** 3 / 64 - q ** 4 / 1536 - (11 * q ** 5) / 36864 + (49 * q ** 6) / 589824 -
      (55 * q ** 7) / 9437184 - (83 * q ** 8) / 35389440,
    a1: (q) =>
      1 + q - q ** 2 / 8 - q ** 3 / 64 - q ** 4 / 1536 + (11 * q ** 5) / 36864 + (49 * q ** 6) / 589824 +
      (55 * q ** 7) / 9437184 - (83 * q ** 8) / 35389440,
    b2: (q) => 4 - q ** 2 / 12 + (5 * q ** 4) / 13824 - (289 * q ** 6) / 79626240 + (21391 * q ** 8) / 458647142400,
    a2: (q) =>
      4 + (5 * q ** 2) / 12 - (763 * q ** 4) / 13824 + (1002401 * q ** 6) / 79626240 -
      (1669068401 * q ** 8) / 458647142400,
  };
  const engine: Record<string, (q: number) => number> = {
    a0: (q) => mathieuA(0, q),
    b1: (q) => mathieuB(1, q),
    a1: (q) => mathieuA(1, q),
    b2: (q) => mathieuB(2, q),
    a2: (q) => mathieuA(2, q),
  };
  for (const name of Object.keys(series)) {
    it(`${name}(q) for q in 0.001 … 0.2`, () => {
      for (const q of [0.001, 0.01, 0.05, 0.1, 0.15, 0.2]) {
        expectClose(engine[name](q), series[name](q), 2e-3 * q ** 10 + 1e-13, `${name}(${q})`, 'mixed');
      }
    });
  }
});

describe('characteristic values: against scipy.special.mathieu_a / mathieu_b fixture', () => {
  // Fixture: scripts/fixtures/mathieu_fixture.py, run with scipy 1.17.1 from pip under Python 3.11 (the issue
  // names Debian's python3-scipy; same library, Zhang & Jin's CVA2). Observed agreement is ~1e-15 relative up
  // to q = 1000; we ask 1e-10 (absolute for |value| ≤ 1, relative above). scipy breaks down beyond q ≈ 3000
  // (a_2(3000) off by ~2.5e3), so larger q is checked against DLMF 28.8.1 below instead.
  const rows = (fixture as { rows: { kind: string; order: number; q: number; value: number }[] }).rows;
  it(`matches ${rows.length} reference values (orders 0–6, q 0–1000)`, () => {
    for (const row of rows) {
      const value = row.kind === 'a' ? mathieuA(row.order, row.q) : mathieuB(row.order, row.q);
      expectClose(value, row.value, 1e-10, `${row.kind}_${row.order}(${row.q})`, 'mixed');
    }
  });
});

describe('characteristic values: large q against the asymptotic expansion DLMF 28.8.1', () => {
  // a_n(q) ~ b_{n+1}(q) ~ −2q + 2s√q − (s²+1)/8 − (s³+3s)/(2⁷√q) − (5s⁴+34s²+9)/(2¹²q)
  //   − (33s⁵+410s³+405s)/(2¹⁷q^{3/2}) − (63s⁶+1260s⁴+2943s²+486)/(2²⁰q²), s = 2n + 1.
  function asymptotic(n: number, q: number): number {
    const s = 2 * n + 1;
    const h = Math.sqrt(q);
    return (
      -2 * q +
      2 * s * h -
      (s * s + 1) / 8 -
      (s ** 3 + 3 * s) / (2 ** 7 * h) -
      (5 * s ** 4 + 34 * s ** 2 + 9) / (2 ** 12 * q) -
      (33 * s ** 5 + 410 * s ** 3 + 405 * s) / (2 ** 17 * q * h) -
      (63 * s ** 6 + 1260 * s ** 4 + 2943 * s ** 2 + 486) / (2 ** 20 * q * q)
    );
  }
  it('q = 1e3, 1e4 and 1e5, n = 0 … 3: within the size of the next, O(q^-5/2), term of the series', () => {
    for (const q of [1e3, 1e4, 1e5]) {
      for (let n = 0; n <= 3; n++) {
        const s = 2 * n + 1;
        // Observed remainder ≈ 0.03·s⁷·q^(−5/2) (it falls by 10^2.5 per decade of q, as it must); bound 0.05·s⁷·q^(−5/2)
        // plus rounding of the O(q) value.
        const nextTerm = (0.05 * s ** 7) / q ** 2.5 + 4e-16 * 2 * q;
        expectClose(mathieuA(n, q), asymptotic(n, q), nextTerm, `a_${n}(${q})`);
        expectClose(mathieuB(n + 1, q), asymptotic(n, q), nextTerm, `b_${n + 1}(${q})`);
      }
    }
  });
  it('a_n and b_{n+1} merge exponentially fast (DLMF 28.8.2): equal to rounding at q = 1e4', () => {
    for (let n = 0; n <= 5; n++) expectClose(mathieuA(n, 1e4), mathieuB(n + 1, 1e4), 1e-9, `a_${n} − b_${n + 1} at 1e4`, 'relative');
  });
  it('independent check: implicit QL on a matrix three times larger (q = 100, 1000)', () => {
    // Symmetric tridiagonal QL with implicit shifts (Bowdler, Martin, Reinsch & Wilkinson, Numer. Math. 11
    // (1968) 293), written here apart from the engine's Sturm bisection, on the a_2n recurrence DLMF 28.4.5.
    function qlEigenvalues(diagonal: number[], offDiagonal: number[]): number[] {
      const d = diagonal.slice();
      const e = [...offDiagonal, 0];
      const n = d.length;
      for (let l = 0; l < n; l++) {
        for (let iteration = 0; iteration < 60; iteration++) {
          let m = l;
          for (; m < n - 1; m++) {
            const dd = Math.abs(d[m]) + Math.abs(d[m + 1]);
            if (Math.abs(e[m]) <= Number.EPSILON * dd) break;
          }
          if (m === l) break;
          let g = (d[l + 1] - d[l]) / (2 * e[l]);
          let r = Math.hypot(g, 1);
          g = d[m] - d[l] + e[l] / (g + (g >= 0 ? Math.abs(r) : -Math.abs(r)));
          let s = 1;
          let c = 1;
          let p = 0;
          let i = m - 1;
          for (; i >= l; i--) {
            let f = s * e[i];
            const b = c * e[i];
            r = Math.hypot(f, g);
            e[i + 1] = r;
            if (r === 0) {
              d[i + 1] -= p;
              e[m] = 0;
              break;
            }
            s = f / r;
            c = g / r;
            g = d[i + 1] - p;
            r = (d[i] - g) * s + 2 * c * b;
            p = s * r;
            d[i + 1] = g + p;
            g = c * r - b;
            f = 0;
          }
          if (r === 0 && i >= l) continue;
          d[l] -= p;
          e[l] = g;
          e[m] = 0;
        }
      }
      return d.sort((x, y) => x - y);
    }
    for (const q of [100, 1000]) {
      const size = 3 * (Math.ceil(2 * Math.sqrt(q)) + 20);
      const diagonal = Array.from({ length: size }, (_, m) => 4 * m * m);
      const offDiagonal = Array.from({ length: size - 1 }, (_, m) => (m === 0 ? Math.SQRT2 * q : q));
      const reference = qlEigenvalues(diagonal, offDiagonal);
      for (let k = 0; k < 4; k++) {
        expectClose(mathieuA(2 * k, q), reference[k], 1e-12, `a_${2 * k}(${q}) vs QL size ${size}`, 'relative');
      }
    }
  });
});

describe('characteristic values: bad input', () => {
  const bad = [NaN, Infinity, -Infinity];
  it('rejects non-finite q and out-of-range orders with InputRangeError naming the field', () => {
    for (const q of bad) {
      expect(() => mathieuA(0, q)).toThrow(InputRangeError);
      expect(() => mathieuB(1, q)).toThrow(/q = /);
    }
    expect(() => mathieuA(-1, 1)).toThrow(/order = -1/);
    expect(() => mathieuA(1.5, 1)).toThrow(/order = 1.5/);
    expect(() => mathieuB(0, 1)).toThrow(/order = 0 .*≥ 1/);
    expect(() => mathieuA(0, 2e5)).toThrow(/q = 200000/);
    try {
      mathieuB(0, 1);
    } catch (error) {
      expect(error).toBeInstanceOf(InputRangeError);
      expect((error as InputRangeError).field).toBe('order');
      expect((error as InputRangeError).value).toBe(0);
    }
  });
});
