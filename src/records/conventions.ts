// Read-back conventions in words. The conventions themselves (forms, factors, rfFormOf) are the engine's.
import { convertDc, convertRf, RF_FORMS, rfFormOf, type DcForm, type ReadbackConvention, type RfForm } from '../engine/voltageConventions';

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

// ---- Convention slips ------------------------------------------------------------------------------

/** Factor f with value(form) = f · V(zero-to-peak, one rod to ground); the same factors as the engine's conversions. */
export function rfFactor(form: RfForm): number {
  return convertRf(1, 'zeroToPeakPerRod', form);
}

/** A convention the reading might really have been taken in, and what it would be in the chosen convention. */
export interface ConventionSuspect {
  /** The convention that would make the reading pass. */
  form: RfForm;
  /** The reading, re-read as if taken in `form`, expressed in the chosen convention. */
  valueInChosen: number;
  /** chosen-form value ÷ typed value: 2, √2, 2√2, 4 or their inverses. */
  factor: number;
}

/**
 * Which other RF conventions would explain a reading that does not match: for each form other than `chosen`,
 * read the typed value as if it had been taken in that form and convert it into `chosen`; keep the forms for
 * which `passes` is true. The factors between forms are 2 (peak-to-peak vs zero-to-peak, or between the pairs
 * vs one rod), √2 (zero-to-peak vs rms), and their products 2√2 and 4 (Dawson 1976; sine-wave rms = peak/√2).
 */
export function rfConventionSuspects(value: number, chosen: RfForm, passes: (valueInChosen: number) => boolean): ConventionSuspect[] {
  const out: ConventionSuspect[] = [];
  for (const form of RF_FORMS) {
    if (form === chosen) continue;
    const factor = rfFactor(chosen) / rfFactor(form);
    const v = value * factor;
    if (passes(v)) out.push({ form, valueInChosen: v, factor });
  }
  return out;
}

/** The same for DC: one rod pair to ground or between the pairs (a factor of 2). */
export function dcConventionSuspects(value: number, chosen: DcForm, passes: (valueInChosen: number) => boolean): { form: DcForm; valueInChosen: number; factor: number }[] {
  const other: DcForm = chosen === 'perRod' ? 'betweenPairs' : 'perRod';
  const factor = convertDc(1, other, chosen);
  const v = value * factor;
  return passes(v) ? [{ form: other, valueInChosen: v, factor }] : [];
}

export const dcFormWords: Record<DcForm, string> = { perRod: 'one rod pair to ground', betweenPairs: 'between the rod pairs' };

/** A factor between conventions in words: "2", "√2", "2√2", "4", or "1/2"… */
export function factorWords(f: number): string {
  const named: [number, string][] = [[2, '2'], [Math.SQRT2, '√2'], [2 * Math.SQRT2, '2√2'], [4, '4']];
  for (const [x, w] of named) {
    if (Math.abs(f / x - 1) < 1e-9) return w;
    if (Math.abs(f * x - 1) < 1e-9) return `1/${w}`;
  }
  return String(f);
}

/** The RF form of an engineer's choice (amplitude and reference), in the engine's names. */
export function formOfChoice(amplitude: ReadbackConvention['amplitude'], reference: ReadbackConvention['reference']): RfForm {
  return rfFormOf({ amplitude, reference });
}

/** The read-back convention of an RF form (the inverse of rfFormOf). */
export function choiceOfForm(form: RfForm): ReadbackConvention {
  const amplitude = form.startsWith('zeroToPeak') ? 'zero-to-peak' : form.startsWith('peakToPeak') ? 'peak-to-peak' : 'rms';
  return { amplitude, reference: form.endsWith('PerRod') ? 'per-rod' : 'between-pairs' };
}

/** The settings key under which the convention an engineer reads an instrument's RF in is remembered. */
export function probeConventionKey(instrumentId: string): string {
  return `probeConvention:${instrumentId}`;
}

/** A remembered probe convention read back from settings (it may come from an imported backup): the form, or undefined. */
export function probeConventionFrom(value: unknown): RfForm | undefined {
  return typeof value === 'string' && (RF_FORMS as readonly string[]).includes(value) ? (value as RfForm) : undefined;
}
