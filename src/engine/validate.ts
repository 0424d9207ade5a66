// One validation helper for every public engine function: bad input throws InputRangeError naming the
// field, the value received and the accepted range, so the UI can place the message beside that field.

/** Thrown for any input outside the accepted range. `field` is the parameter name as the caller passed it. */
export class InputRangeError extends RangeError {
  readonly field: string;
  readonly value: unknown;
  readonly range: string;
  /** The numeric range refused against, where there is one (screens restate it in their own units). */
  readonly spec?: RangeSpec;
  constructor(field: string, value: unknown, range: string, spec?: RangeSpec) {
    super(`${field} = ${describe(value)} is out of range; accepted: ${range}`);
    this.name = 'InputRangeError';
    this.field = field;
    this.value = value;
    this.range = range;
    if (spec) this.spec = spec;
  }
}

function describe(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return JSON.stringify(value);
  if (value === undefined) return 'undefined';
  if (value === null) return 'null';
  return typeof value;
}

export interface RangeSpec {
  /** Lower limit (default −∞). */
  min?: number;
  /** Upper limit (default +∞). */
  max?: number;
  /** Exclude the lower limit itself (default false). */
  minExclusive?: boolean;
  /** Exclude the upper limit itself (default false). */
  maxExclusive?: boolean;
  /** Require an integer. */
  integer?: boolean;
  /** Unit shown in the message, e.g. "m". */
  unit?: string;
}

function rangeText(spec: RangeSpec): string {
  const unit = spec.unit ? ` ${spec.unit}` : '';
  const kind = spec.integer ? 'integer' : 'finite number';
  const lo = spec.min === undefined ? '' : `${spec.minExclusive ? '>' : '≥'} ${spec.min}${unit}`;
  const hi = spec.max === undefined ? '' : `${spec.maxExclusive ? '<' : '≤'} ${spec.max}${unit}`;
  if (lo && hi) return `${kind} ${lo} and ${hi}`;
  if (lo) return `${kind} ${lo}`;
  if (hi) return `${kind} ${hi}`;
  return `${kind}${unit ? ` (${unit.trim()})` : ''}`;
}

/** Returns `value` when it is a finite number inside `spec`; otherwise throws InputRangeError. */
export function checkNumber(field: string, value: unknown, spec: RangeSpec = {}): number {
  const ok =
    typeof value === 'number' &&
    Number.isFinite(value) &&
    (!spec.integer || Number.isInteger(value)) &&
    (spec.min === undefined || (spec.minExclusive ? value > spec.min : value >= spec.min)) &&
    (spec.max === undefined || (spec.maxExclusive ? value < spec.max : value <= spec.max));
  if (!ok) throw new InputRangeError(field, value, rangeText(spec), spec);
  return value as number;
}

/** A finite number > 0 (masses, lengths, frequencies, pressures, temperatures). */
export function checkPositive(field: string, value: unknown, unit?: string, max?: number): number {
  return checkNumber(field, value, { min: 0, minExclusive: true, unit, max });
}

/** One of a fixed set of string options. */
export function checkChoice<T extends string>(field: string, value: unknown, options: readonly T[]): T {
  if (typeof value !== 'string' || !(options as readonly string[]).includes(value)) {
    throw new InputRangeError(field, value, `one of ${options.map((o) => JSON.stringify(o)).join(', ')}`);
  }
  return value as T;
}
