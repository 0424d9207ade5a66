// The background-gas and calibrant checks: how their readings are judged and named.
// - Air is judged by the leak tools' peak-ratio method (engine leak.ts): 28:32 in the air band, with 40:28 argon
//   when it is given. Inside the band is an air signature, so the verdict runs the other way from a range.
// - Water has no preset limit: it is judged only against the instrument's own baseline (see the catalogue).
// - Calibrant ions and their reference ions are chosen by the engineer for each instrument; an isotope-ratio
//   expectation comes from the ion's formula when the engineer gives it.
// Pure functions: no storage, no DOM.
import { airSignalRatios, DRY_AIR_SOURCE, LEAK_BANDS } from '../engine/leak';
import { formatNumber } from './numberText';
import type { InstrumentKind, Reading, Verdict } from './types';

/** Type ids of the rebuilt checks. */
export const AIR_RATIO_TYPE = 'air-ratio-28-32';
export const WATER_TYPE = 'water-18';
export const CALIBRANT_RATIO_TYPE = 'calibrant-ratio';
export const CALIBRANT_ISOTOPE_TYPE = 'calibrant-isotope';

/** Reading types of the earlier design: still read, shown, trended and exported, no longer offered for new readings. */
export const EARLIER_DESIGN_TYPES: readonly string[] = [
  'leak-water-18', 'leak-nitrogen-28', 'leak-ratio-28-32', 'leak-argon-40', 'relative-abundance', 'isotope-ratio',
];

/** The new type a reading of an earlier-design type is entered as now (an unsaved form is carried over to it). */
export const EARLIER_DESIGN_SUCCESSOR: Readonly<Record<string, string>> = {
  'leak-water-18': 'water-18', 'leak-nitrogen-28': 'air-ratio-28-32', 'leak-ratio-28-32': 'air-ratio-28-32', 'leak-argon-40': 'air-ratio-28-32',
  'relative-abundance': 'calibrant-ratio', 'isotope-ratio': 'calibrant-isotope',
};

/** Where the air bands come from, in words (the engine's bands and their classes, and the dry-air composition). */
export function airBandSource(): string {
  const computed = airSignalRatios();
  return `leak tools’ peak-ratio method: dry air N2/O2 = 3.73 by volume (${DRY_AIR_SOURCE}), ` +
    `about ${formatNumber(computed.m28ToM32, 3)} weighted by ionisation (computed); air band ${LEAK_BANDS.airCore.low}–${LEAK_BANDS.airCore.high} ` +
    `(${LEAK_BANDS.airCore.source}); air-like ${LEAK_BANDS.airWide.low}–${LEAK_BANDS.airWide.high} (${LEAK_BANDS.airWide.source})`;
}

export interface SignatureJudgement {
  verdict: Verdict;
  /** 0 outside the bands, 1 in the wide band only, 2 in the air band. */
  deviation: number;
  summary: string;
}

/**
 * Judge a 28:32 height ratio for an air signature (the leak tools' method, engine `leakIndication`):
 * in the air band (with argon agreeing, when given) → fail, an air leak is likely; air-like only (the wide band, or
 * argon not agreeing) → borderline, re-check; outside the wide band → pass, the background is not air.
 * `argonPercent` is the m/z 40 height as a percentage of m/z 28 from the same scan.
 */
export function judgeAirSignature(ratio2832: number, argonPercent?: number): SignatureJudgement {
  const core = LEAK_BANDS.airCore;
  const wide = LEAK_BANDS.airWide;
  const argon = LEAK_BANDS.argon;
  const r = formatNumber(ratio2832, 3);
  if (!Number.isFinite(ratio2832)) return { verdict: 'fail', deviation: Infinity, summary: 'not a finite number' };
  if (ratio2832 < wide.low || ratio2832 > wide.high) {
    return { verdict: 'pass', deviation: 0, summary: `28:32 = ${r} is outside the air-like band ${wide.low}–${wide.high}: no air signature` };
  }
  const argonGiven = argonPercent !== undefined && Number.isFinite(argonPercent);
  const argonFits = argonGiven && argonPercent / 100 >= argon.low && argonPercent / 100 <= argon.high;
  const argonWords = argonGiven
    ? `40:28 = ${formatNumber(argonPercent, 3)} % ${argonFits ? 'agrees' : 'does not agree'} with air (${formatNumber(argon.low * 100)}–${formatNumber(argon.high * 100)} %)`
    : '';
  if (argonGiven && !argonFits) {
    return { verdict: 'borderline', deviation: 1, summary: `28:32 = ${r} is air-like but ${argonWords}: another gas is mixed in; take the scan again before calling it air` };
  }
  const inCore = ratio2832 >= core.low && ratio2832 <= core.high;
  if (inCore || argonFits) {
    return { verdict: 'fail', deviation: 2, summary: `air signature: 28:32 = ${r}${inCore ? ` in the air band ${core.low}–${core.high}` : ' air-like'}${argonWords ? `, ${argonWords}` : ''}; an air leak is likely` };
  }
  return { verdict: 'borderline', deviation: 1, summary: `28:32 = ${r} is air-like (${wide.low}–${wide.high}) but outside the air band ${core.low}–${core.high}; add 40:28 from the same scan to decide` };
}

// ---- Calibrant ions chosen by the engineer ---------------------------------------------------------------

export interface CalibrantChoice {
  mz: number;
  /** The ion it is compared with (abundance ratios); absent for a width or an isotope ratio. */
  referenceMz?: number;
  /** The ion's formula, when known: gives the isotope-ratio expectation. */
  formula?: string;
}

/**
 * A starting choice of calibrant ions by instrument kind, for the engineer to keep or change. EI GC-MS: three ions
 * of perfluorotributylamine, the usual EI calibrant across the trade (CF3+ m/z 69, C4F9+ m/z 219, C9F20N+ m/z 502;
 * common practice). LC-MS calibrants differ from lab to lab and RGAs use background gases, so those start empty.
 */
export function startingCalibrantChoice(kind: InstrumentKind | undefined): { ions: CalibrantChoice[]; why: string } {
  if (kind === 'gc-ms-single' || kind === 'gc-ms-triple') {
    return {
      ions: [
        { mz: 69, formula: 'CF3' },
        { mz: 219, referenceMz: 69, formula: 'C4F9' },
        { mz: 502, referenceMz: 69, formula: 'C9F20N' },
      ],
      why: 'starting choice for an EI GC-MS: perfluorotributylamine ions (common practice); change them for this instrument',
    };
  }
  if (kind === 'rga') return { ions: [], why: 'an RGA has no calibrant here: use the background-gas readings' };
  return { ions: [], why: 'no starting choice for this kind: enter the ions of your calibrant from its data sheet' };
}

function num(v: unknown): number | undefined {
  const n = typeof v === 'number' ? v : typeof v === 'string' && v.trim() !== '' ? Number(v) : NaN;
  return Number.isFinite(n) ? n : undefined;
}

/**
 * The calibrant ions the engineer has used on this instrument (from its readings of the calibrant types, newest
 * first, each ion and reference once); the starting choice for its kind when there are none yet.
 */
export function calibrantChoices(kind: InstrumentKind | undefined, readings: readonly Reading[]): { ions: CalibrantChoice[]; why: string } {
  const seen = new Map<string, CalibrantChoice>();
  const sorted = [...readings].sort((a, b) => (a.takenAt < b.takenAt ? 1 : a.takenAt > b.takenAt ? -1 : 0));
  for (const r of sorted) {
    if (r.typeId !== CALIBRANT_RATIO_TYPE && r.typeId !== CALIBRANT_ISOTOPE_TYPE && r.typeId !== 'peak-width') continue;
    const mz = num(r.context?.mz);
    if (mz === undefined) continue;
    const referenceMz = r.typeId === CALIBRANT_RATIO_TYPE ? num(r.context?.referenceMz) : undefined;
    const formula = typeof r.context?.formula === 'string' && r.context.formula.trim() ? r.context.formula.trim() : undefined;
    const key = `${mz}/${referenceMz ?? ''}`;
    const had = seen.get(key);
    if (!had) seen.set(key, { mz, ...(referenceMz !== undefined ? { referenceMz } : {}), ...(formula ? { formula } : {}) });
    else if (!had.formula && formula) had.formula = formula;
  }
  if (seen.size) {
    return { ions: [...seen.values()].sort((a, b) => a.mz - b.mz || (a.referenceMz ?? 0) - (b.referenceMz ?? 0)), why: 'chosen by the engineer on earlier visits to this instrument' };
  }
  return startingCalibrantChoice(kind);
}

/** How a reading of the rebuilt checks is named on screen and in the record, from its own context. */
export function checkReadingTitle(typeId: string, context: Readonly<Record<string, string | number>> | undefined): string | undefined {
  const mz = num(context?.mz);
  const ref = num(context?.referenceMz);
  const formula = typeof context?.formula === 'string' && context.formula ? ` (${context.formula})` : '';
  switch (typeId) {
    case CALIBRANT_RATIO_TYPE:
      return mz !== undefined && ref !== undefined ? `m/z ${formatNumber(mz)} as % of m/z ${formatNumber(ref)}, chosen by the engineer` : undefined;
    case CALIBRANT_ISOTOPE_TYPE:
      return mz !== undefined ? `Isotope ratio M+1/M at m/z ${formatNumber(mz)}${formula}, chosen by the engineer` : undefined;
    case WATER_TYPE:
      return ref !== undefined ? `Water: m/z 18 as % of m/z ${formatNumber(ref)}` : undefined;
    default:
      return undefined;
  }
}

/** A reading's name on screen and in the record: its own name for a noted value, the ions for a calibrant or water reading, else the type's label. */
export function readingTitle(r: Pick<Reading, 'typeId' | 'context'>, type: { label: string } | undefined): string {
  if (r.typeId === 'noted-value') return String(r.context?.label ?? 'Noted value');
  return checkReadingTitle(r.typeId, r.context) ?? type?.label ?? `reading type ${r.typeId}`;
}

/** Context keys a title from `checkReadingTitle` already says, so a context line need not repeat them. */
export function keysInTitle(typeId: string, context: Readonly<Record<string, string | number>> | undefined): readonly string[] {
  return checkReadingTitle(typeId, context) === undefined ? [] : ['mz', 'referenceMz', 'formula'];
}
