import { describe, expect, it } from 'vitest';
import {
  catalogue, catalogueType, checkEntry, expectationFor, fromBase, judge, PASCAL_PER_MBAR, PASCAL_PER_TORR, toBase, unitOf,
  type Expectation,
} from '../../../src/records';
import { demoInstruments } from '../../../src/store';
import { testEngine } from '../store/helpers';

const type = (id: string) => {
  const t = catalogueType(id);
  if (!t) throw new Error(`no type ${id}`);
  return t;
};

describe('unit conversions on entry', () => {
  it('1 Torr = 133.322 368 Pa (NIST SP 811 (2008) App. B.8: 1.333 224 E+02 Pa; exact 101325/760, CODATA 2018 atmosphere)', () => {
    expect(PASCAL_PER_TORR).toBeCloseTo(133.322368421, 9);
    expect(Math.abs(PASCAL_PER_TORR - 133.3224)).toBeLessThan(5e-5);
    const torr = unitOf(type('vacuum-high'), 'Torr')!;
    expect(toBase(torr, 1)).toBe(101325 / 760);
  });
  it('1 mbar = 100 Pa (NIST SP 811 B.8: 1 bar = 1 E+05 Pa); 1 Torr = 1.33322 mbar (NIST SP 811, 2008, Appendix B.8: 1.333 224 E+02 Pa)', () => {
    expect(PASCAL_PER_MBAR).toBe(100);
    const t = type('vacuum-fore');
    const mbarPerTorr = toBase(unitOf(t, 'Torr')!, 1) / toBase(unitOf(t, 'mbar')!, 1);
    expect(mbarPerTorr).toBeCloseTo(1.33322, 5);
  });
  it('RF amplitude: p-p on one rod is 2V, rms V/√2, between the pairs 2V (0-p) and 4V (p-p) (domain §0.2, from the definition ±V cos Ωt)', () => {
    const t = type('rf-amplitude');
    expect(toBase(unitOf(t, 'Vpp-rod')!, 200)).toBe(100);
    expect(toBase(unitOf(t, 'Vrms-rod')!, 100 / Math.SQRT2)).toBeCloseTo(100, 12);
    expect(toBase(unitOf(t, 'V0p-pairs')!, 200)).toBe(100);
    expect(toBase(unitOf(t, 'Vpp-pairs')!, 400)).toBe(100);
    expect(toBase(unitOf(t, 'Vrms-pairs')!, 200 / Math.SQRT2)).toBeCloseTo(100, 12);
  });
  it('temperature: 0 °C = 273.15 K and 32 °F (SI brochure; NIST SP 811 B.9)', () => {
    const t = type('source-temperature');
    expect(toBase(unitOf(t, 'K')!, 273.15)).toBeCloseTo(0, 12);
    expect(toBase(unitOf(t, 'degF')!, 32)).toBeCloseTo(0, 12);
    expect(toBase(unitOf(t, 'degF')!, 212)).toBeCloseTo(100, 12);
  });
  it('every unit of every type round-trips base → unit → base', () => {
    for (const t of catalogue) {
      for (const u of t.units) {
        for (const x of [t.plausible.min, t.plausible.max, (t.plausible.min + t.plausible.max) / 3]) {
          expect(toBase(u, fromBase(u, x))).toBeCloseTo(x, 6);
        }
      }
    }
  });
});

describe('entry checks name the field and the accepted range in the chosen unit', () => {
  it('accepts 1.2e-5 Torr and stores Pa with the gauge gas', () => {
    const r = checkEntry(type('vacuum-high'), '1.2e-5', 'Torr', {});
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value).toBeCloseTo(1.2e-5 * PASCAL_PER_TORR, 15);
    expect(r.context.gaugeGas).toBe('N2-equivalent');
  });
  it('refuses text, empty and out-of-range values with the range', () => {
    const t = type('vacuum-high');
    const a = checkEntry(t, 'abc', 'mbar', {});
    expect(!a.ok && a.errors.value).toMatch(/High vacuum \(analyser\) must be a number between 1e-12 and 1200 mbar, written like 2.5 or 2.5e-5; “abc” is not a number/);
    const b = checkEntry(t, '', 'mbar', {});
    expect(!b.ok && b.errors.value).toMatch(/is empty/);
    const c = checkEntry(t, '5000', 'mbar', {});
    expect(!c.ok && c.errors.value).toMatch(/High vacuum \(analyser\) must be between 1e-12 and 1200 mbar; 5000 mbar is above that/);
    const d = checkEntry(type('multiplier-voltage'), '7', 'kV', {});
    expect(!d.ok && d.errors.value).toMatch(/Multiplier voltage \(as set for the wanted gain\) must be between 0 and 6 kV; 7 kV is above that/);
  });
  it('requires the parked m/z for RF amplitude and stores the convention', () => {
    const t = type('rf-amplitude');
    const a = checkEntry(t, '200', 'Vpp-rod', {});
    expect(!a.ok && a.errors.mz).toMatch(/Parked m\/z is empty: enter a value between 1 and 5000 u/);
    const b = checkEntry(t, '200', 'Vpp-rod', { mz: '69' });
    expect(b.ok && b.value).toBe(100);
    expect(b.ok && b.context).toEqual({ mz: 69, convention: 'V peak-to-peak, one rod to ground' });
  });
  it('reads a set value in the reading’s unit', () => {
    const r = checkEntry(type('emission-current'), '34.5', 'uA', { setpoint: '35' });
    expect(r.ok && r.context.setpoint).toBeCloseTo(35e-6, 18);
    const bad = checkEntry(type('emission-current'), '34.5', 'uA', { setpoint: '1e9' });
    expect(!bad.ok && bad.errors.setpoint).toMatch(/Set value 1e9 is out of range: enter a value between 0 and 20000 µA/);
  });
  it('refuses an unknown unit and an unknown gauge gas', () => {
    expect(checkEntry(type('vacuum-high'), '1', 'psi', {}).ok).toBe(false);
    const r = checkEntry(type('vacuum-high'), '1e-5', 'mbar', { gaugeGas: 'xenon' });
    expect(!r.ok && r.errors.gaugeGas).toMatch(/Gauge reading “xenon” is not one of/);
  });
});

describe('verdicts', () => {
  const point = (value: number, kind: 'relative' | 'absolute' | 'factor', pass: number, borderline: number, badSide: Expectation['badSide'] = 'both'): Expectation => ({
    value, basis: 'baseline', source: 'test', tolerance: { kind, pass, borderline }, badSide,
  });
  it('relative tolerance: pass at the edge, borderline beyond, fail beyond that', () => {
    const e = point(100, 'relative', 0.01, 0.02);
    expect(judge(100, e).verdict).toBe('pass');
    expect(judge(101, e).verdict).toBe('pass');
    expect(judge(98.5, e).verdict).toBe('borderline');
    expect(judge(102, e).verdict).toBe('borderline');
    expect(judge(102.1, e).verdict).toBe('fail');
    expect(judge(97.9, e).verdict).toBe('fail');
    expect(judge(98.5, e).summary).toBe('off by 1.5 % from the baseline value');
  });
  it('one-sided: a pressure below its baseline passes, above by ×1.5/×3 grades', () => {
    const e = point(1e-3, 'factor', 1.5, 3, 'high');
    expect(judge(1e-6, e).verdict).toBe('pass');
    expect(judge(1.4e-3, e).verdict).toBe('pass');
    expect(judge(2e-3, e).verdict).toBe('borderline');
    expect(judge(4e-3, e).verdict).toBe('fail');
    expect(judge(0, point(1e-3, 'factor', 1.5, 3, 'both')).verdict).toBe('fail');
  });
  it('ranges: inside passes, a margin beyond is borderline, the good side passes', () => {
    const e: Expectation = { low: 0.5, high: 0.8, basis: 'generic', source: 'test', tolerance: { kind: 'absolute', pass: 0, borderline: 0.1 }, badSide: 'both' };
    expect(judge(0.6, e).verdict).toBe('pass');
    expect(judge(0.85, e).verdict).toBe('borderline');
    expect(judge(0.95, e).verdict).toBe('fail');
    expect(judge(0.45, e).verdict).toBe('borderline');
    expect(judge(0.3, e).verdict).toBe('fail');
    const upper: Expectation = { ...e, low: undefined, high: 20, badSide: 'high' };
    expect(judge(0, upper).verdict).toBe('pass');
  });
  it('non-finite values fail, never pass', () => {
    expect(judge(Number.NaN, point(1, 'relative', 0.1, 0.2)).verdict).toBe('fail');
    expect(judge(Infinity, point(1, 'relative', 0.1, 0.2)).verdict).toBe('fail');
  });
});

describe('expected values', () => {
  const kestrel = demoInstruments[0];
  it('RF amplitude from the engine: m/z 69 at r0 4.5 mm, 1 MHz → 100.91 V 0-p (Dawson, Quadrupole Mass Spectrometry and Its Applications, 1976, q = 4eV/(m r0²Ω²); CODATA 2018 constants; computed)', () => {
    const e = expectationFor({ type: type('rf-amplitude'), instrument: kestrel, context: { mz: 69 }, engine: testEngine });
    expect(e?.basis).toBe('calculated');
    expect(e?.value).toBeCloseTo(100.91, 1);
    // A read-back typed as peak-to-peak is halved before judging: 201.8 V p-p passes, 100.9 typed as p-p (convention slip) fails.
    const pp = checkEntry(type('rf-amplitude'), '201.8', 'Vpp-rod', { mz: '69' });
    expect(pp.ok && judge(pp.value, e!).verdict).toBe('pass');
    const slip = checkEntry(type('rf-amplitude'), '100.9', 'Vpp-rod', { mz: '69' });
    expect(slip.ok && judge(slip.value, e!).verdict).toBe('fail');
  });
  it('DC from apex U/V 0.16784: m/z 69 → 16.94 V (Dawson 1976, a = 8eU/(m r0²Ω²) at the apex; computed)', () => {
    const e = expectationFor({ type: type('dc-amplitude'), instrument: kestrel, context: { mz: 69 }, engine: testEngine });
    expect(e?.value).toBeCloseTo(16.94, 1);
  });
  it('without the engine, RF falls back to nothing rather than inventing a value', () => {
    expect(expectationFor({ type: type('rf-amplitude'), instrument: kestrel, context: { mz: 69 } })).toBeUndefined();
  });
  it('the baseline comes first, then the calculation, then the generic range', () => {
    const t = type('multiplier-voltage');
    expect(expectationFor({ type: t, instrument: kestrel, context: {}, baseline: { value: 1500, visitStartedAt: '2025-01-01T00:00:00Z' } })?.basis).toBe('baseline');
    const g = expectationFor({ type: t, instrument: kestrel, context: {} });
    expect(g).toMatchObject({ basis: 'generic', low: 1000, high: 3000 });
    expect(g?.source).toMatch(/common practice/);
  });
  it('generic ranges follow the instrument kind: an RGA at 1e-5 mbar passes, a GC-MS at 1e-3 Torr fails', () => {
    const rga = demoInstruments[2];
    const vh = type('vacuum-high');
    const n2 = { gaugeGas: 'N2-equivalent' };
    expect(judge(1e-3, expectationFor({ type: vh, instrument: rga, context: n2 })!).verdict).toBe('pass');
    expect(judge(1e-3 * PASCAL_PER_TORR, expectationFor({ type: vh, instrument: kestrel, context: n2 })!).verdict).toBe('fail');
    expect(judge(2e-5 * PASCAL_PER_TORR, expectationFor({ type: vh, instrument: kestrel, context: n2 })!).verdict).toBe('pass');
    // The ranges are N2-equivalent: a pressure corrected for helium is not judged by them.
    expect(expectationFor({ type: vh, instrument: kestrel, context: { gaugeGas: 'He' } })).toBeUndefined();
  });
});

describe('catalogue', () => {
  it('has unique ids, a default unit in each list, and sane ranges and tolerances', () => {
    const ids = new Set(catalogue.map((t) => t.id));
    expect(ids.size).toBe(catalogue.length);
    for (const t of catalogue) {
      expect(unitOf(t, t.defaultUnit), t.id).toBeDefined();
      expect(t.plausible.max, t.id).toBeGreaterThan(t.plausible.min);
      expect(t.baselineTolerance.borderline, t.id).toBeGreaterThanOrEqual(t.baselineTolerance.pass);
      for (const k of t.matchContext) expect(t.context.some((c) => c.key === k), `${t.id}.${k}`).toBe(true);
      for (const g of t.generic ?? []) expect(g.source, t.id).toMatch(/common practice|from memory|published|CRC|IUPAC/);
    }
    for (const id of ['vacuum-high', 'vacuum-fore', 'rf-amplitude', 'dc-amplitude', 'rf-frequency', 'multiplier-voltage',
      'emission-current', 'source-temperature', 'peak-width', 'calibrant-ratio', 'calibrant-isotope', 'air-ratio-28-32', 'water-18',
      // Earlier design, still read back from older records and backups:
      'relative-abundance', 'isotope-ratio', 'leak-water-18', 'leak-nitrogen-28', 'leak-ratio-28-32', 'leak-argon-40']) {
      expect(ids.has(id), id).toBe(true);
    }
  });
});

describe('expected RF and DC from the engine itself', () => {
  it('agrees with the worked values: m/z 69 → 100.91 V and 16.94 V; m/z 502 → 734.13 V (r0 4.5 mm, 1 MHz; Dawson 1976 formula with CODATA 2018 constants, computed; ±0.05 %)', async () => {
    const { defaultEngine } = await import('../../../src/records');
    const kestrel = demoInstruments[0];
    const rf69 = expectationFor({ type: type('rf-amplitude'), instrument: kestrel, context: { mz: 69 }, engine: defaultEngine })!.value!;
    const dc69 = expectationFor({ type: type('dc-amplitude'), instrument: kestrel, context: { mz: 69 }, engine: defaultEngine })!.value!;
    const rf502 = expectationFor({ type: type('rf-amplitude'), instrument: kestrel, context: { mz: 502 }, engine: defaultEngine })!.value!;
    expect(Math.abs(rf69 / 100.91 - 1)).toBeLessThan(5e-4);
    expect(Math.abs(dc69 / 16.94 - 1)).toBeLessThan(5e-4);
    expect(Math.abs(rf502 / 734.13 - 1)).toBeLessThan(5e-4);
  });
  it('an m/z the engine refuses gives no calculated value instead of an error', async () => {
    const { defaultEngine } = await import('../../../src/records');
    expect(expectationFor({ type: type('rf-amplitude'), instrument: demoInstruments[0], context: { mz: 1e12 }, engine: defaultEngine })).toBeUndefined();
  });
});

describe('verdict properties (fast-check)', () => {
  it('a reading never gets a better verdict by straying further from the expected value', async () => {
    const fc = (await import('fast-check')).default;
    const rank = { pass: 0, borderline: 1, fail: 3, convention: 2 } as const;
    fc.assert(fc.property(
      fc.double({ min: 1e-6, max: 1e6, noNaN: true }), fc.double({ min: 0, max: 0.5, noNaN: true }), fc.double({ min: 0, max: 0.5, noNaN: true }),
      fc.double({ min: 0, max: 2, noNaN: true }), fc.double({ min: 0, max: 2, noNaN: true }), fc.constantFrom('relative', 'factor'),
      (ref, a, b, d1, d2, kind) => {
        const pass = Math.min(a, b), borderline = Math.max(a, b);
        const tol = kind === 'factor' ? { kind, pass: 1 + pass, borderline: 1 + borderline } as const : { kind, pass, borderline } as const;
        const e: Expectation = { value: ref, basis: 'baseline', source: 'property', tolerance: tol, badSide: 'both' };
        const near = Math.min(d1, d2), far = Math.max(d1, d2);
        for (const sign of [1, -1]) {
          const x1 = kind === 'factor' ? ref * (1 + near) ** sign : ref * (1 + sign * near);
          const x2 = kind === 'factor' ? ref * (1 + far) ** sign : ref * (1 + sign * far);
          if (!(x1 > 0 && x2 > 0) && kind === 'factor') continue;
          if (rank[judge(x2, e).verdict] < rank[judge(x1, e).verdict]) return false;
        }
        return judge(ref, e).verdict === 'pass';
      },
    ), { numRuns: 500, seed: 7 });
  });
});
