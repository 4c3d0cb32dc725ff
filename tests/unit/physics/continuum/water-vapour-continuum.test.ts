import { describe, expect, it } from 'vitest'
import { BOLTZMANN_J_PER_K } from '../../../../shared/physics/constants'
import {
  WATER_CONTINUUM_RANGE_CM,
  addWaterContinuumOpticalDepth,
  waterContinuumCoefficient296Cm2PerMoleculeAtm,
  waterContinuumCoefficientCm2PerMoleculeAtm,
  waterContinuumOpticalDepth,
  waterContinuumPathOfLayer,
  waterContinuumPressureTermAtm,
  waterContinuumTemperatureFactor,
  waterContinuumWindowWeight,
} from '../../../../shared/physics/continuum/water-vapour-continuum'
import { PhysicsError } from '../../../../shared/physics/errors'
import type { AtmosphereLayer } from '../../../../shared/physics/types'
import { expectRelativeClose } from '../../../support/expect-close'

/** Worked example (computed by hand): 1 km, 296 K, e = 20 hPa, P = 1013.25 hPa. */
const PATH_LENGTH_CM = 1e5
const WATER_PRESSURE_PA = 2000
const TOTAL_PRESSURE_PA = 101325
const WATER_NUMBER_DENSITY_PER_CM3 = WATER_PRESSURE_PA / (BOLTZMANN_J_PER_K * 296) / 1e6

function layerOf(overrides: Partial<AtmosphereLayer> = {}): AtmosphereLayer {
  return {
    pressureBottomPa: 102000,
    pressureTopPa: 100650,
    heightBottomM: 0,
    heightTopM: 1000,
    meanPressurePa: TOTAL_PRESSURE_PA,
    meanTemperatureK: 296,
    airColumnMoleculesPerCm2: 2.5e24,
    gasColumnMoleculesPerCm2: { H2O: WATER_NUMBER_DENSITY_PER_CM3 * PATH_LENGTH_CM },
    meanVmr: { H2O: WATER_PRESSURE_PA / TOTAL_PRESSURE_PA },
    ...overrides,
  }
}

describe('waterContinuumCoefficient296Cm2PerMoleculeAtm', () => {
  it('when evaluated at 800, 1000 and 1200 cm⁻¹, returns the tabulated C_s(296 K)', () => {
    // Computed by hand from a + b e^{−βν} (Roberts, Selby & Biberman 1976, Appl. Opt. 15, 2085;
    // coefficients from memory), 3 significant digits given: tolerance half a unit of the last
    // digit, 0.4 %.
    expectRelativeClose(waterContinuumCoefficient296Cm2PerMoleculeAtm(800), 4.33e-22, 4e-3)
    expectRelativeClose(waterContinuumCoefficient296Cm2PerMoleculeAtm(1000), 1.89e-22, 4e-3)
    expectRelativeClose(waterContinuumCoefficient296Cm2PerMoleculeAtm(1200), 1.38e-22, 4e-3)
  })

  it('when ν is negative or not finite, throws PhysicsError', () => {
    expect(() => waterContinuumCoefficient296Cm2PerMoleculeAtm(-1)).toThrow(PhysicsError)
    expect(() => waterContinuumCoefficient296Cm2PerMoleculeAtm(NaN)).toThrow(PhysicsError)
  })
})

describe('waterContinuumTemperatureFactor', () => {
  it('when T = 296 K, returns 1; when T = 260 K, returns 2.32', () => {
    // Definition exp[1800(1/T − 1/296)] (Roberts et al. 1976; from memory).
    expect(waterContinuumTemperatureFactor(296)).toBe(1)
    // T-factor 296→260 K ×2.32 (computed by hand, 3 digits): tolerance 0.1 %.
    expectRelativeClose(waterContinuumTemperatureFactor(260), 2.32, 1e-3)
  })

  it('when T is outside 100–500 K, throws PhysicsError', () => {
    expect(() => waterContinuumTemperatureFactor(99)).toThrow(PhysicsError)
    expect(() => waterContinuumTemperatureFactor(501)).toThrow(PhysicsError)
  })

  it('when multiplied into C_s, returns C_s(ν, T) = C_s(ν, 296) · factor', () => {
    // Definition of the Roberts form (Roberts, Selby & Biberman 1976, Appl. Opt. 15, 2085; from
    // memory).
    expectRelativeClose(
      waterContinuumCoefficientCm2PerMoleculeAtm(1000, 260),
      waterContinuumCoefficient296Cm2PerMoleculeAtm(1000) * waterContinuumTemperatureFactor(260),
      1e-15,
    )
  })
})

describe('waterContinuumWindowWeight', () => {
  it('when inside 700–1250 cm⁻¹, returns 1; beyond the 50 cm⁻¹ tapers, returns 0', () => {
    // Range and taper chosen in water-vapour-continuum.ts (module comment).
    expect(waterContinuumWindowWeight(700)).toBe(1)
    expect(waterContinuumWindowWeight(1000)).toBe(1)
    expect(waterContinuumWindowWeight(1250)).toBe(1)
    expect(waterContinuumWindowWeight(650)).toBe(0)
    expect(waterContinuumWindowWeight(1300)).toBe(0)
    expect(waterContinuumWindowWeight(400)).toBe(0)
    expect(waterContinuumWindowWeight(2000)).toBe(0)
  })

  it('when in the middle of a taper, returns sin²(π/4) = 0.5', () => {
    // sin² ramp (module comment): half-way gives exactly 1/2 up to rounding.
    expect(waterContinuumWindowWeight(675)).toBeCloseTo(0.5, 14)
    expect(waterContinuumWindowWeight(1275)).toBeCloseTo(0.5, 14)
  })

  it('when approaching the range edges, is continuous', () => {
    // Continuity of the sin² ramp at both ends (common practice); step 1e-6 cm⁻¹.
    for (const edge of [WATER_CONTINUUM_RANGE_CM.min, WATER_CONTINUUM_RANGE_CM.max]) {
      expect(Math.abs(waterContinuumWindowWeight(edge - 1e-6) - 1)).toBeLessThan(1e-9)
      expect(Math.abs(waterContinuumWindowWeight(edge + 1e-6) - 1)).toBeLessThan(1e-9)
    }
    expect(waterContinuumWindowWeight(650 + 1e-6)).toBeLessThan(1e-9)
    expect(waterContinuumWindowWeight(1300 - 1e-6)).toBeLessThan(1e-9)
  })
})

describe('waterContinuumPressureTermAtm', () => {
  it('when e = 20 hPa and P = 1013.25 hPa, returns e + γ(P − e) = 0.02170 atm', () => {
    // Worked example, [e + γ(P − e)] = 0.02170 atm (computed by hand; 4 digits): 0.02 %.
    expectRelativeClose(waterContinuumPressureTermAtm(2000 / 101325, 1), 0.0217, 2e-4)
  })

  it('when only self or only foreign is chosen, returns e or γ(P − e)', () => {
    // Definition of the two terms (Roberts et al. 1976; from memory), γ = 0.002.
    expect(waterContinuumPressureTermAtm(0.02, 1, { foreign: false })).toBe(0.02)
    expectRelativeClose(
      waterContinuumPressureTermAtm(0.02, 1, { self: false }),
      0.002 * 0.98,
      1e-15,
    )
  })

  it('when e exceeds P or is negative, throws PhysicsError', () => {
    expect(() => waterContinuumPressureTermAtm(1.1, 1)).toThrow(PhysicsError)
    expect(() => waterContinuumPressureTermAtm(-0.1, 1)).toThrow(PhysicsError)
  })
})

describe('waterContinuumOpticalDepth', () => {
  it('when given the worked example at 1000 cm⁻¹, returns τ ≈ 0.20', () => {
    const tau = waterContinuumOpticalDepth(1000, {
      temperatureK: 296,
      waterColumnMoleculesPerCm2: WATER_NUMBER_DENSITY_PER_CM3 * PATH_LENGTH_CM,
      waterPressureAtm: WATER_PRESSURE_PA / TOTAL_PRESSURE_PA,
      totalPressureAtm: 1,
    })
    // n_w = 4.894e17 cm⁻³ (computed by hand, n = e/kT; 4 digits): 0.05 %.
    expectRelativeClose(WATER_NUMBER_DENSITY_PER_CM3, 4.894e17, 5e-4)
    // τ ≈ 0.20 (computed by hand from the formula; 2 digits given): 1 %.
    expectRelativeClose(tau, 0.2, 1e-2)
  })

  it('when the column is negative, throws PhysicsError', () => {
    const path = {
      temperatureK: 296,
      waterColumnMoleculesPerCm2: -1,
      waterPressureAtm: 0.01,
      totalPressureAtm: 1,
    }
    expect(() => waterContinuumOpticalDepth(1000, path)).toThrow(PhysicsError)
  })
})

describe('waterContinuumPathOfLayer', () => {
  it('when given a layer, returns e = x_w P in atm, its water column and mean T', () => {
    const path = waterContinuumPathOfLayer(layerOf({ meanPressurePa: 50662.5 }))
    // P = 50662.5 Pa / 101325 Pa atm⁻¹ = 0.5 atm (definition of the atmosphere, exact).
    expect(path.totalPressureAtm).toBe(0.5)
    expectRelativeClose(path.waterPressureAtm, (0.5 * 2000) / 101325, 1e-15)
    expect(path.temperatureK).toBe(296)
  })

  it('when the layer has no water entry, returns a zero column and zero e', () => {
    const path = waterContinuumPathOfLayer(layerOf({ gasColumnMoleculesPerCm2: {}, meanVmr: {} }))
    expect(path.waterColumnMoleculesPerCm2).toBe(0)
    expect(path.waterPressureAtm).toBe(0)
  })

  it('when the mixing ratio is above 1 or the pressure negative, throws PhysicsError', () => {
    expect(() => waterContinuumPathOfLayer(layerOf({ meanVmr: { H2O: 1.5 } }))).toThrow(
      PhysicsError,
    )
    expect(() => waterContinuumPathOfLayer(layerOf({ meanPressurePa: -1 }))).toThrow(PhysicsError)
  })
})

describe('addWaterContinuumOpticalDepth', () => {
  it('when applied to the worked-example layer, adds the point values to what is already there', () => {
    const grid = Float64Array.from([800, 1000, 1200])
    const out = Float64Array.from([1, 2, 3])
    const layer = layerOf()
    addWaterContinuumOpticalDepth(grid, layer, out)
    const path = waterContinuumPathOfLayer(layer)
    grid.forEach((nu, i) => {
      // Same formula through the point function (factored evaluation): 1e-14.
      expectRelativeClose(out[i] - (i + 1), waterContinuumOpticalDepth(nu, path), 1e-12)
    })
  })

  it('when the grid and output differ in length, throws PhysicsError', () => {
    expect(() =>
      addWaterContinuumOpticalDepth(new Float64Array(2), layerOf(), new Float64Array(3)),
    ).toThrow(PhysicsError)
  })
})
