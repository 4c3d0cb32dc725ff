import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  HUMLICEK_MAX_RELATIVE_ERROR,
  HUMLICEK_MAX_RELATIVE_ERROR_K,
  WEIDEMAN_MAX_RELATIVE_ERROR,
  WEIDEMAN_MAX_RELATIVE_ERROR_K,
  faddeeva,
  faddeevaHumlicek,
  voigtK,
  voigtKAccurate,
  type Complex,
} from '../../../../shared/physics/spectroscopy/faddeeva'
import fixture from '../fixtures/faddeeva.json'
import { expectRelativeClose } from '../../../support/expect-close'

// w(x + iy) computed with SciPy's scipy.special.wofz (agrees with Abramowitz & Stegun Table 7.9
// to its 6 decimals, from memory). Columns x, y, Re w, Im w.
const REFERENCE_TABLE: readonly [number, number, number, number][] = [
  [0, 0, 1.0, 0],
  [0, 0.1, 0.89645697997, 0],
  [0, 1, 0.42758357616, 0],
  [0, 10, 0.056140992744, 0],
  [0.5, 0.5, 0.53315670791, 0.23048823138],
  [1, 0.1, 0.37317014831, 0.53855480786],
  [1, 1, 0.3047442052, 0.2082189382],
  [2, 0.1, 0.040201398161, 0.33158268733],
  [3, 1, 0.065317777289, 0.17391831542],
  [5, 0.01, 2.4080339195e-4, 0.1152454462],
  [10, 1, 5.6699425669e-3, 0.056129645316],
]

type Algorithm = (x: number, y: number) => Complex
const points = fixture.points as [number, number, number, number][]

function complexRelativeError(w: Complex, re: number, im: number): number {
  return Math.hypot(w.re - re, w.im - im) / Math.hypot(re, im)
}

function maxErrors(algorithm: Algorithm, minY: number) {
  let complexMax = 0
  let kMax = 0
  for (const [x, y, re, im] of points) {
    const w = algorithm(x, y)
    complexMax = Math.max(complexMax, complexRelativeError(w, re, im))
    if (y >= minY) kMax = Math.max(kMax, Math.abs(w.re - re) / re)
  }
  return { complexMax, kMax }
}

describe('faddeeva (Weideman 1994, accurate)', () => {
  it('when evaluated at the check points, returns the scipy values to 1e-9', () => {
    for (const [x, y, re, im] of REFERENCE_TABLE) {
      const w = faddeeva(x, y)
      // Table values have 11 significant digits: relative tolerance 1e-9 (components compared
      // against |w| so that the zero imaginary parts are covered).
      expect(Math.abs(w.re - re) / Math.hypot(re, im), `Re w(${x}, ${y})`).toBeLessThan(1e-9)
      expect(Math.abs(w.im - im) / Math.hypot(re, im), `Im w(${x}, ${y})`).toBeLessThan(1e-9)
    }
  })

  it('when compared with the scipy.special.wofz fixture, returns the stated maximum errors', () => {
    // Fixture: scripts/fixtures/faddeeva.py with scipy.special.wofz; 1332 points.
    expect(points.length).toBe(1332)
    expect(fixture.reference).toBe('scipy.special.wofz')
    const all = maxErrors(faddeeva, 1e-6)
    expect(all.complexMax).toBeLessThanOrEqual(WEIDEMAN_MAX_RELATIVE_ERROR)
    expect(all.kMax).toBeLessThanOrEqual(WEIDEMAN_MAX_RELATIVE_ERROR_K)
    // The figures quoted in the faddeeva.ts header for larger y (measured 4.9e-11 and 6.4e-13).
    expect(maxErrors(faddeeva, 1e-4).kMax).toBeLessThanOrEqual(6e-11)
    expect(maxErrors(faddeeva, 1e-2).kMax).toBeLessThanOrEqual(1e-12)
  })

  it('when x changes sign, returns the complex conjugate', () => {
    // Symmetry w(−x + iy) = conj w(x + iy) (Abramowitz & Stegun 7.1.12, from memory).
    for (const [x, y] of [
      [0.7, 0.01],
      [3, 2],
      [12, 1e-5],
      [80, 3],
    ]) {
      const plus = faddeeva(x, y)
      const minus = faddeeva(-x, y)
      expect(minus.re).toBe(plus.re)
      expect(minus.im).toBe(-plus.im)
    }
  })

  it('when |z| is huge, returns the finite asymptotic value i/(√π z)', () => {
    // Leading term of the asymptotic series (Abramowitz & Stegun 7.1.23, from memory).
    const w = faddeeva(1e200, 1)
    expectRelativeClose(w.im, 1 / (Math.sqrt(Math.PI) * 1e200), 1e-14)
    expect(Number.isFinite(w.re)).toBe(true)
    const big = faddeeva(0, 1e300)
    expectRelativeClose(big.re, 1 / (Math.sqrt(Math.PI) * 1e300), 1e-14)
  })

  it('when y is negative or an argument is not finite, throws OUT_OF_RANGE', () => {
    expect(() => faddeeva(1, -1e-12)).toThrow(PhysicsError)
    expect(() => faddeeva(Number.NaN, 1)).toThrow(/Faddeeva/)
    expect(() => faddeeva(1, Number.POSITIVE_INFINITY)).toThrow(PhysicsError)
    expect(() => voigtKAccurate(Number.POSITIVE_INFINITY, 1)).toThrow(PhysicsError)
  })
})

describe('faddeevaHumlicek (Humlíček 1982, fast)', () => {
  it('when evaluated at the check points, returns the scipy values to 1e-4', () => {
    for (const [x, y, re, im] of REFERENCE_TABLE) {
      const w = faddeevaHumlicek(x, y)
      expect(complexRelativeError(w, re, im), `w(${x}, ${y})`).toBeLessThan(1e-4)
      expectRelativeClose(voigtK(x, y), re, 1e-4, `K(${x}, ${y})`)
    }
  })

  it('when compared with the scipy.special.wofz fixture, returns the stated maximum errors', () => {
    const { complexMax, kMax } = maxErrors(faddeevaHumlicek, 1e-6)
    expect(complexMax).toBeLessThanOrEqual(HUMLICEK_MAX_RELATIVE_ERROR)
    expect(kMax).toBeLessThanOrEqual(HUMLICEK_MAX_RELATIVE_ERROR_K)
  })

  it('when crossing the region boundaries, returns values continuous to the stated accuracy', () => {
    // Region I/II at |x| + y = 15 and 5.5, region III/IV on y = 0.195|x| − 0.176 (Humlíček 1982).
    const eps = 1e-9
    const pairs: [number, number][] = [
      [15, 0.5],
      [5.5, 0.3],
      [3, 0.195 * 3 - 0.176],
    ]
    for (const [s, y] of pairs) {
      const x = s - y
      const before = faddeevaHumlicek(x - eps, y)
      const after = faddeevaHumlicek(x + eps, y)
      const jump =
        Math.hypot(after.re - before.re, after.im - before.im) / Math.hypot(before.re, before.im)
      expect(jump, `jump at x = ${x}, y = ${y}`).toBeLessThan(2 * HUMLICEK_MAX_RELATIVE_ERROR)
    }
  })

  it('when y = 0 and |x| ≤ 5, returns K = exp(−x²) to 1e-4', () => {
    // K(x, 0) = exp(−x²) (Abramowitz & Stegun 7.1.3 on the real axis, analytic).
    for (const x of [0, 0.3, 1, 2, 3.5, 5]) {
      expectRelativeClose(voigtK(x, 0), Math.exp(-x * x), 1e-4, `x = ${x}`)
    }
  })

  it('when |z| is huge, returns a finite value close to i/(√π z)', () => {
    const w = faddeevaHumlicek(-1e250, 2)
    expectRelativeClose(w.im, -1 / (Math.sqrt(Math.PI) * 1e250), 1e-14)
  })

  it('when y is negative or NaN, throws OUT_OF_RANGE', () => {
    expect(() => voigtK(0, -1)).toThrow(PhysicsError)
    expect(() => faddeevaHumlicek(0, Number.NaN)).toThrow(PhysicsError)
  })
})
