// The one unit table: every pressure conversion in Rodside goes through one Torr, the exact one.
import { describe, expect, it } from 'vitest';
import { convertPressure, PASCAL_PER_TORR as ENGINE_PASCAL_PER_TORR } from '../../../src/engine';
import { catalogueType, convert, formatNumber, PASCAL_PER_TORR, parseNumber, rfAmplitudeUnits, toBase, UNITS, unitOf } from '../../../src/records';

describe('1 Torr = 101325/760 Pa', () => {
  // NIST Special Publication 811, 2008 edition (Thompson and Taylor, "Guide for the Use of the International System
  // of Units"), Appendix B.8: torr (Torr) = 1.333 224 E+02 Pa, the torr being 1/760 of the standard atmosphere,
  // which is 101 325 Pa exactly. Published; the exact ratio is the definition.
  const exact = 101325 / 760;

  it('in the engine, the unit table, the catalogue and the walker’s conversion alike', () => {
    expect(ENGINE_PASCAL_PER_TORR).toBe(exact);
    expect(PASCAL_PER_TORR).toBe(exact);
    expect(UNITS.Torr.factor).toBe(exact);
    expect(unitOf(catalogueType('vacuum-high')!, 'Torr')!.factor).toBe(exact);
    expect(convert(1, 'Torr', 'Pa')).toBe(exact);
    expect(convertPressure(1, 'Torr', 'Pa')).toBe(exact);
  });

  it('agrees with the rounded figure NIST SP 811 (2008) Appendix B.8 prints, 1.333 224 E+02 Pa, to its 7 digits', () => {
    expect(Math.abs(exact - 133.3224)).toBeLessThan(0.00005);
    // The rounded 133.322 Pa some tables give is not what Rodside uses: it is off by 2.8 parts per million.
    expect(UNITS.Torr.factor).not.toBe(133.322);
  });

  it('1 Torr in mbar is 1.333 224 mbar (1 mbar = 100 Pa exactly, NIST SP 811 (2008) B.8: bar = 1 E+05 Pa)', () => {
    expect(convert(1, 'Torr', 'mbar')).toBeCloseTo(1.3332237, 7);
    expect(toBase(unitOf(catalogueType('vacuum-high')!, 'Torr')!, 760)).toBeCloseTo(101325, 9);
  });
});

describe('read-back forms come from the engine’s conventions', () => {
  // For a rod at V cos Ωt: peak-to-peak 2V, rms V/√2, between the pairs twice each (trigonometry; common practice).
  it('p-p, rms and between-pairs factors', () => {
    const f = (id: string) => rfAmplitudeUnits.find((u) => u.id === id)!.factor;
    expect(f('V0p-rod')).toBe(1);
    expect(f('Vpp-rod')).toBe(0.5);
    expect(f('Vrms-rod')).toBeCloseTo(Math.SQRT2, 15);
    expect(f('V0p-pairs')).toBe(0.5);
    expect(f('Vpp-pairs')).toBe(0.25);
    expect(f('Vrms-pairs')).toBeCloseTo(Math.SQRT1_2, 15);
  });
});

describe('one formatter, one parser', () => {
  it('text style for messages and files, screen style for screens; the same cut-offs', () => {
    expect(formatNumber(7.5006e-9)).toBe('7.501e-9');
    expect(formatNumber(900.06)).toBe('900.1');
    expect(formatNumber(1.5e-5, 4, 'screen')).toBe('1.500×10⁻⁵');
    expect(formatNumber(2.5e6, 3, 'screen')).toBe('2.50×10⁶');
    expect(formatNumber(0.005, 4, 'screen')).toBe('0.005');
    expect(formatNumber(Number.NaN)).toBe('—');
  });

  it('reads a decimal comma and exponents, refuses the rest', () => {
    expect(parseNumber(' 4,5 ')).toBe(4.5);
    expect(parseNumber('1e-5')).toBe(1e-5);
    expect(parseNumber('12abc')).toBeNull();
    expect(parseNumber('')).toBeNull();
  });
});
