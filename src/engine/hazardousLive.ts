// Hazardous-live voltage levels of IEC 61010-1:2010 (3rd edition) cl. 6.3.1, normal condition: a.c. 33 V rms
// and 46.7 V peak, d.c. 70 V; wet locations 16 V rms, 22.6 V peak, 35 V d.c. (from memory; earlier editions
// used 30 V rms / 42.4 V peak / 60 V d.c.). The standard also needs the touch current or stored charge to
// exceed its limits; in the field every supply above these voltages is treated as hazardous unless shown
// otherwise (common practice). A rod carries U + V cos Ωt to ground: peak |U| + V, rms √(U² + V²/2).
// Between the two rod pairs the voltage is twice that.
import { checkChoice, checkNumber } from './validate';

export const HAZARDOUS_LIVE_LEVELS = {
  dry: { rms: 33, peak: 46.7, dc: 70 },
  wet: { rms: 16, peak: 22.6, dc: 35 },
} as const;
export const HAZARDOUS_LIVE_SOURCE = 'IEC 61010-1:2010 (3rd ed.) cl. 6.3.1, normal condition (from memory)';
export type LocationCondition = keyof typeof HAZARDOUS_LIVE_LEVELS;

export interface VoltageAssessment {
  /** Largest instantaneous voltage magnitude, V. */
  peak: number;
  /** rms of the waveform, V. */
  rms: number;
  /** |DC| part, V. */
  dc: number;
  hazardous: boolean;
}

export interface HazardousLiveResult {
  /** One rod to ground. */
  perRod: VoltageAssessment;
  /** Between the two rod pairs (a hand across two rods). */
  betweenPairs: VoltageAssessment;
  hazardous: boolean;
  /** Which levels are exceeded, in words, e.g. "46.7 V peak (one rod to ground)". */
  exceeded: string[];
  levels: { rms: number; peak: number; dc: number };
  source: string;
}

function assess(dc: number, rf: number, levels: { rms: number; peak: number; dc: number }, where: string, exceeded: string[]): VoltageAssessment {
  const absDc = Math.abs(dc);
  const peak = absDc + rf;
  const rms = Math.sqrt(dc * dc + (rf * rf) / 2);
  let hazardous = false;
  if (rf > 0) {
    if (peak > levels.peak) {
      exceeded.push(`${levels.peak} V peak (${where})`);
      hazardous = true;
    }
    if (rms > levels.rms) {
      exceeded.push(`${levels.rms} V rms (${where})`);
      hazardous = true;
    }
  }
  if (absDc > levels.dc) {
    exceeded.push(`${levels.dc} V DC (${where})`);
    hazardous = true;
  }
  return { peak, rms, dc: absDc, hazardous };
}

/**
 * Whether rod voltages exceed the hazardous-live levels.
 * @param dc U, V per rod to ground (either sign; default 0)
 * @param rf V, zero-to-peak per rod to ground (≥ 0; default 0)
 * @param location 'dry' (default) or 'wet'
 */
export function hazardousLive(p: { dc?: number; rf?: number; location?: LocationCondition }): HazardousLiveResult {
  const dc = checkNumber('dc', p?.dc === undefined ? 0 : p.dc, { min: -1e7, max: 1e7, unit: 'V' });
  const rf = checkNumber('rf', p?.rf === undefined ? 0 : p.rf, { min: 0, max: 1e7, unit: 'V' });
  const location = checkChoice('location', p?.location === undefined ? 'dry' : p.location, ['dry', 'wet'] as const);
  const levels = HAZARDOUS_LIVE_LEVELS[location];
  const exceeded: string[] = [];
  const perRod = assess(dc, rf, levels, 'one rod to ground', exceeded);
  const betweenPairs = assess(2 * dc, 2 * rf, levels, 'between the rod pairs', exceeded);
  return { perRod, betweenPairs, hazardous: perRod.hazardous || betweenPairs.hazardous, exceeded, levels: { ...levels }, source: HAZARDOUS_LIVE_SOURCE };
}

/** Single-value form for a displayed number: is `volts` above the level for its kind (rms, peak or DC)? */
export function exceedsHazardousLevel(p: { volts: number; kind: 'rms' | 'peak' | 'dc'; location?: LocationCondition }): boolean {
  const volts = checkNumber('volts', p?.volts, { min: -1e7, max: 1e7, unit: 'V' });
  const kind = checkChoice('kind', p?.kind, ['rms', 'peak', 'dc'] as const);
  const location = checkChoice('location', p?.location === undefined ? 'dry' : p.location, ['dry', 'wet'] as const);
  return Math.abs(volts) > HAZARDOUS_LIVE_LEVELS[location][kind];
}
