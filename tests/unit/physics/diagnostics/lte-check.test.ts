import { describe, expect, it } from 'vitest'
import {
  co2BendingVtRateCoefficientCm3PerS,
  lteCheck,
} from '../../../../shared/physics/diagnostics/lte-check'
import { PhysicsError } from '../../../../shared/physics/errors'
import { expectRelClose } from '../transfer/expect-close'

describe('co2BendingVtRateCoefficientCm3PerS', () => {
  it('when T = 295 K and 200 K, returns 3.5e-15 and 1.4e-15 cm³ s⁻¹ (rel 3 %)', () => {
    // Values computed by hand from the fit 7e-17√T + 6.7e-10 e^{−83.8 T^{−1/3}} (López-Puertas &
    // Taylor 2001, after Siddles, Wilson & Simpson 1994; from memory, low confidence),
    // printed to 2 digits (hence 3 %).
    expectRelClose(co2BendingVtRateCoefficientCm3PerS(295), 3.5e-15, 0.03)
    expectRelClose(co2BendingVtRateCoefficientCm3PerS(200), 1.4e-15, 0.03)
  })
})

describe('lteCheck', () => {
  it('when p = 1000 hPa and T = 295 K, returns a ratio between 1e4 and 1e5 and no flag', () => {
    // Common practice: the lower atmosphere is deep in LTE for the 15 µm band (k·n ≈ 1e5 s⁻¹ vs
    // A ≈ 1.5 s⁻¹, computed from the band intensity).
    const r = lteCheck([100000], [295])
    expect(r.ratio[0]).toBeGreaterThan(1e4)
    expect(r.ratio[0]).toBeLessThan(1e5)
    expect(r.nonLteRisk[0]).toBe(0)
    // n = p/(kT) = 2.455e19 cm⁻³ (ideal gas, CODATA k_B).
    expectRelClose(r.airNumberDensityPerCm3[0], 100000 / (1.380649e-23 * 295) / 1e6, 1e-14)
  })

  it('when given US76 levels, flags non-LTE in the upper mesosphere and puts k·n = A near 70–75 km', () => {
    // U.S. Standard Atmosphere 1976 layer bases (geopotential km′): 0, 11, 32, 47, 51, 71 and
    // 84.852 (T_M 186.946 K). LTE breakdown (k·n = A) ≈ 70–75 km (crossover computed by hand;
    // "~70 km" in the non-LTE literature, from memory). With this k_VT the ratio < 10 flag already
    // trips between 51 and 71 km′ (order-of-magnitude diagnostic).
    const p = [101325, 22632.06, 868.0187, 110.9063, 66.93887, 3.95642, 0.37338]
    const t = [288.15, 216.65, 228.65, 270.65, 270.65, 214.65, 186.946]
    const r = lteCheck(p, t)
    expect(Array.from(r.nonLteRisk)).toEqual([0, 0, 0, 0, 0, 1, 1])
    expect(r.ratio[4]).toBeGreaterThan(10) // 51 km′
    expect(r.ratio[5]).toBeGreaterThan(1) // 71 km′: collisions still faster than emission
    expect(r.ratio[5]).toBeLessThan(10)
    expect(r.ratio[6]).toBeLessThan(1) // 84.9 km′: radiative decay wins
  })

  it('when atomic oxygen is supplied, adds k_O·n_O to the collision rate', () => {
    // k_O = 1.8e-12 cm³ s⁻¹ (Castle et al. 2006, JGR 111, A09303).
    const base = lteCheck([0.37338], [186.946])
    const withO = lteCheck([0.37338], [186.946], { atomicOxygenPerCm3: [1e11] })
    expectRelClose(withO.collisionRatePerS[0] - base.collisionRatePerS[0], 1.8e-12 * 1e11, 1e-12)
  })

  it('when pressure is not positive or lengths differ, throws PhysicsError', () => {
    expect(() => lteCheck([0], [200])).toThrow(PhysicsError)
    expect(() => lteCheck([100, 10], [200])).toThrow(PhysicsError)
    expect(() => lteCheck([100], [0])).toThrow(PhysicsError)
  })
})
