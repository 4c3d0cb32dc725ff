import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  integrateWithWeights,
  trapezoidWeightsCm,
} from '../../../../shared/physics/transfer/spectral-integration'
import { expectRelClose } from './expect-close'

describe('trapezoidWeightsCm', () => {
  it('when the grid is nonuniform, integrates a linear function exactly (rel 1e-15)', () => {
    // Trapezoid rule is exact for linear integrands: ∫₅₀₀^₇₀₀ (2ν + 3) dν = 700² − 500² + 3·200.
    const nu = Float64Array.of(500, 510, 530, 600, 601, 700)
    const w = trapezoidWeightsCm(nu, new Float64Array(6))
    const f = nu.map((v) => 2 * v + 3)
    expectRelClose(integrateWithWeights(f, w), 700 ** 2 - 500 ** 2 + 600, 1e-15)
  })

  it('when the grid is split into disjoint chunks, the chunk weights add to the full weights', () => {
    const nu = Float64Array.from({ length: 10 }, (_, i) => 100 + i * i)
    const full = trapezoidWeightsCm(nu, new Float64Array(10))
    const a = trapezoidWeightsCm(nu, new Float64Array(4), 0, 4)
    const b = trapezoidWeightsCm(nu, new Float64Array(6), 4, 10)
    expect([...a, ...b]).toEqual(Array.from(full))
  })

  it('when the grid is not increasing or the chunk is out of range, throws PhysicsError', () => {
    expect(() => trapezoidWeightsCm(Float64Array.of(1, 1, 2), new Float64Array(3))).toThrow(
      PhysicsError,
    )
    expect(() => trapezoidWeightsCm(Float64Array.of(1, 2), new Float64Array(3), 0, 3)).toThrow(
      PhysicsError,
    )
  })
})
