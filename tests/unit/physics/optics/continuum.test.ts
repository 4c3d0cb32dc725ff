import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  applyContinuumHooks,
  validateContinuumHooks,
  type ContinuumHook,
} from '../../../../shared/physics/optics/continuum'
import { singleLayer } from './synthetic-band'

const layer = singleLayer(50000, 250, 1e21)
const grid = new Float64Array([600, 700, 800])

describe('applyContinuumHooks', () => {
  it('when given two hooks, adds both optical depths to the output in order', () => {
    // Additivity of optical depths (Beer–Lambert, Goody & Yung 1989 §1.2, from memory).
    const calls: number[] = []
    const constant: ContinuumHook = (_nu, _layer, index, out) => {
      calls.push(index)
      for (let i = 0; i < out.length; i++) out[i] += 0.25
    }
    const linear: ContinuumHook = (nu, _layer, _index, out) => {
      calls.push(-1)
      for (let i = 0; i < out.length; i++) out[i] += nu[i] * 1e-3
    }
    const out = new Float64Array([1, 2, 3])
    applyContinuumHooks([constant, linear], grid, layer, 4, out)
    expect(Array.from(out)).toEqual([1 + 0.25 + 0.6, 2 + 0.25 + 0.7, 3 + 0.25 + 0.8])
    expect(calls).toEqual([4, -1])
  })

  it('when there are no hooks, leaves the output unchanged', () => {
    const out = new Float64Array([1, 2, 3])
    applyContinuumHooks([], grid, layer, 0, out)
    expect(Array.from(out)).toEqual([1, 2, 3])
  })

  it('when a hook produces NaN or negative optical depth, throws OUT_OF_RANGE naming the point', () => {
    const bad: ContinuumHook = (_nu, _layer, _index, out) => {
      out[1] = Number.NaN
    }
    const negative: ContinuumHook = (_nu, _layer, _index, out) => {
      out[2] -= 10
    }
    expect(() => applyContinuumHooks([bad], grid, layer, 0, new Float64Array(3))).toThrow(/700/)
    expect(() => applyContinuumHooks([negative], grid, layer, 0, new Float64Array(3))).toThrow(
      PhysicsError,
    )
  })

  it('when the output and grid lengths differ, throws INVALID_ARGUMENT', () => {
    expect(() => applyContinuumHooks([], grid, layer, 0, new Float64Array(2))).toThrow(/length/)
  })
})

describe('validateContinuumHooks', () => {
  it('when an entry is not a function, throws INVALID_ARGUMENT', () => {
    expect(() => validateContinuumHooks([1 as unknown as ContinuumHook])).toThrow(/hook 0/)
    expect(() => validateContinuumHooks('x' as unknown as ContinuumHook[])).toThrow(PhysicsError)
  })
})
