import { describe, expect, it } from 'vitest'
import { buildContinuumHooks } from '../../../../shared/physics/continuum/continuum-hooks'
import { addWaterContinuumOpticalDepth } from '../../../../shared/physics/continuum/water-vapour-continuum'
import { PhysicsError } from '../../../../shared/physics/errors'
import type { AtmosphereLayer } from '../../../../shared/physics/types'

const layer: AtmosphereLayer = {
  pressureBottomPa: 101325,
  pressureTopPa: 89875,
  heightBottomM: 0,
  heightTopM: 1000,
  meanPressurePa: 95500,
  meanTemperatureK: 285,
  airColumnMoleculesPerCm2: 2.4e24,
  gasColumnMoleculesPerCm2: { H2O: 3e22 },
  meanVmr: { H2O: 0.012 },
}

describe('buildContinuumHooks', () => {
  it('when water vapour is off, returns no hooks', () => {
    expect(buildContinuumHooks({ waterVapour: false })).toEqual([])
  })

  it('when water vapour is on, returns one hook that adds the water continuum', () => {
    const hooks = buildContinuumHooks({ waterVapour: true })
    expect(hooks.length).toBe(1)
    const grid = Float64Array.from([600, 900, 1100])
    const viaHook = new Float64Array(3)
    hooks[0](grid, layer, 0, viaHook)
    const direct = new Float64Array(3)
    addWaterContinuumOpticalDepth(grid, layer, direct)
    // Same computation through the hook (bit-identical, deterministic).
    expect(Array.from(viaHook)).toEqual(Array.from(direct))
    expect(viaHook[1]).toBeGreaterThan(0)
  })

  it('when the selection is not a boolean, throws PhysicsError', () => {
    expect(() => buildContinuumHooks({} as { waterVapour: boolean })).toThrow(PhysicsError)
  })
})
