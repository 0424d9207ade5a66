// Conversions between the ways an RF or DC amplitude is quoted (Dawson 1976; March & Todd, Quadrupole Ion Trap Mass Spectrometry, 2nd ed., 2005). The engine keeps
// V zero-to-peak on one rod to ground; between the two pairs the voltage doubles; peak-to-peak is twice
// zero-to-peak; rms of a sine is zero-to-peak/√2.
import { checkChoice, checkNumber } from './validate';

export const RF_FORMS = [
  'zeroToPeakPerRod',
  'peakToPeakPerRod',
  'rmsPerRod',
  'zeroToPeakBetweenPairs',
  'peakToPeakBetweenPairs',
  'rmsBetweenPairs',
] as const;
export type RfForm = (typeof RF_FORMS)[number];

/** Factor f with value(form) = f · V(zero-to-peak, per rod). */
const RF_FACTOR: Record<RfForm, number> = {
  zeroToPeakPerRod: 1,
  peakToPeakPerRod: 2,
  rmsPerRod: Math.SQRT1_2,
  zeroToPeakBetweenPairs: 2,
  peakToPeakBetweenPairs: 4,
  rmsBetweenPairs: Math.SQRT2,
};

/** Convert an RF amplitude (V) between forms. */
export function convertRf(value: number, from: RfForm, to: RfForm): number {
  checkNumber('value', value, { min: 0, max: 1e7, unit: 'V' });
  const f = checkChoice('from', from, RF_FORMS);
  const t = checkChoice('to', to, RF_FORMS);
  return (value / RF_FACTOR[f]) * RF_FACTOR[t];
}

export const DC_FORMS = ['perRod', 'betweenPairs'] as const;
export type DcForm = (typeof DC_FORMS)[number];

/** Convert a DC voltage (V): between the pairs it is 2U. */
export function convertDc(value: number, from: DcForm, to: DcForm): number {
  checkNumber('value', value, { min: -1e7, max: 1e7, unit: 'V' });
  const f = checkChoice('from', from, DC_FORMS);
  const t = checkChoice('to', to, DC_FORMS);
  const factor = { perRod: 1, betweenPairs: 2 } as const;
  return (value / factor[f]) * factor[t];
}

/** How an instrument's read-back states an amplitude: its form. */
export type AmplitudeForm = 'zero-to-peak' | 'peak-to-peak' | 'rms';
/** What a read-back amplitude is measured against: one rod to ground, or one pair against the other. */
export type AmplitudeReference = 'per-rod' | 'between-pairs';

/** How an instrument's own read-backs state RF/DC: the form of the amplitude and what it is measured against. */
export interface ReadbackConvention {
  amplitude: AmplitudeForm;
  reference: AmplitudeReference;
}

const AMPLITUDE_FORMS: readonly AmplitudeForm[] = ['zero-to-peak', 'peak-to-peak', 'rms'];
const AMPLITUDE_REFERENCES: readonly AmplitudeReference[] = ['per-rod', 'between-pairs'];

/** The RF form of a read-back convention, in the names convertRf takes. */
export function rfFormOf(c: ReadbackConvention): RfForm {
  const amplitude = checkChoice('amplitude', c?.amplitude, AMPLITUDE_FORMS);
  const reference = checkChoice('reference', c?.reference, AMPLITUDE_REFERENCES);
  const amp = amplitude === 'zero-to-peak' ? 'zeroToPeak' : amplitude === 'peak-to-peak' ? 'peakToPeak' : 'rms';
  return `${amp}${reference === 'per-rod' ? 'PerRod' : 'BetweenPairs'}` as RfForm;
}

/** The DC form of a read-back convention, in the names convertDc takes. */
export function dcFormOf(c: ReadbackConvention): DcForm {
  return checkChoice('reference', c?.reference, AMPLITUDE_REFERENCES) === 'per-rod' ? 'perRod' : 'betweenPairs';
}
