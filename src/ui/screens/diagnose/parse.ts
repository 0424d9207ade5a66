// Reading numbers as typed on a phone: decimal comma or point, exponent as e-5 or ×10^-5.

export type Parsed = { ok: true; value: number } | { ok: false; message: string };

const NUMBER = /^[-+]?(\d+([.]\d*)?|[.]\d+)(e[-+]?\d+)?$/i;

export function parseNumber(text: string, what: string): Parsed {
  const t = text.trim().replace(/\s+/g, '').replace(',', '.').replace(/[×x]10\^?/i, 'e').replace('−', '-');
  if (t === '') return { ok: false, message: `Enter ${what}.` };
  if (!NUMBER.test(t)) return { ok: false, message: `${what} must be a number, e.g. 2.5 or 2.5e-5.` };
  const v = Number(t);
  if (!Number.isFinite(v)) return { ok: false, message: `${what} must be a finite number.` };
  return { ok: true, value: v };
}
