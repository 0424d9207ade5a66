// Round rods approximating the hyperbolic field: rod radius r as a multiple of the field radius r0
// (D. J. Douglas, N. V. Konenkov, Rapid Commun. Mass Spectrom. 16 (2002)).
import { checkChoice, checkNumber } from './validate';

export const ROD_RATIOS = {
  bestPeakShape: { ratio: 1.13, source: 'Douglas & Konenkov, Rapid Commun. Mass Spectrom. 2002: optimum peak shape (published)' },
  noDodecapole: {
    ratio: 1.14511,
    source: 'Douglas & Konenkov, Rapid Commun. Mass Spectrom. 2002: dodecapole (12-pole) term cancels (published; older texts 1.1468 or 1.148, from memory)',
  },
} as const;
export type RodChoice = keyof typeof ROD_RATIOS;
const CHOICES = Object.keys(ROD_RATIOS) as RodChoice[];

/** Round-rod radius (m) for a field radius r0 (m). */
export function roundRodRadius(p: { r0: number; choice?: RodChoice }): { radius: number; ratio: number; source: string } {
  const r0 = checkNumber('r0', p?.r0, { min: 0, minExclusive: true, max: 1, unit: 'm' });
  const choice = checkChoice('choice', p?.choice ?? 'bestPeakShape', CHOICES);
  const { ratio, source } = ROD_RATIOS[choice];
  return { radius: ratio * r0, ratio, source };
}

/** Field radius r0 (m) that a set of round rods of radius r (m) was designed for. */
export function fieldRadiusForRods(p: { rodRadius: number; choice?: RodChoice }): number {
  const rodRadius = checkNumber('rodRadius', p?.rodRadius, { min: 0, minExclusive: true, max: 1, unit: 'm' });
  const choice = checkChoice('choice', p?.choice ?? 'bestPeakShape', CHOICES);
  return rodRadius / ROD_RATIOS[choice].ratio;
}
