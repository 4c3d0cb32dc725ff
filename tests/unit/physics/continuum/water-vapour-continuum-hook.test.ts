import { describe, expect, it } from 'vitest'
import { applyContinuumHooks } from '../../../../shared/physics/optics/continuum'
import { createWaterVapourContinuumHook } from '../../../../shared/physics/continuum/water-vapour-continuum-hook'
import {
  waterContinuumCoefficientCm2PerMoleculeAtm,
  waterContinuumWindowWeight,
} from '../../../../shared/physics/continuum/water-vapour-continuum'
import type { AtmosphereLayer } from '../../../../shared/physics/types'
import { expectRelativeClose } from '../../../support/expect-close'

function layerOf(
  waterColumn: number,
  waterVmr: number,
  meanPressurePa = 101325,
  meanTemperatureK = 296,
): AtmosphereLayer {
  return {
    pressureBottomPa: meanPressurePa * 1.01,
    pressureTopPa: meanPressurePa * 0.99,
    heightBottomM: 0,
    heightTopM: 100,
    meanPressurePa,
    meanTemperatureK,
    airColumnMoleculesPerCm2: 2.5e23,
    gasColumnMoleculesPerCm2: { H2O: waterColumn, CO2: 1e20 },
    meanVmr: { H2O: waterVmr, CO2: 4e-4 },
  }
}

/** 500–1500 cm⁻¹ in 1 cm⁻¹ steps. */
const GRID = Float64Array.from({ length: 1001 }, (_, i) => 500 + i)

function opticalDepth(layer: AtmosphereLayer, parts = {}): Float64Array {
  const out = new Float64Array(GRID.length)
  applyContinuumHooks([createWaterVapourContinuumHook(parts)], GRID, layer, 0, out)
  return out
}

describe('createWaterVapourContinuumHook', () => {
  const base = layerOf(4.9e22, 0.0197)
  const tau = opticalDepth(base)

  it('when applied, adds optical depth only on 650–1300 cm⁻¹ and the full value on 700–1250', () => {
    GRID.forEach((nu, i) => {
      // Range and taper of water-vapour-continuum.ts (module comment).
      if (nu <= 650 || nu >= 1300) expect(tau[i], `${nu}`).toBe(0)
      else expect(tau[i], `${nu}`).toBeGreaterThan(0)
      // Roberts form τ = w C_s(ν, T) N_w [e + γ(P − e)] (Roberts et al. 1976; from memory): 1e-12.
      const e = 0.0197
      const expected =
        waterContinuumWindowWeight(nu) *
        waterContinuumCoefficientCm2PerMoleculeAtm(nu, 296) *
        4.9e22 *
        (e + 0.002 * (1 - e))
      if (expected > 0) expectRelativeClose(tau[i], expected, 1e-12, `${nu}`)
    })
  })

  it('when the water column doubles, doubles the optical depth', () => {
    // τ ∝ N_w at fixed e and P (Roberts form): 1e-14.
    const doubled = opticalDepth(layerOf(9.8e22, 0.0197))
    GRID.forEach((nu, i) => {
      if (tau[i] > 0) expectRelativeClose(doubled[i], 2 * tau[i], 1e-14, `${nu}`)
    })
  })

  it('when the pressure halves at fixed column and mixing ratio, halves the optical depth', () => {
    // e = xP and P − e = (1 − x)P both halve, so τ ∝ P (Roberts form): 1e-14.
    const halved = opticalDepth(layerOf(4.9e22, 0.0197, 101325 / 2))
    const i = 1000 - 500
    expectRelativeClose(halved[i], tau[i] / 2, 1e-14)
  })

  it('when split into self and foreign parts, the parts are e : γ(P − e) and sum to the whole', () => {
    const i = 1000 - 500
    const self = opticalDepth(base, { foreign: false })[i]
    const foreign = opticalDepth(base, { self: false })[i]
    // Ratio of the pressure terms, 0.0197 / (0.002 · 0.9803) (Roberts form): 1e-13.
    expectRelativeClose(self / foreign, 0.0197 / (0.002 * (1 - 0.0197)), 1e-13)
    expectRelativeClose(self + foreign, tau[i], 1e-14)
  })

  it('when the layer is colder, scales by exp[1800(1/T − 1/296)]', () => {
    // Roberts temperature factor: 260 K gives ×2.32 (computed by hand, 3 digits): 0.1 %.
    const cold = opticalDepth(layerOf(4.9e22, 0.0197, 101325, 260))
    const i = 1000 - 500
    expectRelativeClose(cold[i] / tau[i], 2.32, 1e-3)
  })

  it('when the layer has no water, adds nothing', () => {
    // Zero water column → zero continuum (the formula is ∝ N_w).
    expect(opticalDepth(layerOf(0, 0)).every((value) => value === 0)).toBe(true)
    const dry: AtmosphereLayer = { ...base, gasColumnMoleculesPerCm2: {}, meanVmr: {} }
    expect(opticalDepth(dry).every((value) => value === 0)).toBe(true)
  })
})
