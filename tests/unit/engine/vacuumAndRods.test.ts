import { describe, expect, it } from 'vitest';
import {
  convertPressure,
  fieldRadiusForRods,
  GAS_PRESETS,
  ionGaugeIndicated,
  ionGaugeTruePressure,
  ionMeanFreePath,
  meanFreePath,
  meanFreePathForGas,
  roundRodRadius,
  scatteringAlongRods,
  unscatteredFraction,
} from '../../../src/engine/index';
import { expectClose } from './close';

describe('mean free path', () => {
  it('λ = k_B T/(√2 π d² p) (kinetic theory; O’Hanlon 2003) with CODATA k_B', () => {
    const value = meanFreePath({ pressure: 1, temperature: 300, diameter: 3.75e-10 });
    expectClose(value, (1.380649e-23 * 300) / (Math.SQRT2 * Math.PI * 3.75e-10 ** 2), 1e-15, 'λ', 'relative');
    expectClose(meanFreePath({ pressure: 2, temperature: 300, diameter: 3.75e-10 }), value / 2, 1e-15, '1/p', 'relative');
  });
  it('air at 20 °C, 1e-5 mbar → λ ≈ 670 cm (Jousten, Handbook of Vacuum Technology, 2nd ed., 2016; O’Hanlon, A User’s Guide to Vacuum Technology, 3rd ed., 2003) within 2 %', () => {
    const pa = convertPressure(1e-5, 'mbar', 'Pa');
    expectClose(meanFreePathForGas({ gas: 'air', pressure: pa, temperature: 293.15 }), 6.7, 0.02, 'λ air', 'relative');
  });
  it('rule of thumb λ[cm] ≈ 5×10⁻³/p[Torr] for air at room temperature (common practice) within 3 %', () => {
    const pa = convertPressure(1e-5, 'Torr', 'Pa');
    expectClose(meanFreePathForGas({ gas: 'air', pressure: pa, temperature: 295 }) * 100, 5e-3 / 1e-5, 0.03, 'λ cm', 'relative');
  });
  it('presets carry their source and class; helium has the longest path, water the shortest', () => {
    for (const preset of Object.values(GAS_PRESETS)) expect(preset.source).toMatch(/from memory|common practice/);
    const at = (gas: keyof typeof GAS_PRESETS) => meanFreePathForGas({ gas, pressure: 1e-3, temperature: 293 });
    expect(at('He')).toBeGreaterThan(at('Ar'));
    expect(at('N2')).toBeGreaterThan(at('H2O'));
  });
  it('ions: λ = k_B T/(p σ) (O’Hanlon 2003; computed) at 1e-5 mbar, 293 K: σ 50 Å² → 8.1 m, 3.6 % lost over 0.3 m; 300 Å² → 1.35 m, 20 %', () => {
    const small = ionMeanFreePath({ pressure: 1e-3, temperature: 293, crossSection: 50e-20 });
    const large = ionMeanFreePath({ pressure: 1e-3, temperature: 293, crossSection: 300e-20 });
    expectClose(small, 8.1, 0.01, 'λ small ion', 'relative');
    expectClose(large, 1.35, 0.01, 'λ large ion', 'relative');
    expectClose(1 - unscatteredFraction({ pathLength: 0.3, meanFreePath: small }), 0.036, 0.02, 'loss small', 'relative');
    expectClose(1 - unscatteredFraction({ pathLength: 0.3, meanFreePath: large }), 0.2, 0.02, 'loss large', 'relative');
  });
  it('scattering along the rods: λ/L and exp(−L/λ)', () => {
    const r = scatteringAlongRods({ gas: 'N2', pressure: 1e-3, temperature: 293, rodLength: 0.2 });
    expectClose(r.ratioToRodLength, r.meanFreePath / 0.2, 1e-15, 'λ/L', 'relative');
    expectClose(r.unscatteredFraction, Math.exp(-0.2 / r.meanFreePath), 1e-15, 'fraction', 'relative');
    expect(unscatteredFraction({ pathLength: 0, meanFreePath: 1 })).toBe(1);
  });
});

describe('pressure units (NIST SP 811, 2008; CODATA 2018)', () => {
  it('1 Torr = 133.322 Pa = 1.33322 mbar; round trips', () => {
    expectClose(convertPressure(1, 'Torr', 'Pa'), 133.322, 1e-5, 'Torr→Pa', 'relative');
    expectClose(convertPressure(1, 'Torr', 'mbar'), 1.33322, 1e-5, 'Torr→mbar', 'relative');
    expect(convertPressure(3, 'mbar', 'Pa')).toBe(300);
    expectClose(convertPressure(convertPressure(7.5e-6, 'Torr', 'mbar'), 'mbar', 'Torr'), 7.5e-6, 1e-15, 'round trip', 'relative');
  });
});

describe('ion-gauge gas correction (CRC Handbook of Chemistry and Physics, Bayard–Alpert relative sensitivities)', () => {
  it('He indicated 1.5e-5 mbar → true 8.33e-5 mbar', () => {
    expectClose(ionGaugeTruePressure({ indicated: 1.5e-5, gas: 'He' }), 8.33e-5, 1e-3, 'He', 'relative');
  });
  it('8.4e-5 mbar of He reads about 1.5e-5 mbar (He 0.18, CRC Bayard–Alpert table; computed)', () => {
    expectClose(ionGaugeIndicated({ truePressure: 8.4e-5, gas: 'He' }), 1.5e-5, 0.02, 'He reading', 'relative');
    expect(ionGaugeTruePressure({ indicated: 2e-6, gas: 'N2' })).toBe(2e-6);
    expectClose(ionGaugeTruePressure({ indicated: 1.4e-6, gas: 'Ar' }), 1e-6, 1e-12, 'Ar', 'relative');
  });
});

describe('round rods (Douglas & Konenkov, Rapid Commun. Mass Spectrom. 2002)', () => {
  it('r ≈ 1.13 r0 best peak shape; 1.14511 r0 cancels the dodecapole term; each with its source', () => {
    const best = roundRodRadius({ r0: 4e-3 });
    expectClose(best.radius, 4.52e-3, 1e-12, 'best', 'relative');
    expect(best.source).toMatch(/Douglas/);
    const noTwelve = roundRodRadius({ r0: 4e-3, choice: 'noDodecapole' });
    expectClose(noTwelve.ratio, 1.1451, 1e-4, 'dodecapole ratio (Douglas & Konenkov 2002: 1.1451)', 'relative');
    expectClose(fieldRadiusForRods({ rodRadius: noTwelve.radius, choice: 'noDodecapole' }), 4e-3, 1e-15, 'inverse', 'relative');
  });
});
