import { describe, expect, it } from 'vitest'
import {
  CO2_CHI_BREAKPOINTS_CM,
  CO2_CHI_WING_WEIGHT,
  co2ChiCoefficients,
  co2ChiFactor,
} from '../../../../shared/physics/continuum/co2-chi-factor'
import { PhysicsError } from '../../../../shared/physics/errors'
import { expectRelativeClose } from '../../../support/expect-close'

// Check values: computed from the piecewise form and coefficients of Perrin & Hartmann 1989,
// JQSRT 42, 311 (from memory, low confidence) with Python 3 math.exp, 9 significant digits; they
// test the implementation of that form, not the (recalled) coefficients.

describe('co2ChiCoefficients', () => {
  it('when T = 296 K, returns B₁ = 0.0412599, B₂ = 0.0335419, B₃ = 0.0232', () => {
    const c = co2ChiCoefficients(296)
    // Perrin & Hartmann formulas, computed with Python math.exp (6 digits): 1e-5.
    expectRelativeClose(c.b1PerCm, 0.0412599, 1e-5)
    expectRelativeClose(c.b2PerCm, 0.0335419, 1e-5)
    expect(c.b3PerCm).toBe(0.0232)
  })

  it('when T is below 150 K (B₁ < 0 near 144 K) or above 800 K, throws PhysicsError', () => {
    expect(() => co2ChiCoefficients(140)).toThrow(PhysicsError)
    expect(() => co2ChiCoefficients(801)).toThrow(PhysicsError)
    expect(() => co2ChiCoefficients(NaN)).toThrow(PhysicsError)
  })
})

describe('co2ChiFactor', () => {
  it('when |Δν| ≤ σ₁ = 3 cm⁻¹, returns exactly 1', () => {
    // Definition (Perrin & Hartmann 1989): Lorentzian inside σ₁.
    for (const d of [0, 0.5, -2, 3, -3]) expect(co2ChiFactor(d, 296)).toBe(1)
  })

  it('when evaluated at 10, 30, 60, 120 and 200 cm⁻¹ at 296 K, returns the computed values', () => {
    // Python math.exp of the Perrin & Hartmann form (9 digits): 1e-8.
    const expected: [number, number][] = [
      [10, 0.749147626],
      [30, 0.328237785],
      [60, 0.11999866],
      [120, 0.0160380679],
      [200, 0.00250669496],
    ]
    for (const [d, chi] of expected) {
      expectRelativeClose(co2ChiFactor(d, 296), chi, 1e-8, `${d} cm⁻¹`)
      expectRelativeClose(co2ChiFactor(-d, 296), chi, 1e-8, `${-d} cm⁻¹`)
    }
  })

  it('when evaluated at 200 K, returns the computed values (weaker wing reduction than at 296 K)', () => {
    // Python math.exp of the Perrin & Hartmann form (9 digits): 1e-8.
    const expected: [number, number][] = [
      [10, 0.879574908],
      [30, 0.609610377],
      [60, 0.190275987],
      [120, 0.0185373327],
      [200, 0.00289732149],
    ]
    for (const [d, chi] of expected) {
      expectRelativeClose(co2ChiFactor(d, 200), chi, 1e-8, `${d} cm⁻¹`)
      expect(co2ChiFactor(d, 200)).toBeGreaterThan(co2ChiFactor(d, 296))
    }
    // 250 K lies between (same source): χ(30 cm⁻¹, 250 K) = 0.428442273.
    expectRelativeClose(co2ChiFactor(30, 250), 0.428442273, 1e-8)
  })

  it('when crossing σ₁, σ₂ and σ₃, is continuous', () => {
    // Continuity of the piecewise form (Perrin & Hartmann 1989): the jump over ±1e-9 cm⁻¹ is below
    // B_max · 2e-9 ≈ 2e-10 relative.
    const { sigma1, sigma2, sigma3 } = CO2_CHI_BREAKPOINTS_CM
    for (const temperatureK of [160, 200, 296, 500]) {
      for (const sigma of [sigma1, sigma2, sigma3]) {
        const below = co2ChiFactor(sigma - 1e-9, temperatureK)
        const above = co2ChiFactor(sigma + 1e-9, temperatureK)
        expectRelativeClose(above, below, 1e-9, `${sigma} cm⁻¹, ${temperatureK} K`)
      }
    }
  })

  it('when the detuning grows, never increases and stays in (0, 1]', () => {
    // Sub-Lorentzian wing: B₁, B₂, B₃ > 0 for T ≥ 150 K (Perrin & Hartmann 1989 form).
    for (const temperatureK of [150, 220, 296, 800]) {
      let previous = 1
      for (let d = 0; d <= 400; d += 0.5) {
        const chi = co2ChiFactor(d, temperatureK)
        expect(chi).toBeLessThanOrEqual(previous)
        expect(chi).toBeGreaterThan(0)
        previous = chi
      }
    }
  })

  it('when the detuning is not finite, throws PhysicsError', () => {
    expect(() => co2ChiFactor(NaN, 296)).toThrow(PhysicsError)
  })
})

describe('CO2_CHI_WING_WEIGHT', () => {
  it('when specialised to a temperature, returns co2ChiFactor at every detuning', () => {
    const weight = CO2_CHI_WING_WEIGHT.atTemperature(240)
    for (const d of [0, 3, 4.5, 29.9, 30, 75, 120, 121, 500]) {
      expect(weight(d)).toBe(co2ChiFactor(d, 240))
    }
    expect(CO2_CHI_WING_WEIGHT.onsetCm).toBe(3)
    expect(CO2_CHI_WING_WEIGHT.kinksCm).toEqual([3, 30, 120])
  })
})
