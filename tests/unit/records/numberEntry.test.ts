// The one number-entry rule and the convention-slip verdict (pure records logic).
import { describe, expect, it } from 'vitest';
import {
  catalogue, catalogueType, checkEntry, checkTyped, factorWords, peakHeightSpec, rfConventionSuspects, specForMeasure,
  specForUnit, withConventionCheck, expectationFor, judgeWithLimit, defaultEngine, readTyped, splitNumberList, LIST_RULE_WORDS, type InstrumentProfile,
} from '../../../src/records';
import { convertRf } from '../../../src/engine';

describe('number entry: read, range, message', () => {
  it('reads exponents, ×10ⁿ, a typographic minus and unit prefixes where the unit allows', () => {
    expect(readTyped('2.5e-5')).toEqual({ value: 2.5e-5 });
    expect(readTyped('2,5×10^-5')).toEqual({ value: 2.5e-5 });
    expect(readTyped('−5')).toEqual({ value: -5 });
    expect(readTyped('500m', true)).toEqual({ value: 0.5 });
    expect(readTyped('2.5k', true)).toEqual({ value: 2500 });
    expect((readTyped('12µ', true) as { value: number }).value).toBeCloseTo(12e-6, 18);
    // No prefixes where the unit takes none: "5m" is not a pressure.
    expect(readTyped('5m', false)).toEqual({ problem: 'not-a-number' });
  });
  it('refuses 1e308 and −5 for a pressure, naming the field and the limit in the unit on screen', () => {
    const spec = specForMeasure('Analyser pressure (as found)', 'mbar', catalogueType('vacuum-high'));
    const big = checkTyped('1e308', spec);
    expect(big.ok).toBe(false);
    expect(!big.ok && big.message).toBe('Analyser pressure (as found) must be between 1e-12 and 1200 mbar; 1e308 mbar is above that.');
    const neg = checkTyped('-5', spec);
    expect(!neg.ok && neg.message).toBe('Analyser pressure (as found) must be between 1e-12 and 1200 mbar; -5 mbar is below that.');
    expect(checkTyped('2.5e-5', spec)).toEqual({ ok: true, value: 2.5e-5 });
    // Torr: the limit follows the unit on screen (1.2e5 Pa = 900.08 Torr, 1 Torr = 101325/760 Pa exactly, ISO 80000-4 / BIPM SI brochure).
    const torr = checkTyped('1e308', specForMeasure('Pressure', 'Torr', catalogueType('vacuum-high')));
    expect(!torr.ok && torr.message).toMatch(/between 7\.501e-13 and 900\.1 Torr/);
  });
  it('a pressure without a reading type is positive: 0 is refused, "more than 0"', () => {
    const spec = specForUnit('Rough-pump blank-off pressure', 'mbar');
    const zero = checkTyped('0', spec);
    expect(!zero.ok && zero.message).toBe('Rough-pump blank-off pressure must be more than 0 and at most 1200 mbar; 0 mbar is below that.');
  });
  it('peak heights: not negative, not 1e308; words name the field', () => {
    const a = checkTyped('1e308', peakHeightSpec('height at m/z 28'));
    expect(!a.ok && a.message).toBe('Height at m/z 28 must be between 0 and 1e15; 1e308 is above that.');
    const b = checkTyped('-5', peakHeightSpec('height at m/z 28'));
    expect(!b.ok && b.message).toMatch(/^Height at m\/z 28 must be between 0 and 1e15; -5 is below that\.$/);
  });
  it('text that is not a number, and a number too large for a double, get the range too', () => {
    const spec = specForUnit('Isolated volume', 'L');
    const t = checkTyped('abc', spec);
    expect(!t.ok && t.message).toMatch(/^Isolated volume must be a number more than 0 and at most 100000 L, written like 2\.5 or 2\.5e-5; “abc” is not a number\.$/);
    const inf = checkTyped('1e999', spec);
    expect(!inf.ok && inf.problem).toBe('out-of-range');
  });
  it('every catalogue reading type states the source or class of its plausible range', () => {
    for (const t of catalogue) {
      expect(t.plausible.source, t.id).toMatch(/\w{4,}/);
      expect(t.plausible.min, t.id).toBeLessThan(t.plausible.max);
    }
  });
  it('the visit form uses the same rule: 1e308 mbar refused with the same words', () => {
    const r = checkEntry(catalogueType('vacuum-high')!, '1e308', 'mbar', { gaugeGas: 'N2-equivalent' });
    expect(!r.ok && r.errors.value).toBe('High vacuum (analyser) must be between 1e-12 and 1200 mbar; 1e308 mbar is above that.');
  });
});

describe('convention slips', () => {
  it('names the factors between conventions', () => {
    expect(factorWords(2)).toBe('2');
    expect(factorWords(Math.SQRT2)).toBe('√2');
    expect(factorWords(2 * Math.SQRT2)).toBe('2√2');
    expect(factorWords(0.5)).toBe('1/2');
  });
  it('a zero-to-peak reading typed as peak-to-peak is explained by zero-to-peak (factor 2), and only by it', () => {
    // Expected 229.6 V p-p per rod; the meter read 114.8 V zero-to-peak (p-p = 2 × 0-p for a sine; Dawson 1976).
    const passes = (v: number) => Math.abs(v - 229.6) / 229.6 <= 0.05;
    const s = rfConventionSuspects(114.8, 'peakToPeakPerRod', passes);
    expect(s.map((x) => x.form)).toEqual(['zeroToPeakPerRod']);
    expect(s[0].valueInChosen).toBeCloseTo(229.6, 10);
    // √2: an rms reading of the same RF (229.6/2/√2 = 81.17 V) points at rms, one rod.
    expect(rfConventionSuspects(229.6 / 2 / Math.SQRT2, 'peakToPeakPerRod', passes).map((x) => x.form)).toEqual(['rmsPerRod']);
    // A reading that no convention explains gets no suspect.
    expect(rfConventionSuspects(150, 'peakToPeakPerRod', passes)).toEqual([]);
  });

  const heron: InstrumentProfile = {
    id: 'i', name: 'test', kind: 'lc-ms-triple', rodFieldRadius: 4e-3, rodLength: 0.2, rfFrequency: 1.1e6, maxRfAmplitude: 5000, axialEnergy: 5,
    readbackConvention: { amplitude: 'peak-to-peak', reference: 'per-rod' }, notes: '', createdAt: '', updatedAt: '',
  };
  it('the visit log judges a factor-of-2 RF reading "check the convention", with the convention that would pass', () => {
    const type = catalogueType('rf-amplitude')!;
    const e = expectationFor({ type, instrument: heron, context: { mz: 219 }, engine: defaultEngine })!;
    const v0p = e.value!; // V zero-to-peak per rod, the engine's convention
    const ppTyped = convertRf(v0p, 'zeroToPeakPerRod', 'zeroToPeakPerRod'); // a 0-p figure typed as if p-p
    const unitLabel = type.units.find((u) => u.id === 'Vpp-rod')!.label;
    const base = ppTyped / 2; // what the store keeps when the figure is read as p-p
    const plain = judgeWithLimit(base, type.baseUnit, e, undefined);
    expect(plain?.judgement.verdict).toBe('fail');
    const r = withConventionCheck(type, unitLabel, base, plain)!;
    expect(r.judgement.verdict).toBe('convention');
    expect(r.judgement.summary).toMatch(/read as zero-to-peak, one rod to ground it would pass/);
    // The same figure typed in the right unit passes and is left alone.
    const ok = judgeWithLimit(v0p, type.baseUnit, e, undefined);
    expect(withConventionCheck(type, 'V0p-rod', v0p, ok)?.judgement.verdict).toBe('pass');
    // DC between the pairs typed as per pair: factor 2.
    const dc = catalogueType('dc-amplitude')!;
    const ed = expectationFor({ type: dc, instrument: heron, context: { mz: 219 }, engine: defaultEngine })!;
    const dcr = withConventionCheck(dc, 'V-rod', ed.value! * 2, judgeWithLimit(ed.value! * 2, dc.baseUnit, ed, undefined));
    expect(dcr?.judgement.verdict).toBe('convention');
    expect(dcr?.judgement.summary).toMatch(/between the rod pairs/);
  });
});

describe('lists of numbers: one rule for comma, semicolon and space', () => {
  it('a comma between digits with one or two digits after it is a decimal comma; otherwise it separates', () => {
    expect(splitNumberList('219,5')).toEqual(['219.5']);
    expect(splitNumberList('219,25; 69')).toEqual(['219.25', '69']);
    expect(splitNumberList('69,219,502')).toEqual(['69', '219', '502']);
    expect(splitNumberList('69, 219, 502')).toEqual(['69', '219', '502']);
    expect(splitNumberList('69 219;502')).toEqual(['69', '219', '502']);
    expect(splitNumberList('219,5 502,1')).toEqual(['219.5', '502.1']);
    expect(LIST_RULE_WORDS).toMatch(/219,5 is 219\.5; 69,219 is two values/);
  });
});
