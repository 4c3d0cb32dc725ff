import { expect } from 'vitest'

/** Relative difference |actual − expected| / |expected| (absolute when expected is 0). */
export function relativeError(actual: number, expected: number): number {
  const difference = Math.abs(actual - expected)
  return expected === 0 ? difference : difference / Math.abs(expected)
}

/** Asserts a relative difference within `tolerance`, printing both values and the error. */
export function expectRelativeClose(
  actual: number,
  expected: number,
  tolerance: number,
  label = '',
): void {
  const error = relativeError(actual, expected)
  expect(
    error,
    `${label} actual ${actual} expected ${expected}: relative error ${error.toExponential(3)} > ${tolerance}`,
  ).toBeLessThanOrEqual(tolerance)
}

/** Asserts |actual − expected| ≤ tolerance (absolute, e.g. cm⁻¹), printing the difference. */
export function expectAbsoluteClose(
  actual: number,
  expected: number,
  tolerance: number,
  label = '',
): void {
  const difference = Math.abs(actual - expected)
  expect(
    difference,
    `${label} actual ${actual} expected ${expected}: |difference| ${difference.toExponential(3)} > ${tolerance}`,
  ).toBeLessThanOrEqual(tolerance)
}
