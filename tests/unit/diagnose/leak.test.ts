import { describe, expect, it } from 'vitest';
import {
  airCompositionRatios,
  airRatio,
  airSignalRatios,
  DRY_AIR_PERCENT,
  expectedPressure,
  fitOutgassing,
  gasLoad,
  leakIndication,
  rateOfRise,
  type PressureSample,
} from '../../../src/engine/leak';

// Failure messages print input, difference and tolerance.
function close(actual: number, expected: number, relTol: number, what: string) {
  const rel = Math.abs(actual - expected) / Math.abs(expected);
  expect(rel, `${what}: got ${actual}, expected ${expected}, relative difference ${rel.toExponential(2)}, tolerance ${relTol}`).toBeLessThanOrEqual(relTol);
}

describe('dry-air ratios', () => {
  it('N2/O2 of dry air is 3.728 (CRC Handbook of Chemistry and Physics, composition of dry air; U.S. Standard Atmosphere 1976)', () => {
    close(airRatio(78.084, 20.946), 3.728, 1e-4, 'airRatio(78.084, 20.946)');
    close(airCompositionRatios().nitrogenToOxygen, 3.728, 1e-4, 'composition N2/O2');
  });
  it('Ar/N2 of dry air is 0.0120 (CRC / USSA 1976, computed)', () => {
    close(airCompositionRatios().argonToNitrogen, 0.01196, 1e-3, 'Ar/N2');
  });
  it('signal ratios weighted by Bayard–Alpert sensitivities: 28:32 ≈ 3.9, 40:28 ≈ 1.7 % (CRC Handbook Bayard–Alpert relative sensitivities; computed)', () => {
    close(airSignalRatios().m28ToM32, 3.88, 0.005, '28:32 weighted');
    close(airSignalRatios().m40ToM28, 0.0167, 0.01, '40:28 weighted');
  });
  it('rejects percentages outside 0–100 with the field named', () => {
    expect(() => airRatio(0, 20)).toThrow(/numeratorPercent/);
    expect(() => airRatio(78, 120)).toThrow(/denominatorPercent = 120 is out of range; accepted: finite number > 0 % and ≤ 100 %/);
  });
});

describe('leakIndication', () => {
  // Synthetic spectra built from dry-air composition (CRC / USSA 1976) and CRC Bayard–Alpert sensitivities.
  const air = { m18: 10, m28: 1000, m32: 1000 / 3.88, m40: 16.7, m44: 0.5 };

  it('calls air for 28:32 in the 3.7–4 band with argon at about 1.7 % of 28 (common practice)', () => {
    const r = leakIndication(air);
    expect(r.indication).toBe('air-leak');
    expect(r.dominantMz).toBe(28);
    const used = r.ratios.find((x) => x.name === '28:32')!;
    close(used.measured!, 3.88, 1e-9, '28:32');
    expect(used.inBand).toBe(true);
    expect(used.source).toMatch(/common practice/);
  });
  it('still calls air in the wide 3–5 band (from memory) and says why', () => {
    const r = leakIndication({ ...air, m32: 1000 / 4.6 });
    expect(r.indication).toBe('air-leak');
    expect(r.reasons.join(' ')).toMatch(/wide air-like band/);
  });
  it('m/z 28 with almost no 32 is CO or N2, not air', () => {
    expect(leakIndication({ m18: 50, m28: 1000, m32: 20, m40: 0.5, m44: 30 }).indication).toBe('outgassing-or-co');
    expect(leakIndication({ m28: 1000, m32: 0 }).indication).toBe('outgassing-or-co');
  });
  it('too much 32 for air (28:32 < 3) is not air', () => {
    expect(leakIndication({ m28: 1000, m32: 500, m40: 15 }).indication).toBe('not-air');
  });
  it('air-like 28:32 with far too much argon is not called air', () => {
    expect(leakIndication({ m28: 1000, m32: 260, m40: 400 }).indication).toBe('not-air');
  });
  it('water dominant after a vent, with 17:18 checked against 20–26 % (from memory)', () => {
    const r = leakIndication({ m17: 230, m18: 1000, m28: 120, m32: 30, m40: 2, m44: 5 });
    expect(r.indication).toBe('water-after-venting');
    expect(r.ratios.find((x) => x.name === '17:18')!.inBand).toBe(true);
  });
  it('large 44 is carbon dioxide', () => {
    expect(leakIndication({ m18: 50, m28: 200, m32: 20, m44: 1000 }).indication).toBe('carbon-dioxide');
    expect(leakIndication({ m28: 1000, m32: 250, m44: 600 }).indication).toBe('carbon-dioxide');
  });
  it('helium tracer: m/z 4 doubling over its background means the joint leaks', () => {
    expect(leakIndication({ ...air, m4: 50 }, 10).indication).toBe('helium-tracer');
    const none = leakIndication({ ...air, m4: 11 }, 10);
    expect(none.indication).toBe('air-leak');
    expect(none.reasons[0]).toMatch(/did not rise/);
  });
  it('rejects bad heights with the field named', () => {
    expect(() => leakIndication({ m28: -1, m32: 1 })).toThrow(/m28/);
    expect(() => leakIndication({ m28: 1, m32: Number.NaN })).toThrow(/m32/);
    expect(() => leakIndication({ m28: 0, m32: 0 })).toThrow(/peaks.*at least one/);
  });
});

describe('rateOfRise', () => {
  it("rate of rise Q = V·Δp/Δt: V = 10 L, Δp = 1e-3 mbar in 100 s → Q = 1e-4 mbar·L/s = 1e-5 Pa·m³/s (O'Hanlon 2003)", () => {
    const r = rateOfRise(0.01, [{ t: 0, p: 0.01 }, { t: 100, p: 0.11 }]);
    close(r.throughput, 1e-5, 1e-12, 'Q');
    expect(r.shape).toBe('unclear');
  });
  it('a straight-line rise is judged linear (leak)', () => {
    const s: PressureSample[] = Array.from({ length: 11 }, (_, i) => ({ t: 10 * i, p: 0.01 + 0.001 * 10 * i }));
    const r = rateOfRise(0.01, s);
    expect(r.shape).toBe('linear');
    close(r.slopeRatio!, 1, 1e-9, 'slope ratio');
  });
  it('a rise that levels off exponentially is judged levelling (outgassing or virtual leak)', () => {
    const s: PressureSample[] = Array.from({ length: 11 }, (_, i) => ({ t: 30 * i, p: 0.01 + 0.1 * (1 - Math.exp(-(30 * i) / 60)) }));
    expect(rateOfRise(0.01, s).shape).toBe('levelling');
  });
  it('rejects bad input with the field and range named', () => {
    expect(() => rateOfRise(0, [{ t: 0, p: 1 }, { t: 1, p: 2 }])).toThrow(/volume = 0 is out of range; accepted: finite number > 0 m³/);
    expect(() => rateOfRise(1, [{ t: 0, p: 1 }])).toThrow(/samples.length = 1 is out of range; accepted: at least 2 samples/);
    expect(() => rateOfRise(1, [{ t: 5, p: 1 }, { t: 5, p: 2 }])).toThrow(/samples\[1\]\.t = 5 is out of range; accepted: later than/);
    expect(() => rateOfRise(1, [{ t: 0, p: -1 }, { t: 5, p: 2 }])).toThrow(/samples\[0\]\.p/);
  });
});

describe('fitOutgassing', () => {
  it('recovers known A and B exactly from synthetic p = A/t + B (closed-form least squares in 1/t)', () => {
    const A = 0.36, B = 2e-4; // Pa·s, Pa
    const s = [60, 300, 900, 3600, 7200, 14400].map((t) => ({ t, p: A / t + B }));
    const f = fitOutgassing(s);
    close(f.A, A, 1e-9, 'A');
    close(f.B, B, 1e-9, 'B');
    close(f.rSquared, 1, 1e-12, 'R²');
    expect(f.residualRms).toBeLessThan(1e-15);
  });
  it('with a ±2 % deterministic ripple the fit still lands within a few per cent', () => {
    const A = 0.5, B = 1e-3;
    const s = [100, 200, 400, 800, 1600, 3200, 6400, 12800].map((t, i) => ({ t, p: (A / t + B) * (1 + 0.02 * (i % 2 ? 1 : -1)) }));
    const f = fitOutgassing(s);
    close(f.A, A, 0.05, 'A');
    close(f.B, B, 0.1, 'B');
  });
  it('judges a large floor as leak, pure 1/t as outgassing', () => {
    expect(fitOutgassing([100, 1000, 10000].map((t) => ({ t, p: 1 / t + 1e-3 }))).judgement).toBe('leak-floor');
    expect(fitOutgassing([100, 1000, 10000].map((t) => ({ t, p: 1 / t }))).judgement).toBe('outgassing');
  });
  it('flags a series that is not A/t + B', () => {
    expect(fitOutgassing([100, 200, 300, 400, 500].map((t, i) => ({ t, p: i % 2 ? 1 : 0.01 }))).judgement).toBe('poor-fit');
  });
  it('rejects t = 0 and too few samples', () => {
    expect(() => fitOutgassing([{ t: 0, p: 1 }, { t: 1, p: 1 }, { t: 2, p: 1 }])).toThrow(/samples\[0\]\.t = 0 is out of range/);
    expect(() => fitOutgassing([{ t: 1, p: 1 }, { t: 2, p: 1 }])).toThrow(/at least 3 samples/);
  });
});

describe('gas load and expected pressure', () => {
  it('1 mL/min at 101.325 kPa = 0.016887 mbar·L/s (common practice reference conditions; computed from SI units)', () => {
    const q = gasLoad(1e-6 / 60); // Pa·m³/s
    close(q * 10, 0.016887, 1e-4, 'gas load, mbar·L/s');
  });
  it("p = Q/S_eff: 1 mL/min He at S_eff 200 L/s → 8.4e-5 mbar (O'Hanlon 2003; computed)", () => {
    const p = expectedPressure(gasLoad(1e-6 / 60), 0.2);
    close(p / 100, 8.44e-5, 0.002, 'p, mbar');
  });
  it('series conductance lowers S_eff: 1/S_eff = 1/S + 1/C', () => {
    close(expectedPressure(1e-3, 0.2, 0.2), 1e-3 / 0.1, 1e-12, 'p with C = S');
  });
  it('dry-air constants are the CRC / USSA 1976 values', () => {
    expect(DRY_AIR_PERCENT).toEqual({ nitrogen: 78.084, oxygen: 20.946, argon: 0.934 });
  });
  it('rejects bad speeds and conductances', () => {
    expect(() => expectedPressure(1, 0)).toThrow(/pumpingSpeed = 0 is out of range/);
    expect(() => expectedPressure(1, 0.1, -1)).toThrow(/conductance = -1 is out of range/);
  });
});
