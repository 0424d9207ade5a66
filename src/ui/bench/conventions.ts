// The instrument's read-back convention in the engine's names, and words for every form.
import { convertDc, convertRf, type DcForm, type RfForm } from '../../engine';

export { dcFormOf, rfFormOf } from '../../engine';
export { rfFormWords } from '../../records';

/** Short unit suffix for a form, e.g. "V 0-p". */
export const rfFormUnit: Record<RfForm, string> = {
  zeroToPeakPerRod: 'V 0-p',
  peakToPeakPerRod: 'V p-p',
  rmsPerRod: 'V rms',
  zeroToPeakBetweenPairs: 'V 0-p',
  peakToPeakBetweenPairs: 'V p-p',
  rmsBetweenPairs: 'V rms',
};

export const dcFormWords: Record<DcForm, string> = {
  perRod: 'one rod to ground',
  betweenPairs: 'between the rod pairs',
};

/** The visit log's unit ids for each form, so a noted RF or DC lands as a typed reading in that unit. */
export const rfFormUnitId: Record<RfForm, string> = {
  zeroToPeakPerRod: 'V0p-rod',
  peakToPeakPerRod: 'Vpp-rod',
  rmsPerRod: 'Vrms-rod',
  zeroToPeakBetweenPairs: 'V0p-pairs',
  peakToPeakBetweenPairs: 'Vpp-pairs',
  rmsBetweenPairs: 'Vrms-pairs',
};
export const dcFormUnitId: Record<DcForm, string> = { perRod: 'V-rod', betweenPairs: 'V-pairs' };

/** V zero-to-peak per rod in another form; null beyond the engine's conversion range (tens of megavolts). */
export function rfAs(form: RfForm, zeroToPeakPerRod: number): number | null {
  try {
    return convertRf(zeroToPeakPerRod, 'zeroToPeakPerRod', form);
  } catch {
    return null;
  }
}

/** U per rod in another form; null beyond the engine's conversion range. */
export function dcAs(form: DcForm, perRod: number): number | null {
  try {
    return convertDc(perRod, 'perRod', form);
  } catch {
    return null;
  }
}
