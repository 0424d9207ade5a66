// Tolerance checks whose failure message prints the input, the difference and the tolerance.
import { expect } from 'vitest';

/** |actual − expected| ≤ tolerance · max(1, |expected|) when `relative`, else ≤ tolerance. */
export function expectClose(
  actual: number,
  expected: number,
  tolerance: number,
  input: string,
  mode: 'absolute' | 'relative' | 'mixed' = 'absolute',
): void {
  const difference = Math.abs(actual - expected);
  const scale = mode === 'absolute' ? 1 : mode === 'relative' ? Math.abs(expected) : Math.max(1, Math.abs(expected));
  const ok = Number.isFinite(actual) && difference <= tolerance * scale;
  expect(
    ok,
    `${input}: got ${actual}, expected ${expected}, |Δ| = ${difference.toExponential(3)}, tolerance ${tolerance} (${mode})`,
  ).toBe(true);
}
