// The rebuilt background-gas and calibrant checks: air by the leak tools' peak-ratio method, water against the
// instrument's own baseline, calibrant ions chosen by the engineer, and the instrument's own limit winning.
import { describe, expect, it } from 'vitest';
import {
  assess, calibrantChoices, catalogue, catalogueType, checkEntry, checkMakerLimit, expectationFor, judge, judgeAirSignature,
  judgeWithLimit, limitFor, makerLimitsFrom, readingTitle, sameLimitSlot, startingCalibrantChoice, type EngineFunctions, type Reading, type ReadingType, type Visit,
} from '../../../src/records';
import { airSignalRatios, DRY_AIR_PERCENT, LEAK_BANDS } from '../../../src/engine/leak';
import { isotopeRatioM1 } from '../../../src/spectrum';
import { demoInstruments } from '../../../src/store/demoData';

const type = (id: string): ReadingType => catalogueType(id)!;
const [kestrel, heron, wren] = demoInstruments;
const baselineAt = (value: number) => ({ value, visitStartedAt: '2025-01-01T00:00:00.000Z' });

describe('air is judged by the leak tools’ peak-ratio method, with its source named', () => {
  const air = type('air-ratio-28-32');

  it('dry air itself, N2/O2 = 78.084/20.946 = 3.728 (CRC Handbook, composition of dry air; computed), shows the air signature: fail', () => {
    const ratio = DRY_AIR_PERCENT.nitrogen / DRY_AIR_PERCENT.oxygen;
    expect(ratio).toBeCloseTo(3.728, 3);
    const e = expectationFor({ type: air, instrument: kestrel, context: {} })!;
    expect(e.basis).toBe('air signature');
    expect(e).toMatchObject({ low: LEAK_BANDS.airCore.low, high: LEAK_BANDS.airCore.high });
    expect(e.source).toMatch(/CRC Handbook of Chemistry and Physics, composition of dry air/);
    expect(e.source).toMatch(/peak-ratio method/);
    const j = judge(ratio, e);
    expect(j.verdict).toBe('fail');
    expect(j.summary).toMatch(/air leak is likely/);
  });

  it('with ionisation weighting (28:32 ≈ 3.88, computed from CRC composition and Bayard–Alpert sensitivities) it is still air', () => {
    expect(judgeAirSignature(airSignalRatios().m28ToM32).verdict).toBe('fail');
  });

  it('a ratio outside the air-like band is not air: pass (no preset height limit is involved)', () => {
    expect(judgeAirSignature(1.2)).toMatchObject({ verdict: 'pass' });
    expect(judgeAirSignature(7.5).summary).toMatch(/no air signature/);
  });

  it('air-like but outside the air band is borderline until argon decides (40:28 ≈ 1.7 % for air, computed from CRC values)', () => {
    expect(judgeAirSignature(4.6).verdict).toBe('borderline');
    expect(judgeAirSignature(4.6, 100 * airSignalRatios().m40ToM28).verdict).toBe('fail');
    // Argon far from air's: another gas is mixed in — re-check rather than call it air.
    const mixed = judgeAirSignature(3.8, 12);
    expect(mixed.verdict).toBe('borderline');
    expect(mixed.summary).toMatch(/does not agree/);
  });

  it('the argon typed with the reading travels in its context and is used', () => {
    const entry = checkEntry(air, '3.8', 'ratio', { argonPercent: '15' });
    expect(entry.ok).toBe(true);
    if (!entry.ok) return;
    expect(judge(entry.value, expectationFor({ type: air, context: entry.context })!).verdict).toBe('borderline');
  });

  it('is never judged by distance from a baseline ratio', () => {
    const e = expectationFor({ type: air, instrument: wren, context: {}, baseline: baselineAt(1.2) })!;
    expect(e.basis).toBe('air signature');
  });
});

describe('water is judged against the instrument’s own baseline, with no preset limit', () => {
  const water = type('water-18');

  it('has no generic range or calculation: without a baseline it is recorded unjudged', () => {
    expect(water.generic).toBeUndefined();
    expect(water.computed).toBeUndefined();
    for (const instrument of demoInstruments) expect(expectationFor({ type: water, instrument, context: { referenceMz: 69 } })).toBeUndefined();
  });

  it('against a baseline of 8 %: 10 % passes, 20 % is borderline, 30 % fails, and drier than the baseline passes (factor tolerance ×1.5 / ×3, common practice)', () => {
    const e = expectationFor({ type: water, instrument: kestrel, context: { referenceMz: 69 }, baseline: baselineAt(8) })!;
    expect(e.basis).toBe('baseline');
    expect([10, 20, 30, 2].map((x) => judge(x, e).verdict)).toEqual(['pass', 'borderline', 'fail', 'pass']);
  });

  it('a baseline taken against another reference ion is not compared', () => {
    const visit: Visit = { id: 'v0', instrumentId: kestrel.id, startedAt: '2025-01-01T00:00:00.000Z', site: '', engineer: 'x', reason: 'installation', notes: '', partsUsed: '', baseline: true, createdAt: '', updatedAt: '' };
    const r: Reading = { id: 'r0', visitId: 'v0', instrumentId: kestrel.id, typeId: 'water-18', phase: 'as-left', value: 8, entered: { text: '8', unit: '%' }, context: { referenceMz: 219 }, note: '', takenAt: '2025-01-01T01:00:00.000Z', origin: 'entered' };
    const judged = assess(water, kestrel, 'v1', 30, { referenceMz: 69 }, { visit, readings: [r] }, undefined);
    expect(judged).toEqual({});
    expect(assess(water, kestrel, 'v1', 30, { referenceMz: 219 }, { visit, readings: [r] }, undefined).verdict).toBe('fail');
  });
});

describe('calibrant ions and ratios are chosen by the engineer', () => {
  const ratio = type('calibrant-ratio');
  const isotope = type('calibrant-isotope');
  const engine: EngineFunctions = { rfForMass: () => 0, isotopeM1: (f) => isotopeRatioM1(f) };

  it('there is no preset column set or preset limit: without a baseline a ratio is unjudged', () => {
    expect(ratio.generic).toBeUndefined();
    expect(expectationFor({ type: ratio, instrument: kestrel, context: { mz: 502, referenceMz: 69 } })).toBeUndefined();
    expect(catalogue.filter((t) => t.group !== 'earlier' && /isotope|abundance|calibrant/i.test(t.label)).every((t) => !t.generic)).toBe(true);
  });

  it('a ratio is written out with its ions, chosen by the engineer', () => {
    expect(readingTitle({ typeId: 'calibrant-ratio', context: { mz: 502, referenceMz: 69 } }, ratio)).toBe('m/z 502 as % of m/z 69, chosen by the engineer');
    expect(readingTitle({ typeId: 'calibrant-isotope', context: { mz: 219, formula: 'C4F9' } }, isotope)).toBe('Isotope ratio M+1/M at m/z 219 (C4F9), chosen by the engineer');
  });

  it('against the baseline within ±20 % pass, ±30 % borderline (common practice)', () => {
    const e = expectationFor({ type: ratio, context: { mz: 219, referenceMz: 69 }, baseline: baselineAt(48) })!;
    expect([50, 36, 30].map((x) => judge(x, e).verdict)).toEqual(['pass', 'borderline', 'fail']);
  });

  it('M+1/M from the ion formula: C4F9+ 4.326 %, C9F20N+ 10.10 % (13C 1.07 %, 15N 0.364 %: Rosman and Taylor, Isotopic compositions of the elements 1997, Pure Appl. Chem. 70 (1998) 217; n·x13/x12 + x15/x14, computed)', () => {
    const c4f9 = expectationFor({ type: isotope, context: { mz: 219, formula: 'C4F9' }, engine })!;
    expect(c4f9.basis).toBe('calculated');
    expect(c4f9.value).toBeCloseTo((4 * 0.0107) / 0.9893 * 100, 3);
    expect(c4f9.source).toMatch(/C4F9/);
    const c9 = expectationFor({ type: isotope, context: { mz: 502, formula: 'C9F20N' }, engine })!;
    expect(c9.value).toBeCloseTo(((9 * 0.0107) / 0.9893 + 0.00364 / 0.99636) * 100, 2);
    expect(judge(4.5, c4f9).verdict).toBe('pass');
    expect(judge(6, c4f9).verdict).toBe('fail');
  });

  it('no formula, an unreadable formula, or one that is not the named ion gives no calculated value', () => {
    expect(expectationFor({ type: isotope, context: { mz: 219 }, engine })).toBeUndefined();
    expect(expectationFor({ type: isotope, context: { mz: 219, formula: 'C4F9(' }, engine })).toBeUndefined();
    expect(expectationFor({ type: isotope, context: { mz: 502, formula: 'C4F9' }, engine })).toBeUndefined();
    expect(expectationFor({ type: isotope, context: { mz: 219, formula: 'C4F9' } })).toBeUndefined();
  });

  it('the starting choice comes from the instrument kind; the engineer’s earlier choices replace it', () => {
    expect(startingCalibrantChoice(kestrel.kind).ions.map((i) => i.mz)).toEqual([69, 219, 502]);
    expect(startingCalibrantChoice(heron.kind).ions).toEqual([]);
    expect(startingCalibrantChoice(wren.kind).ions).toEqual([]);
    const mine: Reading = {
      id: 'r1', visitId: 'v1', instrumentId: heron.id, typeId: 'calibrant-ratio', phase: 'as-left', value: 20, entered: { text: '20', unit: '%' },
      context: { mz: 922, referenceMz: 622 }, note: '', takenAt: '2026-01-01T00:00:00.000Z', origin: 'entered',
    };
    const c = calibrantChoices(heron.kind, [mine]);
    expect(c.ions).toEqual([{ mz: 922, referenceMz: 622 }]);
    expect(c.why).toMatch(/chosen by the engineer/);
  });
});

describe('an engineer’s or maker’s limit entered for the instrument wins', () => {
  const limit = (typeId: string, low?: number, high?: number) => ({ typeId, ...(low !== undefined ? { low } : {}), ...(high !== undefined ? { high } : {}), source: 'site method, section 4 (invented for this test)' });

  it('a calibrant ratio outside its baseline drift but inside the entered limit passes, judged by the limit', () => {
    const e = expectationFor({ type: type('calibrant-ratio'), context: { mz: 219, referenceMz: 69 }, baseline: baselineAt(48) });
    expect(judge(30, e!).verdict).toBe('fail');
    const r = judgeWithLimit(30, '%', e, limit('calibrant-ratio', 25, 60))!;
    expect(r.expectation.basis).toBe('maker limit');
    expect(r.judgement.verdict).toBe('pass');
    expect(judgeWithLimit(20, '%', e, limit('calibrant-ratio', 25, 60))!.judgement.verdict).toBe('fail');
  });

  it('water: the limit replaces the baseline comparison', () => {
    const e = expectationFor({ type: type('water-18'), context: { referenceMz: 69 }, baseline: baselineAt(8) });
    expect(judgeWithLimit(30, '%', e, limit('water-18', undefined, 40))!.judgement.verdict).toBe('pass');
  });

  it('air: an entered limit on 28:32 replaces the signature', () => {
    const e = expectationFor({ type: type('air-ratio-28-32'), context: {} });
    const r = judgeWithLimit(3.8, 'ratio', e, limit('air-ratio-28-32', undefined, 10))!;
    expect(r.expectation.basis).toBe('maker limit');
    expect(r.judgement.verdict).toBe('pass');
  });

  it('for other readings the worse of baseline and limit still wins', () => {
    const e = expectationFor({ type: type('multiplier-voltage'), context: {}, baseline: baselineAt(1500) });
    expect(judgeWithLimit(1900, 'V', e, limit('multiplier-voltage', undefined, 2500))!.judgement.verdict).toBe('fail');
  });
});

describe('wording', () => {
  it('no reading name or help names an artefact after one routine', () => {
    const words = /tune (file|report|ion)|autotune|target gain|performance report|domain C\d/i;
    for (const t of catalogue) expect(`${t.label} ${t.help} ${t.context.map((c) => `${c.label} ${c.help ?? ''}`).join(' ')}`, t.id).not.toMatch(words);
  });
});

describe('a limit can be entered for one calibrant ion pair', () => {
  const ratio = catalogueType('calibrant-ratio')!;
  const draft = { typeId: 'calibrant-ratio', unitId: 'percent', low: '2.5', high: '5', source: 'maker’s acceptance sheet, table 2 (invented for this test)' };

  it('is checked, kept with its ions, and found only for readings of those ions; the most specific limit is used', () => {
    const r = checkMakerLimit(ratio, { ...draft, mz: '502', referenceMz: '69' });
    expect(r.ok && r.limit).toEqual({ typeId: 'calibrant-ratio', low: 2.5, high: 5, source: draft.source, match: { mz: '502', referenceMz: '69' } });
    if (!r.ok) return;
    const general = { typeId: 'calibrant-ratio', low: 20, high: 60, source: 'site rule (invented)' };
    expect(limitFor([general, r.limit], 'calibrant-ratio', { mz: 502, referenceMz: 69 })).toBe(r.limit);
    expect(limitFor([general, r.limit], 'calibrant-ratio', { mz: 219, referenceMz: 69 })).toBe(general);
    expect(limitFor([r.limit], 'calibrant-ratio', { mz: 219, referenceMz: 69 })).toBeUndefined();
    expect(sameLimitSlot(r.limit, { typeId: 'calibrant-ratio', match: { referenceMz: '69', mz: '502' } })).toBe(true);
    expect(sameLimitSlot(r.limit, general)).toBe(false);
    expect(makerLimitsFrom([r.limit, { ...general, match: { mz: 5 } }])).toEqual([r.limit]);
  });

  it('refuses ions the type does not match on, and a reference ion without the ion', () => {
    const water = checkMakerLimit(catalogueType('water-18')!, { ...draft, typeId: 'water-18', mz: '18' });
    expect(!water.ok && water.errors.mz).toMatch(/does not apply/);
    const noIon = checkMakerLimit(ratio, { ...draft, referenceMz: '69' });
    expect(!noIon.ok && noIon.errors.mz).toMatch(/For ion m\/z is empty/);
    const bad = checkMakerLimit(ratio, { ...draft, mz: '9000' });
    expect(!bad.ok && bad.errors.mz).toMatch(/between 1 and 5000 u/);
  });
});
