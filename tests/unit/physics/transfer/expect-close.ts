import { expect } from 'vitest'

/** Asserts |actual/expected − 1| ≤ tol (relative) and prints the error on failure. */
export function expectRelClose(actual: number, expected: number, tol: number, label = ''): void {
  const rel = expected === 0 ? Math.abs(actual) : Math.abs(actual / expected - 1)
  expect(
    rel,
    `${label} actual=${actual} expected=${expected} rel=${rel} tol=${tol}`,
  ).toBeLessThanOrEqual(tol)
}

/** Asserts |actual − expected| ≤ tol (absolute, for values that may be 0) with a message. */
export function expectAbsClose(actual: number, expected: number, tol: number, label = ''): void {
  const err = Math.abs(actual - expected)
  expect(
    err,
    `${label} actual=${actual} expected=${expected} abs=${err} tol=${tol}`,
  ).toBeLessThanOrEqual(tol)
}
