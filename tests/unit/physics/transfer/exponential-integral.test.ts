import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  exponentialIntegralEn,
  fluxTransmittance,
} from '../../../../shared/physics/transfer/exponential-integral'
import fixture from '../fixtures/transfer-reference.json'
import { expectRelClose } from './expect-close'

describe('exponentialIntegralEn', () => {
  // Computed with mpmath (general-purpose reference library), rounded as printed; Abramowitz &
  // Stegun Table 5.1 tabulates the same functions (from memory).
  const table: [number, number, number, number][] = [
    [0.01, 4.037929577, 0.949670538, 0.490276564],
    [0.1, 1.822923958, 0.722545022, 0.416291458],
    [0.5, 0.559773595, 0.326643862, 0.221604364],
    [1, 0.219383934, 0.148495507, 0.109691967],
    [2, 0.048900511, 0.037534262, 0.03013338],
    [5, 1.148296e-3, 9.96469e-4, 8.778009e-4],
  ]
  it.each(table)(
    'when x = %f, returns the mpmath E₁, E₂, E₃ to the printed digits',
    (x, e1, e2, e3) => {
      // The table is rounded to 9 decimal places (absolute 5e-10): relative tolerance 6e-10/value.
      expectRelClose(exponentialIntegralEn(1, x), e1, 6e-10 / e1, 'E1')
      expectRelClose(exponentialIntegralEn(2, x), e2, 6e-10 / e2, 'E2')
      expectRelClose(exponentialIntegralEn(3, x), e3, 6e-10 / e3, 'E3')
    },
  )

  it('when n = 1…4 over 1e-8 ≤ x ≤ 500, matches mpmath expint (rel 1e-14)', () => {
    // mpmath 1.2.1 expint(n, x) at 30 digits (fixture transfer-reference.json).
    expect(fixture.expint).toHaveLength(68)
    for (const row of fixture.expint) {
      expectRelClose(exponentialIntegralEn(row.n, row.x), row.value, 1e-14, `E${row.n}(${row.x})`)
    }
  })

  it('when x = 0, returns 1/(n − 1) for n ≥ 2 and throws for n ≤ 1', () => {
    // A&S 5.1.23: Eₙ(0) = 1/(n − 1), so E₃(0) = 1/2, E₂(0) = 1.
    expect(exponentialIntegralEn(2, 0)).toBe(1)
    expect(exponentialIntegralEn(3, 0)).toBe(0.5)
    expect(exponentialIntegralEn(4, 0)).toBeCloseTo(1 / 3, 15)
    expect(() => exponentialIntegralEn(1, 0)).toThrow(PhysicsError)
  })

  it('when applied across the series/continued-fraction switch, satisfies n Eₙ₊₁ = e⁻ˣ − x Eₙ (rel 1e-14)', () => {
    // Recurrence A&S 5.1.14.
    for (const x of [0.2, 0.999999, 1, 1.000001, 3.7, 40]) {
      for (let n = 1; n <= 3; n++) {
        const lhs = n * exponentialIntegralEn(n + 1, x)
        const rhs = Math.exp(-x) - x * exponentialIntegralEn(n, x)
        expectRelClose(lhs, rhs, 1e-13, `n=${n} x=${x}`)
      }
    }
  })

  it('when the order or argument is invalid, throws PhysicsError', () => {
    expect(() => exponentialIntegralEn(-1, 1)).toThrow(PhysicsError)
    expect(() => exponentialIntegralEn(1.5, 1)).toThrow(PhysicsError)
    expect(() => exponentialIntegralEn(2, -0.1)).toThrow(PhysicsError)
    expect(() => exponentialIntegralEn(2, Number.NaN)).toThrow(PhysicsError)
  })
})

describe('fluxTransmittance', () => {
  it('when τ is given, returns 2E₃(τ) as tabulated from mpmath (5 decimals, rel 1e-4)', () => {
    // Flux transmittance 2E₃(τ) computed with mpmath (5 digits).
    const table: [number, number][] = [
      [0.01, 0.98055],
      [0.1, 0.83258],
      [0.5, 0.44321],
      [1, 0.21938],
      [2, 0.06027],
    ]
    for (const [tau, t] of table) expectRelClose(fluxTransmittance(tau), t, 1e-4, `tau=${tau}`)
    expect(fluxTransmittance(0)).toBe(1)
  })
})
