/**
 * Units the engineer may enter in, with their SI unit and factor (value_SI = value × factor).
 * Pressure conversions: 1 Torr = 133.322 Pa, 1 mbar = 100 Pa (CODATA 2018; NIST SP 811).
 */
export interface UnitInfo {
  si: string;
  factor: number;
}

export const UNITS: Record<string, UnitInfo> = {
  // pressure
  Pa: { si: 'Pa', factor: 1 },
  mbar: { si: 'Pa', factor: 100 },
  Torr: { si: 'Pa', factor: 133.322 },
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
  // temperature (differences and absolute in K only; °C is handled by the caller)
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
  'counts': { si: 'counts', factor: 1 },
  'counts/s': { si: 'counts/s', factor: 1 },
  '°C': { si: '°C', factor: 1 },
  'eV': { si: 'eV', factor: 1 },
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
