// Reading typed values for the scan screens (numbers go through the one number parser of the bench inputs).
import { parseNumber, type Parsed } from '../bench/inputs';

/** A charge number as typed: a non-zero whole number from −100 to 100 (the spectrum module's range). */
export function readCharge(text: string, label: string): Parsed {
  const r = parseNumber(text.replace('−', '-').replace(/^\+/, ''), label, '1');
  if (!r.ok) return r;
  if (!Number.isInteger(r.value) || r.value === 0 || Math.abs(r.value) > 100) {
    return { ok: false, message: `${label}: ${text.trim()} is out of range; enter a non-zero whole number from −100 to 100.` };
  }
  return r;
}

/** A number in a range, with a message naming the field and the range. */
export function readInRange(text: string, label: string, min: number, max: number, unit: string, example: string): Parsed {
  const r = parseNumber(text.replace('−', '-'), label, example);
  if (!r.ok) return r;
  if (!(r.value >= min && r.value <= max)) return { ok: false, message: `${label}: ${text.trim()} is out of range; enter ${min} to ${max}${unit ? ' ' + unit : ''}.` };
  return r;
}
