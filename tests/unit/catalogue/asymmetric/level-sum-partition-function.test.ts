import { describe, expect, it } from 'vitest'
import { C2_CM_K } from '../../../../shared/physics/constants'
import { PhysicsError } from '../../../../shared/physics/errors'
import { defaultPartitionFunctionLookup } from '../../../../shared/physics/spectroscopy/partition-function'
import { createLevelSumPartitionFunction } from '../../../../shared/catalogue/asymmetric/level-sum-partition-function'
import { createWaterPartitionFunction } from '../../../../shared/catalogue/asymmetric/water'
import { createMethanePartitionFunction } from '../../../../shared/catalogue/asymmetric/methane'
import { expectRelativeClose } from '../../../support/expect-close'

describe('createLevelSumPartitionFunction', () => {
  it('when given two levels and one vibrational level, returns (g₀ + g₁e^{−c₂E₁/T})(1 + e^{−c₂G/T})', () => {
    // Definition of the level sum (Herzberg 1945, ch. V); relative tolerance 1e-14.
    const q = createLevelSumPartitionFunction([10, 0], [3, 1], [{ energyCm: 500, degeneracy: 1 }])
    const t = 250
    const expected = (1 + 3 * Math.exp((-C2_CM_K * 10) / t)) * (1 + Math.exp((-C2_CM_K * 500) / t))
    expectRelativeClose(q(t), expected, 1e-14)
  })

  it('when given mismatched arrays, a negative energy or T outside 50–500 K, throws PhysicsError', () => {
    expect(() => createLevelSumPartitionFunction([0, 1], [1], [])).toThrow(PhysicsError)
    expect(() => createLevelSumPartitionFunction([-1], [1], [])).toThrow(PhysicsError)
    const q = createLevelSumPartitionFunction([0], [1], [])
    expect(() => q(49)).toThrow(PhysicsError)
    expect(() => q(501)).toThrow(PhysicsError)
  })
})

describe('level sums against the rigid-rotor power law', () => {
  it('when evaluated at 200–350 K, agree with Q(296)(T/296)^1.5 Q_vib scaling within 1 %', () => {
    // Independent approximation: the classical nonlinear-rotor T^1.5 law scaled to the published
    // Q(296) (shared/physics/spectroscopy approximatePartitionFunction). Measured within 0.5 %.
    for (const [moleculeId, create] of [
      [1, createWaterPartitionFunction],
      [6, createMethanePartitionFunction],
    ] as const) {
      const levelSum = create()
      const approximate = defaultPartitionFunctionLookup(moleculeId, 1)
      for (const t of [200, 250, 296, 350]) {
        expectRelativeClose(levelSum(t), approximate(t), 0.01, `molecule ${moleculeId} ${t} K`)
      }
    }
  })
})
