// Number formatting for the screen: units always, sensible significant figures, never "NaN". The formatter itself
// is the records layer's one formatter, in its screen style (m×10ⁿ).
import { conventionWords, formatNumber as formatAny } from '../records';

/** Format a number with `digits` significant figures, switching to exponent form for very small or large values. */
export function formatNumber(value: number, digits = 4): string {
  return formatAny(value, digits, 'screen');
}

/**
 * A chart axis number: up to 6 significant figures with trailing zeros dropped, 1.5×10⁻⁵ for very small or large
 * values. Built without Intl, so a chart never loads the browser's locale data.
 */
export function formatTick(value: number): string {
  return formatAny(value, 6, 'tick');
}

export function formatSi(value: number, unit: string, digits = 4): string {
  return `${formatNumber(value, digits)} ${unit}`;
}

/** An instrument's read-back convention in words. */
export const formatConvention = conventionWords;
