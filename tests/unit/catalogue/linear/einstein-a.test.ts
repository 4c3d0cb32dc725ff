import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { einsteinAFromIntensity } from '../../../../shared/catalogue/linear/einstein-a'
import { expectRelativeClose } from '../../../support/expect-close'

describe('einsteinAFromIntensity', () => {
  it('when given the CO2 ν₂ band numbers, returns A ≈ 1.52 s⁻¹', () => {
    // Computed by hand: A = 8πcν²S Q_v/((g_u/g_l)(1 − e^{−c₂ν/T})) with S = 7.9e-18 per
    // 626 molecule (÷ abundance 0.984204), ν = 667.38, Q_v = 1.0845, g_u/g_l = 2 → 1.52 s⁻¹.
    // Same relation with E″ = 0, g′ = 2, Q = 1.0845, I_a = 0.984204:
    const a = einsteinAFromIntensity(7.9e-18, 667.38, 0, 2, 0.984204, 1.0845, 296)
    expectRelativeClose(a, 1.52, 5e-3, 'band A')
  })

  it('when inverted with the intensity formula, returns the same intensity (Šimečková 2006 eq. 20)', () => {
    const c2 = 1.438776877 // cm K, CODATA 2018 (Tiesinga et al. 2021, Rev. Mod. Phys. 93, 025010)
    const c = 29979245800 // cm s⁻¹, exact
    const [s, nu, e, g, ia, q, t] = [3.1e-19, 700, 120, 41, 0.984204, 286.09, 296]
    const a = einsteinAFromIntensity(s, nu, e, g, ia, q, t)
    const back =
      (g * a * ia * Math.exp((-c2 * e) / t) * (1 - Math.exp((-c2 * nu) / t))) /
      (8 * Math.PI * c * nu * nu * q)
    expectRelativeClose(back, s, 1e-9)
  })

  it('when an argument is out of range, throws PhysicsError', () => {
    expect(() => einsteinAFromIntensity(-1, 700, 0, 1, 1, 1, 296)).toThrow(PhysicsError)
    expect(() => einsteinAFromIntensity(1e-19, 0, 0, 1, 1, 1, 296)).toThrow(PhysicsError)
    expect(() => einsteinAFromIntensity(1e-19, 700, 0, 1, 1.5, 1, 296)).toThrow(PhysicsError)
    expect(() => einsteinAFromIntensity(1e-19, 700, 1e6, 1, 1, 1, 296)).toThrow(PhysicsError)
  })
})
