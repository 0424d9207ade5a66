// Number formatting for the screen: units always, sensible significant figures, never "NaN".
import type { ReadbackConvention } from '../store';

/** Format a number with `digits` significant figures, switching to exponent form for very small or large values. */
export function formatNumber(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const abs = Math.abs(value);
  if (abs >= 1e6 || abs < 1e-3) {
    const [m, e] = value.toExponential(digits - 1).split('e');
    return `${m}×10${superscript(Number(e))}`;
  }
  return String(Number(value.toPrecision(digits)));
}

export function formatSi(value: number, unit: string, digits = 4): string {
  return `${formatNumber(value, digits)} ${unit}`;
}

const sup: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };
function superscript(n: number): string {
  return String(n).split('').map((c) => sup[c] ?? c).join('');
}

export function formatConvention(c: ReadbackConvention): string {
  const form = c.amplitude === 'zero-to-peak' ? 'zero-to-peak' : c.amplitude === 'peak-to-peak' ? 'peak-to-peak' : 'rms';
  return `${form}, ${c.reference === 'per-rod' ? 'one rod to ground' : 'between the rod pairs'}`;
}
