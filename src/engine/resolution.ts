// Resolution limits of the mass filter.
//   • RF cycles in the rods: n = f·L·√(m/(2 z e V_z)) for axial energy z·e·V_z (n = f·L/v with v = √(2zeV_z/m); Dawson 1976).
//   • Cycle limit m/Δm ≲ n²/K: K = 12.25 from W. Paul, H. P. Reinhard, U. von Zahn, Z. Phys. 152 (1958) 143,
//     as quoted by P. H. Dawson (ed.), Quadrupole Mass Spectrometry and its Applications, 1976; K ≈ 20 in
//     later reviews. Both from memory; the K used is always returned with the result.
//   • Ideal-field resolution near the apex: m/Δm ≈ 0.126/(0.16784 − U/V) (Dawson 1976; Miller & Denton,
//     J. Chem. Educ. 63 (1986) 617 — from memory), beside the exact value from the region's edges.
import { ATOMIC_MASS_CONSTANT, ELEMENTARY_CHARGE } from './constants';
import { LIMITS } from './mathieuScale';
import { a0Unchecked, b1Unchecked } from './characteristicValues';
import { exactResolutionAtRatio, ratioForExactResolution } from './operatingPoint';
import { apexRatio, firstRegionApex } from './stabilityRegions';
import { checkChoice, checkNumber } from './validate';

export const CYCLE_LIMIT_CONSTANTS = {
  paul1958: {
    value: 12.25,
    source: 'W. Paul, H. P. Reinhard, U. von Zahn, Z. Phys. 152 (1958) 143, via Dawson 1976 (from memory)',
  },
  laterReviews: { value: 20, source: 'later reviews of quadrupole mass filters (from memory)' },
} as const;
export type CycleLimitChoice = keyof typeof CYCLE_LIMIT_CONSTANTS;
const CHOICES = Object.keys(CYCLE_LIMIT_CONSTANTS) as CycleLimitChoice[];

/** Rounded constants of the apex rule m/Δm ≈ 0.126/(0.16784 − U/V) (Dawson 1976 — from memory). */
export const APEX_RULE = { numerator: 0.126, apexRatio: 0.16784 } as const;

/** Number of RF cycles an ion of m/z (u) spends in rods of length rodLength (m) at axial energy axialEnergy (eV per charge). */
export function rfCycles(p: { mz: number; rodLength: number; frequency: number; axialEnergy: number }): number {
  const mz = checkNumber('mz', p?.mz, LIMITS.mz);
  const rodLength = checkNumber('rodLength', p?.rodLength, { min: 0, minExclusive: true, max: 10, unit: 'm' });
  const frequency = checkNumber('frequency', p?.frequency, LIMITS.frequency);
  const axialEnergy = checkNumber('axialEnergy', p?.axialEnergy, { min: 0, minExclusive: true, max: 1e5, unit: 'eV' });
  const speed = Math.sqrt((2 * ELEMENTARY_CHARGE * axialEnergy) / (mz * ATOMIC_MASS_CONSTANT));
  return (frequency * rodLength) / speed;
}

/** Axial ion speed (m/s) for m/z (u) at axial energy (eV per charge). */
export function axialSpeed(p: { mz: number; axialEnergy: number }): number {
  const mz = checkNumber('mz', p?.mz, LIMITS.mz);
  const axialEnergy = checkNumber('axialEnergy', p?.axialEnergy, { min: 0, minExclusive: true, max: 1e5, unit: 'eV' });
  return Math.sqrt((2 * ELEMENTARY_CHARGE * axialEnergy) / (mz * ATOMIC_MASS_CONSTANT));
}

export interface CycleLimit {
  cycles: number;
  /** Largest m/Δm the RF cycles allow, n²/K. */
  resolution: number;
  /** The K used and where it comes from. */
  k: number;
  kSource: string;
}

/** Cycle-limited resolution n²/K for an ion at the given axial energy (K: 'paul1958' = 12.25 default, 'laterReviews' = 20). */
export function cycleLimitedResolution(p: {
  mz: number;
  rodLength: number;
  frequency: number;
  axialEnergy: number;
  k?: CycleLimitChoice;
}): CycleLimit {
  const choice = checkChoice('k', p?.k ?? 'paul1958', CHOICES);
  const cycles = rfCycles(p);
  const { value, source } = CYCLE_LIMIT_CONSTANTS[choice];
  return { cycles, resolution: (cycles * cycles) / value, k: value, kSource: source };
}

/**
 * Largest axial energy (eV per charge) for a wanted peak width Δm (u): from m/Δm ≤ n²/K,
 * V_z ≤ f²L²·u·Δm/(2eK) — independent of m (≈ 4×10⁻²·f[MHz]²·L[cm]²·Δm V with K = 12.25).
 */
export function maxAxialEnergy(p: { width: number; rodLength: number; frequency: number; k?: CycleLimitChoice }): {
  axialEnergy: number;
  k: number;
  kSource: string;
} {
  const width = checkNumber('width', p?.width, { min: 0, minExclusive: true, max: 1e6, unit: 'u' });
  const rodLength = checkNumber('rodLength', p?.rodLength, { min: 0, minExclusive: true, max: 10, unit: 'm' });
  const frequency = checkNumber('frequency', p?.frequency, LIMITS.frequency);
  const choice = checkChoice('k', p?.k ?? 'paul1958', CHOICES);
  const { value, source } = CYCLE_LIMIT_CONSTANTS[choice];
  const axialEnergy =
    (frequency * frequency * rodLength * rodLength * ATOMIC_MASS_CONSTANT * width) / (2 * ELEMENTARY_CHARGE * value);
  return { axialEnergy, k: value, kSource: source };
}

export interface RatioResolution {
  /** Exact ideal-field m/Δm (band centre/width from the region edges); null at or above the apex. */
  exact: number | null;
  /** 0.126/(0.16784 − U/V); null at or above 0.16784. */
  rule: number | null;
}

/** Resolution at a DC/RF ratio U/V (≥ 0), exact and by the apex rule, side by side. */
export function resolutionAtRatio(ratio: number): RatioResolution {
  checkNumber('ratio', ratio, { min: 0, max: 10 });
  const gap = APEX_RULE.apexRatio - ratio;
  return { exact: exactResolutionAtRatio(ratio), rule: gap > 0 ? APEX_RULE.numerator / gap : null };
}

/** U/V needed for a resolution m/Δm, exact and by the apex rule (inverse: U/V = 0.16784 − 0.126/R). */
export function ratioForResolution(resolution: number): { exact: number; rule: number } {
  checkNumber('resolution', resolution, { min: 0.5, max: 1e9 });
  return { exact: ratioForExactResolution(resolution), rule: APEX_RULE.apexRatio - APEX_RULE.numerator / resolution };
}

let apexConstantCache: number | null = null;

/**
 * The exact constant C in m/Δm → C/(λ_apex − U/V) as U/V approaches the apex, from the slopes s_x = db1/dq and
 * s_y = −da0/dq of the two edges there: C = 1 / (2 [1/(2λ − s_x) − 1/(2λ − s_y)]) ≈ 0.1263 (computed; the
 * published rule rounds it to 0.126 and the apex ratio to 0.16784).
 */
export function apexResolutionConstant(): number {
  if (apexConstantCache === null) {
    const { q } = firstRegionApex();
    const lambda = apexRatio();
    const h = 1e-5; // central differences: error ≈ h²·(third derivative) ≈ 1e-11, rounding ≈ 1e-16/h
    const slopeX = (b1Unchecked(q + h) - b1Unchecked(q - h)) / (2 * h);
    const slopeY = (a0Unchecked(q - h) - a0Unchecked(q + h)) / (2 * h);
    apexConstantCache = 1 / (2 * (1 / (2 * lambda - slopeX) - 1 / (2 * lambda - slopeY)));
  }
  return apexConstantCache;
}
