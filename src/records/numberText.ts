// Numbers as text: the one reader of typed numbers and the one formatter, for screens, messages, CSV and reports.

/** What reading typed text as a number gave: the value, or why there is none. */
export type NumberReading = { value: number } | { problem: 'empty' | 'not-a-number' | 'too-large' };

/**
 * Read a number as typed on a phone: spaces dropped, a decimal comma ("4,5") and exponent forms ("1e-5")
 * accepted. `extraForms` rewrites screen-specific spellings (e.g. "×10^-5") on the compacted text before the
 * check. The one number reader behind the profile form, the visit log and the screens.
 */
export function readNumber(text: string, extraForms?: (compact: string) => string): NumberReading {
  let t = text.trim().replace(/\s+/g, '').replace(',', '.');
  if (extraForms) t = extraForms(t);
  if (t === '') return { problem: 'empty' };
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(t)) return { problem: 'not-a-number' };
  const v = Number(t);
  return Number.isFinite(v) ? { value: v } : { problem: 'too-large' };
}

/** A finite number as typed in the field, or null (see readNumber). */
export function parseNumber(text: string): number | null {
  const r = readNumber(text);
  return 'value' in r ? r.value : null;
}

/**
 * How a very small or large number is written: 'text' as 1.5e-5 (messages, CSV, reports: plain characters,
 * trailing zeros dropped), 'screen' as 1.500×10⁻⁵ (screens and diagnosis sentences: the significant figures stay),
 * 'tick' as 1.5×10⁻⁵ (chart axis numbers: screen characters, trailing zeros dropped).
 */
export type NumberStyle = 'text' | 'screen' | 'tick';

const SUPERSCRIPT: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

/**
 * The one number formatter: `digits` significant figures, exponent form below 10⁻³ and from 10⁶ up, never NaN
 * (a non-finite value shows as "—").
 */
export function formatNumber(x: number, digits = 4, style: NumberStyle = 'text'): string {
  if (!Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a < 1e-3 || a >= 1e6) {
    const [m, e] = x.toExponential(digits - 1).split('e');
    if (style !== 'text') return `${style === 'tick' ? String(Number(m)) : m}×10${[...String(Number(e))].map((c) => SUPERSCRIPT[c] ?? c).join('')}`;
    return `${String(Number(m))}e${e.startsWith('+') ? e.slice(1) : e}`;
  }
  return String(Number(x.toPrecision(digits)));
}
