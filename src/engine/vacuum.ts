// Mean free path and scattering in the analyser. Kinetic theory: λ = k_B·T/(√2·π·d²·p) for a molecule of
// collision diameter d in its own gas (J. F. O'Hanlon, A User's Guide to Vacuum Technology, 3rd ed. 2003;
// K. Jousten (ed.), Handbook of Vacuum Technology, 2nd ed. 2016). Unscattered fraction over L: exp(−L/λ).
import { BOLTZMANN_CONSTANT, PASCAL_PER_MBAR, PASCAL_PER_TORR } from './constants';
import { checkChoice, checkNumber } from './validate';

export const PRESSURE_UNITS = ['Pa', 'mbar', 'Torr'] as const;
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
const PASCAL_PER_UNIT: Record<PressureUnit, number> = { Pa: 1, mbar: PASCAL_PER_MBAR, Torr: PASCAL_PER_TORR };

/** Convert a pressure between Pa, mbar and Torr (1 Torr = 101325/760 Pa; NIST SP 811). */
export function convertPressure(value: number, from: PressureUnit, to: PressureUnit): number {
  checkNumber('value', value, { min: 0, max: 1e9 });
  const f = checkChoice('from', from, PRESSURE_UNITS);
  const t = checkChoice('to', to, PRESSURE_UNITS);
  return (value * PASCAL_PER_UNIT[f]) / PASCAL_PER_UNIT[t];
}

export interface GasPreset {
  /** Collision diameter d in m. */
  diameter: number;
  /** Where the number comes from, with its class. */
  source: string;
}

/**
 * Gas-kinetic collision diameters (from viscosity), the d that makes λ = k_B T/(√2 π d² p) match measured
 * mean free paths. All recalled from vacuum handbooks' tables (e.g. Jousten 2016) — from memory. Note the
 * zeolite "kinetic diameters" (D. W. Breck, Zeolite Molecular Sieves, 1974: N2 3.64 Å, H2O 2.65 Å) are a
 * different quantity and give longer paths.
 */
export const GAS_PRESETS = {
  N2: { diameter: 3.75e-10, source: 'viscosity collision diameter, vacuum handbook table (from memory)' },
  air: {
    diameter: 3.7e-10,
    source: 'common practice: reproduces λ[cm] ≈ 5×10⁻³/p[Torr] at room temperature for air (Jousten, Handbook of Vacuum Technology, 2nd ed., 2016; O’Hanlon, A User’s Guide to Vacuum Technology, 3rd ed., 2003)',
  },
  He: { diameter: 2.18e-10, source: 'viscosity collision diameter, vacuum handbook table (from memory)' },
  Ar: { diameter: 3.64e-10, source: 'viscosity collision diameter, vacuum handbook table (from memory)' },
  H2O: { diameter: 4.6e-10, source: 'viscosity collision diameter, vacuum handbook table (from memory)' },
} as const satisfies Record<string, GasPreset>;
export type GasName = keyof typeof GAS_PRESETS;
export const GAS_NAMES = Object.keys(GAS_PRESETS) as GasName[];

/** Mean free path (m) at pressure (Pa) and temperature (K) for collision diameter d (m). */
export function meanFreePath(p: { pressure: number; temperature: number; diameter: number }): number {
  const pressure = checkNumber('pressure', p?.pressure, { min: 0, minExclusive: true, max: 1e7, unit: 'Pa' });
  const temperature = checkNumber('temperature', p?.temperature, { min: 0, minExclusive: true, max: 1e4, unit: 'K' });
  const diameter = checkNumber('diameter', p?.diameter, { min: 0, minExclusive: true, max: 1e-8, unit: 'm' });
  return (BOLTZMANN_CONSTANT * temperature) / (Math.SQRT2 * Math.PI * diameter * diameter * pressure);
}

/**
 * Mean free path (m) of an ion of collision cross-section σ (m²) moving fast through still gas:
 * λ = k_B·T/(p·σ) — no √2, the ion outruns the gas molecules (O'Hanlon, A User's Guide to Vacuum Technology, 3rd ed., 2003, kinetic theory of gases).
 */
export function ionMeanFreePath(p: { pressure: number; temperature: number; crossSection: number }): number {
  const pressure = checkNumber('pressure', p?.pressure, { min: 0, minExclusive: true, max: 1e7, unit: 'Pa' });
  const temperature = checkNumber('temperature', p?.temperature, { min: 0, minExclusive: true, max: 1e4, unit: 'K' });
  const crossSection = checkNumber('crossSection', p?.crossSection, { min: 0, minExclusive: true, max: 1e-15, unit: 'm²' });
  return (BOLTZMANN_CONSTANT * temperature) / (pressure * crossSection);
}

/** Mean free path (m) for a preset gas. */
export function meanFreePathForGas(p: { gas: GasName; pressure: number; temperature: number }): number {
  const gas = checkChoice('gas', p?.gas, GAS_NAMES);
  return meanFreePath({ pressure: p.pressure, temperature: p.temperature, diameter: GAS_PRESETS[gas].diameter });
}

/** Fraction of ions that cross a path L (m) without a collision, exp(−L/λ). */
export function unscatteredFraction(p: { pathLength: number; meanFreePath: number }): number {
  const pathLength = checkNumber('pathLength', p?.pathLength, { min: 0, max: 1e3, unit: 'm' });
  const lambda = checkNumber('meanFreePath', p?.meanFreePath, { min: 0, minExclusive: true, max: 1e12, unit: 'm' });
  return Math.exp(-pathLength / lambda);
}

/** Mean free path against rod length: λ, λ/L, and the unscattered fraction over L. */
export function scatteringAlongRods(p: { gas: GasName; pressure: number; temperature: number; rodLength: number }): {
  meanFreePath: number;
  ratioToRodLength: number;
  unscatteredFraction: number;
} {
  const rodLength = checkNumber('rodLength', p?.rodLength, { min: 0, minExclusive: true, max: 10, unit: 'm' });
  const lambda = meanFreePathForGas(p);
  return { meanFreePath: lambda, ratioToRodLength: lambda / rodLength, unscatteredFraction: Math.exp(-rodLength / lambda) };
}
