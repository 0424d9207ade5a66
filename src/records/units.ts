// The one unit table, and the units a reading can be typed in. Pure: shared by the forms, the store, the
// importer and the diagnosis walker. Pressure factors come from the engine's constants (1 Torr = 101325/760 Pa
// exactly, 1 mbar = 100 Pa); the RF and DC read-back forms come from the engine's voltage conventions.
import { PASCAL_PER_MBAR, PASCAL_PER_TORR } from '../engine/constants';
import { convertDc, convertRf, RF_FORMS, type DcForm, type RfForm } from '../engine/voltageConventions';
import { rfFormWords } from './conventions';

export { PASCAL_PER_MBAR, PASCAL_PER_TORR };

/** A unit symbol: value in `si` = value × factor. */
export interface UnitInfo {
  si: string;
  factor: number;
}

/**
 * Every unit symbol Rodside reads or shows, with its SI unit and factor. Temperatures: K is absolute, °C is its
 * own scale here (the one offset conversion, K and °F into °C, lives in temperatureUnits below).
 */
export const UNITS: Record<string, UnitInfo> = {
  // pressure
  Pa: { si: 'Pa', factor: 1 },
  mbar: { si: 'Pa', factor: PASCAL_PER_MBAR },
  Torr: { si: 'Pa', factor: PASCAL_PER_TORR },
  // voltage
  V: { si: 'V', factor: 1 },
  kV: { si: 'V', factor: 1000 },
  // current
  A: { si: 'A', factor: 1 },
  mA: { si: 'A', factor: 1e-3 },
  'µA': { si: 'A', factor: 1e-6 },
  // resistance
  'Ω': { si: 'Ω', factor: 1 },
  'MΩ': { si: 'Ω', factor: 1e6 },
  // frequency
  Hz: { si: 'Hz', factor: 1 },
  kHz: { si: 'Hz', factor: 1e3 },
  MHz: { si: 'Hz', factor: 1e6 },
  // length
  m: { si: 'm', factor: 1 },
  cm: { si: 'm', factor: 1e-2 },
  mm: { si: 'm', factor: 1e-3 },
  // mass-to-charge and mass difference
  u: { si: 'u', factor: 1 },
  // temperature (differences and absolute in K; °C is its own scale, see temperatureUnits)
  K: { si: 'K', factor: 1 },
  // volume and flow
  'm³': { si: 'm³', factor: 1 },
  L: { si: 'm³', factor: 1e-3 },
  'L/s': { si: 'm³/s', factor: 1e-3 },
  'm³/s': { si: 'm³/s', factor: 1 },
  'mL/min': { si: 'm³/s', factor: 1e-6 / 60 },
  'µL/min': { si: 'm³/s', factor: 1e-9 / 60 },
  // throughput
  'Pa·m³/s': { si: 'Pa·m³/s', factor: 1 },
  'mbar·L/s': { si: 'Pa·m³/s', factor: 0.1 },
  // time
  s: { si: 's', factor: 1 },
  min: { si: 's', factor: 60 },
  h: { si: 's', factor: 3600 },
  // dimensionless
  '1': { si: '1', factor: 1 },
  '%': { si: '1', factor: 0.01 },
  counts: { si: 'counts', factor: 1 },
  'counts/s': { si: 'counts/s', factor: 1 },
  '°C': { si: '°C', factor: 1 },
  eV: { si: 'eV', factor: 1 },
};

export function unitKnown(unit: string): boolean {
  return Object.prototype.hasOwnProperty.call(UNITS, unit);
}

/** True when both units measure the same dimension. */
export function sameDimension(a: string, b: string): boolean {
  return unitKnown(a) && unitKnown(b) && UNITS[a].si === UNITS[b].si;
}

export function toSI(value: number, unit: string): number {
  const u = UNITS[unit];
  if (!u) throw new RangeError(`unit must be one of ${Object.keys(UNITS).join(', ')}; got ${unit}`);
  return value * u.factor;
}

/** Convert between two units of one dimension. */
export function convert(value: number, from: string, to: string): number {
  if (from === to) return value;
  if (!sameDimension(from, to)) throw new RangeError(`cannot convert ${from} to ${to}: different quantities`);
  return (value * UNITS[from].factor) / UNITS[to].factor;
}

// ---- Units of entry for reading types ---------------------------------------------------------------

/** A unit of entry: base = typed · factor + offset. Plain data so user-defined types can be stored. */
export interface UnitDef {
  id: string;
  label: string;
  factor: number;
  offset?: number;
}

/** A unit of entry taken from the table: `symbol` expressed in the reading type's base unit `base`. */
function entry(symbol: string, base: string, id = symbol, label = symbol): UnitDef {
  return { id, label, factor: UNITS[symbol].factor / UNITS[base].factor };
}

export const pressureUnits: readonly UnitDef[] = [entry('mbar', 'Pa'), entry('Torr', 'Pa'), entry('Pa', 'Pa')];

/** The visit log's unit id of an RF form, e.g. "Vpp-rod" for peak-to-peak one rod to ground. */
export function rfUnitId(form: RfForm): string {
  const amplitude = form.startsWith('zeroToPeak') ? 'V0p' : form.startsWith('peakToPeak') ? 'Vpp' : 'Vrms';
  return `${amplitude}-${form.endsWith('PerRod') ? 'rod' : 'pairs'}`;
}

/**
 * RF amplitude. Base: V zero-to-peak, one rod to ground (the engine's convention). For a rod at ±V cos Ωt:
 * one rod p-p = 2V, rms = V/√2; between the pairs the swing is doubled (0-p 2V, p-p 4V, rms √2·V).
 */
export const rfAmplitudeUnits: readonly UnitDef[] = RF_FORMS.map((form) => ({
  id: rfUnitId(form), label: `V ${rfFormWords[form]}`, factor: convertRf(1, form, 'zeroToPeakPerRod'),
}));

const dcEntry = (id: string, label: string, form: DcForm): UnitDef => ({ id, label, factor: convertDc(1, form, 'perRod') });

/** DC. Base: V on one rod pair to ground; between the pairs the difference is twice that. */
export const dcUnits: readonly UnitDef[] = [
  dcEntry('V-rod', 'V, one rod pair to ground', 'perRod'),
  dcEntry('V-pairs', 'V, between the rod pairs', 'betweenPairs'),
];

export const frequencyUnits: readonly UnitDef[] = [entry('MHz', 'Hz'), entry('kHz', 'Hz'), entry('Hz', 'Hz')];
export const voltageUnits: readonly UnitDef[] = [entry('V', 'V'), entry('kV', 'V')];
export const currentUnits: readonly UnitDef[] = [entry('µA', 'A', 'uA'), entry('mA', 'A'), entry('A', 'A')];

/** Temperature. Base °C (what every read-back shows); K and °F accepted (the one offset conversion). */
export const temperatureUnits: readonly UnitDef[] = [
  { id: 'degC', label: '°C', factor: 1 },
  { id: 'K', label: 'K', factor: 1, offset: -273.15 },
  { id: 'degF', label: '°F', factor: 5 / 9, offset: -32 * (5 / 9) },
];

export const massUnits: readonly UnitDef[] = [entry('u', 'u')];
export const percentUnits: readonly UnitDef[] = [entry('%', '%', 'percent'), entry('1', '%', 'fraction', 'fraction (1 = 100 %)')];
export const ratioUnits: readonly UnitDef[] = [{ id: 'ratio', label: 'ratio', factor: 1 }];

export function toBase(unit: UnitDef, typed: number): number {
  return typed * unit.factor + (unit.offset ?? 0);
}

export function fromBase(unit: UnitDef, base: number): number {
  return (base - (unit.offset ?? 0)) / unit.factor;
}
