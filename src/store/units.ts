// Units a reading can be typed in, and their exact conversions to the reading type's base unit.
// Pure: shared by the form, the store and the importer.

/** A unit of entry: base = typed · factor + offset. Plain data so user-defined types can be stored. */
export interface UnitDef {
  id: string;
  label: string;
  factor: number;
  offset?: number;
}

/**
 * 1 Torr = 101325/760 Pa exactly (the Torr is defined as 1/760 of a standard atmosphere, 101 325 Pa):
 * 133.322 368 421… Pa. NIST SP 811 (2008) Appendix B.8 lists 1.333 224 E+02 Pa; CODATA 2018 fixes the atmosphere.
 */
export const PASCAL_PER_TORR = 101325 / 760;
/** 1 mbar = 100 Pa exactly (NIST SP 811 B.8: 1 bar = 1 E+05 Pa). */
export const PASCAL_PER_MBAR = 100;

export const pressureUnits: readonly UnitDef[] = [
  { id: 'mbar', label: 'mbar', factor: PASCAL_PER_MBAR },
  { id: 'Torr', label: 'Torr', factor: PASCAL_PER_TORR },
  { id: 'Pa', label: 'Pa', factor: 1 },
];

/**
 * RF amplitude. Base: V zero-to-peak, one rod to ground (the engine's convention). For a rod at ±V cos Ωt:
 * one rod p-p = 2V, rms = V/√2; between the pairs the swing is doubled (0-p 2V, p-p 4V, rms √2·V).
 */
export const rfAmplitudeUnits: readonly UnitDef[] = [
  { id: 'V0p-rod', label: 'V zero-to-peak, one rod to ground', factor: 1 },
  { id: 'Vpp-rod', label: 'V peak-to-peak, one rod to ground', factor: 1 / 2 },
  { id: 'Vrms-rod', label: 'V rms, one rod to ground', factor: Math.SQRT2 },
  { id: 'V0p-pairs', label: 'V zero-to-peak, between the rod pairs', factor: 1 / 2 },
  { id: 'Vpp-pairs', label: 'V peak-to-peak, between the rod pairs', factor: 1 / 4 },
  { id: 'Vrms-pairs', label: 'V rms, between the rod pairs', factor: 1 / Math.SQRT2 },
];

/** DC. Base: V on one rod pair to ground; between the pairs the difference is twice that. */
export const dcUnits: readonly UnitDef[] = [
  { id: 'V-rod', label: 'V, one rod pair to ground', factor: 1 },
  { id: 'V-pairs', label: 'V, between the rod pairs', factor: 1 / 2 },
];

export const frequencyUnits: readonly UnitDef[] = [
  { id: 'MHz', label: 'MHz', factor: 1e6 },
  { id: 'kHz', label: 'kHz', factor: 1e3 },
  { id: 'Hz', label: 'Hz', factor: 1 },
];

export const voltageUnits: readonly UnitDef[] = [
  { id: 'V', label: 'V', factor: 1 },
  { id: 'kV', label: 'kV', factor: 1e3 },
];

export const currentUnits: readonly UnitDef[] = [
  { id: 'uA', label: 'µA', factor: 1e-6 },
  { id: 'mA', label: 'mA', factor: 1e-3 },
  { id: 'A', label: 'A', factor: 1 },
];

/** Temperature. Base °C (what every read-back shows); K and °F accepted. */
export const temperatureUnits: readonly UnitDef[] = [
  { id: 'degC', label: '°C', factor: 1 },
  { id: 'K', label: 'K', factor: 1, offset: -273.15 },
  { id: 'degF', label: '°F', factor: 5 / 9, offset: -32 * (5 / 9) },
];

export const massUnits: readonly UnitDef[] = [{ id: 'u', label: 'u', factor: 1 }];
export const percentUnits: readonly UnitDef[] = [
  { id: 'percent', label: '%', factor: 1 },
  { id: 'fraction', label: 'fraction (1 = 100 %)', factor: 100 },
];
export const ratioUnits: readonly UnitDef[] = [{ id: 'ratio', label: 'ratio', factor: 1 }];

export function toBase(unit: UnitDef, typed: number): number {
  return typed * unit.factor + (unit.offset ?? 0);
}

export function fromBase(unit: UnitDef, base: number): number {
  return (base - (unit.offset ?? 0)) / unit.factor;
}

/** A number for messages and screens: up to 4 significant figures, exponent form for very small or large values. */
export function formatNumber(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a < 1e-3 || a >= 1e6) {
    const [m, e] = x.toExponential(digits - 1).split('e');
    return `${String(Number(m))}e${e.startsWith('+') ? e.slice(1) : e}`;
  }
  return String(Number(x.toPrecision(digits)));
}
