import { formatNumber } from '../records/numberText';
import type { Tolerance, Verdict } from './types';

export interface Judgement {
  verdict: Verdict;
  /** Which side of the expected value a borderline or failing reading lies on. */
  side?: 'low' | 'high';
  /** Limits actually used, in the node's unit (±Infinity where open). */
  passLow: number;
  passHigh: number;
  borderLow: number;
  borderHigh: number;
}

export interface ExpectedInUnit {
  value?: number;
  low?: number;
  high?: number;
}

/** Plain words for a limit pair, e.g. "95–105 V" or "at most 2.7e+3 V". */
export function describeLimits(low: number, high: number, unit: string): string {
  const f = (x: number) => formatNumber(x);
  if (Number.isFinite(low) && Number.isFinite(high)) return `${f(low)} to ${f(high)} ${unit}`;
  if (Number.isFinite(high)) return `at most ${f(high)} ${unit}`;
  if (Number.isFinite(low)) return `at least ${f(low)} ${unit}`;
  return `any value (${unit})`;
}

function limits(expected: ExpectedInUnit, tol: Tolerance): [number, number, number, number] {
  const v = expected.value;
  switch (tol.kind) {
    case 'relative': {
      if (v === undefined) throw new RangeError('a relative tolerance needs an expected value');
      const a = Math.abs(v);
      return [v - tol.pass * a, v + tol.pass * a, v - tol.borderline * a, v + tol.borderline * a];
    }
    case 'absolute': {
      if (v === undefined) throw new RangeError('an absolute tolerance needs an expected value');
      return [v - tol.pass, v + tol.pass, v - tol.borderline, v + tol.borderline];
    }
    case 'decades': {
      if (v === undefined || !(v > 0)) throw new RangeError('a tolerance in decades needs an expected value above 0');
      return [v / 10 ** tol.pass, v * 10 ** tol.pass, v / 10 ** tol.borderline, v * 10 ** tol.borderline];
    }
    case 'range': {
      const lo = expected.low ?? (expected.high === undefined ? v : undefined) ?? Number.NEGATIVE_INFINITY;
      const hi = expected.high ?? (expected.low === undefined ? v : undefined) ?? Number.POSITIVE_INFINITY;
      if (tol.outer) return [lo, hi, Math.min(lo, tol.outer.low), Math.max(hi, tol.outer.high)];
      if (tol.log) {
        const k = 10 ** tol.borderline;
        return [lo, hi, lo / k, hi * k];
      }
      const span = Number.isFinite(lo) && Number.isFinite(hi) && hi > lo ? hi - lo : Number.NaN;
      const widen = (bound: number) => (Number.isFinite(span) ? tol.borderline * span : tol.borderline * Math.abs(bound));
      return [lo, hi, lo - (Number.isFinite(lo) ? widen(lo) : 0), hi + (Number.isFinite(hi) ? widen(hi) : 0)];
    }
  }
}

/** Judge a measured value against an expected value and tolerance: pass, borderline or fail. */
export function judge(measured: number, expected: ExpectedInUnit, tol: Tolerance): Judgement {
  if (!Number.isFinite(measured)) throw new RangeError(`measured value must be a finite number; got ${measured}`);
  const [passLow, passHigh, borderLow, borderHigh] = limits(expected, tol);
  const base = { passLow, passHigh, borderLow, borderHigh };
  if (measured >= passLow && measured <= passHigh) return { verdict: 'pass', ...base };
  const side = measured < passLow ? 'low' : 'high';
  if (measured >= borderLow && measured <= borderHigh) return { verdict: 'borderline', side, ...base };
  return { verdict: 'fail', side, ...base };
}
