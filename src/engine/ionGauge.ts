// Hot-cathode (Bayard–Alpert) ion gauge gas correction: gauges read N2-equivalent, so
// p_true = p_indicated / S_rel. Relative sensitivities from the CRC Handbook of Chemistry
// and Physics table "Relative sensitivity of Bayard–Alpert ionization gauges to various gases" (P. Redhead);
// individual gauges differ by up to about ±15 %.
import { checkChoice, checkNumber } from './validate';

export const ION_GAUGE_SENSITIVITY = {
  N2: 1.0,
  He: 0.18,
  Ne: 0.31,
  Ar: 1.4,
  H2: 0.43,
  O2: 0.96,
  CO: 1.0,
  CO2: 1.4,
  H2O: 0.93,
  CH4: 1.6,
} as const;
export type GaugeGas = keyof typeof ION_GAUGE_SENSITIVITY;
export const GAUGE_GASES = Object.keys(ION_GAUGE_SENSITIVITY) as GaugeGas[];
export const ION_GAUGE_SOURCE = 'CRC Handbook of Chemistry and Physics, Bayard–Alpert relative sensitivity table (published)';

/** True pressure of a gas from an N2-equivalent ion-gauge reading (same unit in and out). */
export function ionGaugeTruePressure(p: { indicated: number; gas: GaugeGas }): number {
  const indicated = checkNumber('indicated', p?.indicated, { min: 0, max: 1e7 });
  const gas = checkChoice('gas', p?.gas, GAUGE_GASES);
  return indicated / ION_GAUGE_SENSITIVITY[gas];
}

/** N2-equivalent reading an ion gauge shows for a true pressure of a gas. */
export function ionGaugeIndicated(p: { truePressure: number; gas: GaugeGas }): number {
  const truePressure = checkNumber('truePressure', p?.truePressure, { min: 0, max: 1e7 });
  const gas = checkChoice('gas', p?.gas, GAUGE_GASES);
  return truePressure * ION_GAUGE_SENSITIVITY[gas];
}
