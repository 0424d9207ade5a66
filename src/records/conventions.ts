// Read-back conventions in words. The conventions themselves (forms, factors, rfFormOf) are the engine's.
import { rfFormOf, type ReadbackConvention, type RfForm } from '../engine/voltageConventions';

/** Each RF form in words, as the screens and the visit log's units say it. */
export const rfFormWords: Record<RfForm, string> = {
  zeroToPeakPerRod: 'zero-to-peak, one rod to ground',
  peakToPeakPerRod: 'peak-to-peak, one rod to ground',
  rmsPerRod: 'rms, one rod to ground',
  zeroToPeakBetweenPairs: 'zero-to-peak, between the rod pairs',
  peakToPeakBetweenPairs: 'peak-to-peak, between the rod pairs',
  rmsBetweenPairs: 'rms, between the rod pairs',
};

/** An instrument's read-back convention in words, e.g. "peak-to-peak, one rod to ground". */
export function conventionWords(c: ReadbackConvention): string {
  return rfFormWords[rfFormOf(c)];
}

/** The same inside a diagnosis sentence, e.g. "peak-to-peak per rod to ground". */
export function readbackName(c: ReadbackConvention): string {
  return `${c.amplitude} ${c.reference === 'per-rod' ? 'per rod to ground' : 'between the rod pairs'}`;
}
