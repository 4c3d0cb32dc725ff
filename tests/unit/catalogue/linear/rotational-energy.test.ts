import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { CO2_626_LEVELS } from '../../../../shared/catalogue/constants/linear-levels'
import {
  rotationalTermCm,
  rovibrationalEnergyCm,
  sublevelRotationalConstantCm,
} from '../../../../shared/catalogue/linear/rotational-energy'
import { expectAbsoluteClose } from '../../../support/expect-close'

// CO2 constants of Rothman et al. 1992, JQSRT 48, 537 (from memory): B₀ = 0.3902189,
// D₀ = 1.333e-7; 01101: G = 667.3799 (confirmed against an independent listing), B_e = 0.390639,
// B_f = 0.391254.
describe('rovibrationalEnergyCm', () => {
  it('when the level is the ground state, returns B J(J+1) − D [J(J+1)]²', () => {
    const x = 20 * 21
    expectAbsoluteClose(
      rovibrationalEnergyCm(CO2_626_LEVELS.L00001, 20, 'e'),
      0.3902189 * x - 1.333e-7 * x * x,
      1e-9,
    )
    expect(rovibrationalEnergyCm(CO2_626_LEVELS.L00001, 0, 'e')).toBe(0)
  })

  it('when the level is 01101, returns G + B_e/f J(J+1) − D[J(J+1) − 1]² for e and f', () => {
    const x = 5 * 6
    const d = 1.35e-7 * (x - 1) ** 2
    expectAbsoluteClose(
      rovibrationalEnergyCm(CO2_626_LEVELS.L01101, 5, 'e'),
      667.3799 + 0.390639 * x - d,
      1e-9,
    )
    expectAbsoluteClose(
      rovibrationalEnergyCm(CO2_626_LEVELS.L01101, 5, 'f'),
      667.3799 + 0.391254 * x - d,
      1e-9,
    )
  })

  it('when J = l, returns the rotational term F(l) = B l (Herzberg 1945, ch. IV, from memory)', () => {
    expectAbsoluteClose(
      rotationalTermCm(CO2_626_LEVELS.L03301, 3, 'e'),
      3 * CO2_626_LEVELS.L03301.rotationalConstantCm - 1.4e-7 * 9,
      1e-12,
    )
    expect(sublevelRotationalConstantCm(CO2_626_LEVELS.L02201, 'f')).toBe(0.39166)
  })

  it('when J < l, J is not an integer or a Σ level is asked for f, throws PhysicsError', () => {
    expect(() => rovibrationalEnergyCm(CO2_626_LEVELS.L01101, 0, 'e')).toThrow(PhysicsError)
    expect(() => rovibrationalEnergyCm(CO2_626_LEVELS.L00001, 1.5, 'e')).toThrow(PhysicsError)
    expect(() => rovibrationalEnergyCm(CO2_626_LEVELS.L00001, 2, 'f')).toThrow(PhysicsError)
  })
})
