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

/** Asserts |actual − expected| ≤ tolerance (absolute, in the unit of the values). */
export function expectAbsoluteClose(
  actual: number,
  expected: number,
  tolerance: number,
  label = '',
): void {
  const error = Math.abs(actual - expected)
  expect(
    error,
    `${label} actual ${actual} expected ${expected}: |error| ${error.toExponential(3)} > ${tolerance}`,
  ).toBeLessThanOrEqual(tolerance)
}

/** Deterministic pseudo-random numbers in [0, 1) (mulberry32; common practice test PRNG). */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0
  return () => {
    state = (state + 0x6d2b79f5) >>> 0
    let t = state
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}
