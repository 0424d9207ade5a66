// Reading numbers as typed on a phone: decimal comma or point, exponent as e-5 or ×10^-5, a typographic minus.
import { readNumber } from '../../../records';

export type Parsed = { ok: true; value: number } | { ok: false; message: string };

export function parseNumber(text: string, what: string): Parsed {
  const r = readNumber(text, (t) => t.replace(/[×x]10\^?/i, 'e').replace('−', '-'));
  if ('value' in r) return { ok: true, value: r.value };
  if (r.problem === 'empty') return { ok: false, message: `Enter ${what}.` };
  if (r.problem === 'not-a-number') return { ok: false, message: `${what} must be a number, e.g. 2.5 or 2.5e-5.` };
  return { ok: false, message: `${what} must be a finite number.` };
}
