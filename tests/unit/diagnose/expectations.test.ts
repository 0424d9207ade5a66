import { describe, expect, it } from 'vitest';
import { answer, EXPECTATION_INFO, expectations, start, treeById, type DiagnoseInstrument } from '../../../src/diagnose';

function close(actual: number, expected: number, relTol: number, what: string) {
  const rel = Math.abs(actual - expected) / Math.abs(expected);
  expect(rel, `${what}: got ${actual}, expected ${expected}, relative difference ${rel.toExponential(2)}, tolerance ${relTol}`).toBeLessThanOrEqual(relTol);
}

// Illustrative geometries (not any product): r0 4.5 mm or 4.0 mm at 1 MHz.
function analyser(r0mm: number, fMHz: number, amplitude: DiagnoseInstrument['readbackConvention']['amplitude'] = 'zero-to-peak', reference: DiagnoseInstrument['readbackConvention']['reference'] = 'per-rod'): DiagnoseInstrument {
  return {
    id: 't', name: `r0 ${r0mm} mm, ${fMHz} MHz`, kind: 'gc-ms-single', rodFieldRadius: r0mm * 1e-3, rodLength: 0.15,
    rfFrequency: fMHz * 1e6, maxRfAmplitude: 1600, axialEnergy: 5, readbackConvention: { amplitude, reference },
  };
}

describe('expectations registry', () => {
  it('has a function for every name the checker knows, and no others', () => {
    expect(Object.keys(expectations).sort()).toEqual(Object.keys(EXPECTATION_INFO).sort());
  });

  it('RF at the apex, one rod to ground, zero-to-peak (Dawson 1976 formula, CODATA 2018; computed, ±0.05 %)', () => {
    close(expectations.rfAtMass(analyser(4.5, 1.0), { mz: 69 }).value, 100.91, 5e-4, 'V0p m/z 69, 4.5 mm, 1 MHz');
    close(expectations.rfAtMass(analyser(4.5, 1.0), { mz: 502 }).value, 734.13, 5e-4, 'V0p m/z 502');
    close(expectations.rfAtMass(analyser(4.0, 1.0), { mz: 1000 }).value, 1155.5, 5e-4, 'V0p m/z 1000, 4.0 mm');
  });

  it('shows RF in the instrument read-back convention (conventions of Dawson 1976: p-p on one rod = 2V; between pairs p-p = 4V; rms = V/√2)', () => {
    close(expectations.rfAtMass(analyser(4.5, 1.0, 'peak-to-peak'), { mz: 69 }).value, 201.8, 5e-4, 'p-p per rod (2 × 100.91 V: 201.8 V)');
    close(expectations.rfAtMass(analyser(4.5, 1.0, 'peak-to-peak', 'between-pairs'), { mz: 69 }).value, 4 * 100.91, 5e-4, 'p-p between pairs');
    close(expectations.rfAtMass(analyser(4.5, 1.0, 'rms'), { mz: 69 }).value, 100.91 / Math.SQRT2, 5e-4, 'rms per rod');
    expect(expectations.rfAtMass(analyser(4.5, 1.0, 'peak-to-peak'), { mz: 69 }).basis).toMatch(/peak-to-peak per rod to ground/);
  });

  it('DC at the apex (Dawson 1976, CODATA 2018; computed): 16.94 V (m/z 69, 4.5 mm) and 193.9 V (m/z 1000, 4.0 mm); doubled between the pairs', () => {
    close(expectations.dcAtMass(analyser(4.5, 1.0), { mz: 69 }).value, 16.94, 5e-4, 'U m/z 69');
    close(expectations.dcAtMass(analyser(4.0, 1.0), { mz: 1000 }).value, 193.9, 5e-4, 'U m/z 1000');
    close(expectations.dcAtMass(analyser(4.5, 1.0, 'zero-to-peak', 'between-pairs'), { mz: 69 }).value, 33.88, 5e-4, '2U between pairs');
  });

  it('RF-only cut-off: V0p 500 V, r0 4 mm, 1 MHz → 336.4 u ± 0.1 % (Dawson 1976, q = 0.908; computed)', () => {
    close(expectations.rfOnlyCutoff(analyser(4.0, 1.0), { rf: 500 }).value, 336.4, 1e-3, 'cut-off');
    // The same RF read as peak-to-peak per rod (1000 V) gives the same cut-off.
    close(expectations.rfOnlyCutoff(analyser(4.0, 1.0, 'peak-to-peak'), { rf: 1000 }).value, 336.4, 1e-3, 'cut-off from p-p');
  });

  it('proportional RF needs no geometry: 100.91 V × 502/69 = 734.13 V (Dawson 1976)', () => {
    close(expectations.rfProportional(null, { mzFirst: 69, rfFirst: 100.91, mz: 502 }).value, 734.13, 5e-4, 'V(502)');
  });

  it('top of the mass range from the RF supply: 1600 V at r0 4.5 mm, 1 MHz → 69 × 1600/100.91 ≈ 1094 u (apex scan law scaling, Dawson 1976)', () => {
    close(expectations.topMass(analyser(4.5, 1.0), {}).value, (69 * 1600) / 100.91, 5e-4, 'top m/z');
  });

  it('apparent shift from frequency: δf/f = 1e-4 at m/z 1000 → +0.20 u (Dawson 1976, derived)', () => {
    close(expectations.apparentMassShift(analyser(4.0, 1.0), { mz: 1000, frequency: 1.0001e6 }).value, 0.2, 1e-6, 'δm');
  });

  it('mean free path in air at 1e-5 mbar, 20 °C ≈ 670 cm (Jousten 2016; O\'Hanlon 2003), within 2 %', () => {
    const r = expectations.meanFreePath(analyser(4.5, 1.0), { pressure: 1e-3, temperature: 293.15 });
    close(r.value, 6.7, 0.02, 'λ, m');
    expect(r.low).toBeCloseTo(1.5, 12); // 10 × rod length, the working aim (common practice)
  });

  it('1 mL/min He at 200 L/s reads about 1.5e-5 mbar N2-equivalent (O\'Hanlon 2003; CRC Bayard–Alpert, He 0.18)', () => {
    const r = expectations.gaugeReadingForCarrier(null, { flow: 1e-6 / 60, pumpingSpeed: 0.2, relativeSensitivity: 0.18 });
    close(r.value / 100, 1.52e-5, 0.005, 'indicated, mbar');
    close(r.high! / r.low!, 9, 1e-12, 'band × 1/3 to × 3');
  });

  it('He indicated 1.5e-5 mbar → true 8.33e-5 mbar (CRC Bayard–Alpert relative sensitivity)', () => {
    close(expectations.truePressureFromGauge(null, { reading: 1.5e-3, relativeSensitivity: 0.18 }).value / 100, 8.33e-5, 0.001, 'true, mbar');
  });

  it('rate of rise Q = V·Δp/Δt: 10 L, 1e-3 mbar in 100 s → 1e-4 mbar·L/s (O\'Hanlon 2003)', () => {
    close(expectations.throughputFromRise(null, { volume: 0.01, interval: 100, rise: 0.1 }).value * 10, 1e-4, 1e-12, 'Q, mbar·L/s');
  });

  it('M+1/M for C4F9+ is 4.33 % (IUPAC isotopic compositions, Meija et al., Pure Appl. Chem. 88 (2016) 293; computed)', () => {
    close(expectations.isotopeMPlus1(null, { carbons: 4, nitrogens: 0 }).value, 0.0433, 0.001, '220/219');
    close(expectations.isotopeMPlus1(null, { carbons: 9, nitrogens: 1 }).value, 0.101, 0.005, '503/502');
  });

  it('counting statistics: 10 000 counts → 1 % RSD (Knoll 2010)', () => {
    close(expectations.poissonRsd(null, { counts: 1e4 }).value, 0.01, 1e-12, 'RSD');
  });

  it('names the missing instrument and bad inputs instead of returning NaN', () => {
    expect(() => expectations.rfAtMass(null, { mz: 69 })).toThrow(/rfAtMass needs an instrument/);
    expect(() => expectations.rfAtMass(analyser(4.5, 1.0), { mz: Number.NaN })).toThrow(/mz must be a number between 1 and 10000 u/);
    expect(() => expectations.gaugeReadingForCarrier(null, { flow: 1e-6, pumpingSpeed: 0, relativeSensitivity: 0.18 })).toThrow(/pumpingSpeed/);
  });

  it('in a walk, the RF step on a 4.5 mm, 1 MHz analyser expects 100.91 V at m/z 69 and judges against it', () => {
    const ns = treeById('no-signal');
    let s = start(ns, analyser(4.5, 1.0));
    for (const o of ['nothing', 'no-flow-ok', 'ei']) s = answer(s, ns, { kind: 'option', optionId: o });
    s = answer(s, ns, { kind: 'measure', value: 50, inputs: { setPoint: 50 } });
    s = answer(s, ns, { kind: 'option', optionId: 'plausible' });
    s = answer(s, ns, { kind: 'option', optionId: 'output' });
    s = answer(s, ns, { kind: 'gate', role: 'field-engineer', confirmed: ['live-work', 'meter-rating', 'ppe', 'procedure'] });
    const ok = answer(s, ns, { kind: 'measure', value: 99, inputs: { mz: 69 } });
    close(ok.readings.at(-1)!.expected!, 100.91, 5e-4, 'expected in the reading');
    expect(ok.readings.at(-1)).toMatchObject({ verdict: 'pass', judgedBy: 'expected' });
    expect(ok.nodeId).toBe('NS5b');
    const low = answer(s, ns, { kind: 'measure', value: 60, inputs: { mz: 69 } });
    expect(low.readings.at(-1)).toMatchObject({ verdict: 'fail', side: 'low' });
    expect(low.nodeId).toBe('NS5a-G');
    // Entered in kV: converted before judging.
    expect(answer(s, ns, { kind: 'measure', value: 0.1005, unit: 'kV', inputs: { mz: 69 } }).readings.at(-1)!.verdict).toBe('pass');
  });
});
