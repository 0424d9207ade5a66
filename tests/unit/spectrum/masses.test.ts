// Exact masses and isotope patterns (src/spectrum/formula.ts, isotopes.ts) against published values.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  ELECTRON_MASS_U,
  KNOWN_ELEMENTS,
  formatFormula,
  ionMz,
  isotopePattern,
  monoisotopicMass,
  parseFormula,
} from '../../../src/spectrum/index';

function near(label: string, actual: number, expected: number, tolerance: number): void {
  const difference = Math.abs(actual - expected);
  if (!(difference <= tolerance)) throw new Error(`${label}: got ${actual}, expected ${expected}, |Δ| = ${difference} > ${tolerance}`);
}

describe('element table', () => {
  it('holds every element the spectrum screens need', () => {
    const needed = 'H He B C N O F Ne Na Mg Al Si P S Cl Ar K Ca Fe Ni Cu Zn Br Kr Ag Sn I Xe Pt Hg Pb'.split(' ');
    for (const symbol of needed) expect(KNOWN_ELEMENTS).toContain(symbol);
  });
});

describe('parseFormula', () => {
  it('reads symbols, counts and nested parentheses', () => {
    expect(parseFormula('C9F20N')).toEqual({ C: 9, F: 20, N: 1 });
    expect(parseFormula('(CH3)3SiOH')).toEqual({ C: 3, H: 10, Si: 1, O: 1 });
    expect(parseFormula('Xe')).toEqual({ Xe: 1 });
    expect(parseFormula('((CF3)2N)2')).toEqual({ C: 4, F: 12, N: 2 });
    expect(parseFormula('CH3CH2OH')).toEqual({ C: 2, H: 6, O: 1 });
  });

  it('refuses bad input naming the position and the reason', () => {
    expect(() => parseFormula('')).toThrow(/empty/);
    expect(() => parseFormula('C9Xq')).toThrow(/position 3: unknown element "Xq"/);
    expect(() => parseFormula('(CH3')).toThrow(/position 1: this "\(" is never closed/);
    expect(() => parseFormula('CH3)')).toThrow(/position 4: a "\)" with no "\("/);
    expect(() => parseFormula('C0')).toThrow(/position 2: count "0"/);
    expect(() => parseFormula('2C')).toThrow(/position 1: a count must follow/);
    expect(() => parseFormula('C 2')).toThrow(/position 2: character " "/);
    expect(() => parseFormula('c2')).toThrow(/position 1: "c" cannot start/);
    expect(() => parseFormula('()')).toThrow(/position 2: empty parentheses/);
    expect(() => parseFormula('C999999')).toThrow(/above the limit/);
  });

  it('round trip: parse(format(counts)) gives the counts back (property)', () => {
    const element = fc.constantFrom(...KNOWN_ELEMENTS);
    fc.assert(
      fc.property(fc.dictionary(element, fc.integer({ min: 1, max: 500 }), { minKeys: 1, maxKeys: 8 }), (counts) => {
        expect(parseFormula(formatFormula(counts))).toEqual(counts);
      }),
    );
  });

  it('hostile text never escapes as anything but an Error with a message (property)', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 20 }), (text) => {
        try {
          const counts = parseFormula(text);
          for (const n of Object.values(counts)) expect(Number.isInteger(n) && n > 0).toBe(true);
        } catch (error) {
          expect(error).toBeInstanceOf(Error);
          expect((error as Error).message).toMatch(/^Formula/);
        }
      }),
    );
  });
});

describe('monoisotopicMass and ionMz', () => {
  // Published monoisotopic masses: isotope masses of AME2016 (M. Wang et al., Chin. Phys. C 41 (2017) 030003),
  // as listed in the NIST Chemistry WebBook ("exact mass") — values from memory, to 1e-6 u.
  const published: [string, number][] = [
    ['H2O', 18.010565],
    ['N2', 28.006148],
    ['O2', 31.989829],
    ['Ar', 39.962383],
    ['CO2', 43.989829],
  ];
  for (const [formula, mass] of published) {
    it(`${formula}: ${mass} u (NIST WebBook, from memory)`, () => near(formula, monoisotopicMass(formula), mass, 1.5e-6));
  }

  it('atomic masses of single atoms: AME2016 ¹H 1.00782503223 u, ¹⁶O 15.99491461957 u (published, Wang et al. 2017)', () => {
    near('H', monoisotopicMass('H'), 1.00782503223, 1e-11);
    near('O', monoisotopicMass('O'), 15.99491461957, 1e-11);
    near('C', monoisotopicMass('C'), 12, 0);
  });

  it('cation and anion m/z remove or add electrons (CODATA 2018 mₑ = 5.48579909065e-4 u)', () => {
    expect(ELECTRON_MASS_U).toBe(5.48579909065e-4);
    const m = monoisotopicMass('C9F20N');
    near('C9F20N+', ionMz('C9F20N'), m - ELECTRON_MASS_U, 1e-12);
    near('C9F20N 2+', ionMz('C9F20N', 2), (m - 2 * ELECTRON_MASS_U) / 2, 1e-12);
    near('C9F20N−', ionMz('C9F20N', -1), m + ELECTRON_MASS_U, 1e-12);
    // From the AME2016 atomic masses ¹⁹F 18.99840316273 u and ¹⁴N 14.00307400443 u (published, Wang et al. 2017).
    near('C9F20N+ m/z', ionMz('C9F20N'), 9 * 12 + 20 * 18.99840316273 + 14.00307400443 - ELECTRON_MASS_U, 1e-9);
    expect(() => ionMz('H2O', 0)).toThrow(/charge = 0 is out of range/);
  });

  it('masses add: M(A) + M(B) = M(AB) (property)', () => {
    const element = fc.constantFrom(...KNOWN_ELEMENTS);
    const formula = fc.dictionary(element, fc.integer({ min: 1, max: 50 }), { minKeys: 1, maxKeys: 5 }).map(formatFormula);
    fc.assert(
      fc.property(formula, formula, (a, b) => {
        const sum = monoisotopicMass(a) + monoisotopicMass(b);
        near(`${a} + ${b}`, monoisotopicMass(`(${a})(${b})`), sum, 1e-9 * sum);
      }),
    );
  });
});

describe('isotopePattern', () => {
  const ratios = (formula: string) => isotopePattern(formula, { minAbundance: 1e-6 });

  it('Cl2: M : M+2 : M+4 = 100 : 64 : 10 (McLafferty & Tureček, Interpretation of Mass Spectra, 4th ed. 1993, isotope table — from memory)', () => {
    const p = ratios('Cl2');
    expect(p).toHaveLength(3);
    near('M', p[0].abundance, 1, 0);
    near('M+2', p[1].abundance, 0.64, 0.01);
    near('M+4', p[2].abundance, 0.1, 0.01);
    // Exact from the IUPAC representative fractions ³⁵Cl 0.7576, ³⁷Cl 0.2424 (computed): 2q/p and (q/p)².
    near('M+2 exact', p[1].abundance, (2 * 0.2424) / 0.7576, 1e-9);
    near('M+4 exact', p[2].abundance, (0.2424 / 0.7576) ** 2, 1e-9);
    near('M+2 m/z', p[1].mz, 34.968852682 + 36.965902602 - ELECTRON_MASS_U, 1e-9);
  });

  it('Br2: M : M+2 : M+4 = 51 : 100 : 49 (McLafferty & Tureček 1993 — from memory)', () => {
    const p = ratios('Br2');
    expect(p).toHaveLength(3);
    near('M', p[0].abundance, 0.51, 0.01);
    near('M+2', p[1].abundance, 1, 0);
    near('M+4', p[2].abundance, 0.49, 0.01);
  });

  it('Xe: the nine stable isotopes an RGA user checks, relative to ¹³²Xe (IUPAC representative composition, e.g. ¹²⁹Xe 26.4006 %, ¹³²Xe 26.9086 % — as tabulated by NIST, from memory)', () => {
    const p = ratios('Xe');
    expect(p.map((e) => Math.round(e.mz))).toEqual([124, 126, 128, 129, 130, 131, 132, 134, 136]);
    const expected: Record<number, number> = { 124: 0.000952, 126: 0.00089, 128: 0.019102, 129: 0.264006, 130: 0.04071, 131: 0.212324, 132: 0.269086, 134: 0.104357, 136: 0.088573 };
    for (const e of p) near(`Xe ${Math.round(e.mz)}`, e.abundance, expected[Math.round(e.mz)] / 0.269086, 2e-4);
    // Rounded to the percent an RGA display shows: 129 ≈ 98 %, 131 ≈ 79 %, 134 ≈ 39 %, 136 ≈ 33 % of 132.
    expect(Math.round(100 * p[3].abundance)).toBe(98);
    expect(Math.round(100 * p[5].abundance)).toBe(79);
    expect(Math.round(100 * p[7].abundance)).toBe(39);
    expect(Math.round(100 * p[8].abundance)).toBe(33);
  });

  it('CₙHₘ: M+1/M = n·p(¹³C)/p(¹²C) + m·p(²H)/p(¹H) ≈ n·1.08 % (IUPAC ¹³C 1.07 %; first-order binomial, exact for M+1)', () => {
    for (const [n, m] of [[1, 4], [10, 22], [20, 42], [40, 82]]) {
      const p = isotopePattern(`C${n}H${m}`, { minAbundance: 1e-9 });
      const [mono, plus1] = p;
      near(`C${n}H${m} M+1/M`, plus1.abundance / mono.abundance, (n * 0.0107) / 0.9893 + (m * 0.000115) / 0.999885, 1e-10);
    }
  });

  it('C100H200 and Xe2: ascending, max = 1, sum of unnormalised probability conserved, minAbundance respected', () => {
    for (const formula of ['C100H200', 'Xe2', 'C9F20N']) {
      const p = isotopePattern(formula);
      for (let i = 1; i < p.length; i++) expect(p[i].mz).toBeGreaterThan(p[i - 1].mz);
      expect(Math.max(...p.map((e) => e.abundance))).toBe(1);
      for (const e of p) expect(e.abundance).toBeGreaterThanOrEqual(1e-4);
    }
    // C100H200: M+1/M ≈ 100 × 1.08 % + 200 × 0.0115 % ≈ 1.11 (as above), so the M+1 cluster (¹³C, +1.00336 u) leads.
    const c100 = isotopePattern('C100H200');
    expect(c100[1].abundance).toBe(1);
    near('C100H200 M+1 m/z', c100[1].mz - c100[0].mz, 1.0034, 0.002);
    // Xe2: the mean m/z weighted by abundance equals twice Xe's mean atomic mass (131.293, standard atomic weight — published, CIAAW 2009).
    const all = isotopePattern('Xe2', { minAbundance: 0 });
    const total = all.reduce((s, e) => s + e.abundance, 0);
    const mean = all.reduce((s, e) => s + e.abundance * e.mz, 0) / total;
    near('Xe2 mean m/z', mean, 2 * 131.293 - ELECTRON_MASS_U, 0.002);
  });

  it('refuses bad options with the field and range', () => {
    expect(() => isotopePattern('Xe', { minAbundance: 2 })).toThrow(/minAbundance = 2 is out of range/);
    expect(() => isotopePattern('Xe', { charge: 1.5 })).toThrow(/charge = 1.5/);
    const doubly = isotopePattern('Xe', { charge: 2 });
    near('Xe2+ m/z', doubly[6].mz, (131.9041550856 - 2 * ELECTRON_MASS_U) / 2, 1e-9);
  });
});
