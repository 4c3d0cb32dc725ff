import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  computeLayerLineState,
  createLayerLineState,
  gasIdOfMolecule,
} from '../../../../shared/physics/optics/layer-line-state'
import {
  defaultPartitionFunctionLookup,
  lineIntensityAtTemperature,
  toLineTable,
  type SpectralLine,
} from '../../../../shared/physics/spectroscopy'
import type { AtmosphereLayer } from '../../../../shared/physics/types'
import { expectRelativeClose } from '../../../support/expect-close'
import { singleLayer } from './synthetic-band'

function line(overrides: Partial<SpectralLine> = {}): SpectralLine {
  return {
    moleculeId: 2,
    isotopologueId: 1,
    wavenumberCm: 667.38,
    intensityCmPerMolecule: 1e-19,
    einsteinAPerS: 1,
    airHalfWidthCmPerAtm: 0.07,
    selfHalfWidthCmPerAtm: 0.09,
    lowerStateEnergyCm: 0,
    temperatureExponentAir: 0.75,
    pressureShiftCmPerAtm: -0.002,
    ...overrides,
  }
}

const ATM_PA = 101325 // 1 atm, exact by definition (CGPM 1954)

describe('gasIdOfMolecule', () => {
  it('when given the database molecule numbers, returns the engine gases', () => {
    // Molecule numbering of the public spectroscopic databases (Rothman et al. 1998 Table 1, from memory).
    expect([1, 2, 3, 4, 6].map(gasIdOfMolecule)).toEqual(['H2O', 'CO2', 'O3', 'N2O', 'CH4'])
    expect(gasIdOfMolecule(5)).toBeUndefined()
    expect(gasIdOfMolecule(7)).toBeUndefined()
  })
})

describe('computeLayerLineState', () => {
  it('when the layer is at 296 K, returns integrated optical depth S·u exactly', () => {
    // At the reference temperature all scaling factors are 1 (Rothman et al. 1998 Appendix, from memory),
    // and the line's integrated optical depth is S·u (Beer–Lambert, Goody & Yung 1989 §3, from memory).
    const table = toLineTable([line({ lowerStateEnergyCm: 1500 })])
    const state = createLayerLineState(1)
    computeLayerLineState(table, singleLayer(ATM_PA, 296, 3e21), state)
    expectRelativeClose(state.integratedOpticalDepthCm[0], 1e-19 * 3e21, 1e-15)
    expect(state.activeCount).toBe(1)
  })

  it('when the layer is at 220 K, returns S(220 K)·u with S from lineIntensityAtTemperature', () => {
    // Same formula through the scalar path (Rothman et al. 1998 Appendix, from memory).
    const table = toLineTable([line({ lowerStateEnergyCm: 1200 })])
    const state = createLayerLineState(1)
    computeLayerLineState(table, singleLayer(20000, 220, 2e21), state)
    const expected =
      lineIntensityAtTemperature(1e-19, 667.38, 1200, 220, defaultPartitionFunctionLookup(2, 1)) *
      2e21
    expectRelativeClose(state.integratedOpticalDepthCm[0], expected, 1e-14)
  })

  it('when p = 0.5 atm with 10 % of the gas, returns γ = γ_air(p − p_self) + γ_self p_self at 296 K', () => {
    // Lorentz width with self broadening (Rothman et al. 1998 Appendix, from memory):
    // 0.07·(0.5 − 0.05) + 0.09·0.05 = 0.036 cm⁻¹.
    const table = toLineTable([line()])
    const state = createLayerLineState(1)
    computeLayerLineState(table, singleLayer(0.5 * ATM_PA, 296, 1e21, 0.1), state)
    expectRelativeClose(state.lorentzHalfWidthCm[0], 0.036, 1e-14)
    // Pressure shift ν* = ν + δp = 667.38 − 0.002·0.5 (same source).
    expectRelativeClose(state.centreCm[0], 667.379, 1e-15)
  })

  it('when the gas is CO2 at 667.38 cm⁻¹ and 296 K, returns the Doppler HWHM 6.20e-4 cm⁻¹', () => {
    // α_D = 6.20 × 10⁻⁴ cm⁻¹ (computed by hand from (ν₀/c)√(2 ln2 kT/m), CODATA 2018), 3 digits.
    const table = toLineTable([line({ pressureShiftCmPerAtm: 0 })])
    const state = createLayerLineState(1)
    computeLayerLineState(table, singleLayer(1, 296, 1e19), state)
    expect(Number(state.dopplerHalfWidthCm[0].toPrecision(3))).toBe(6.2e-4)
    // Voigt HWHM (Olivero & Longbothum 1977, from memory) tends to α_D when γ ≪ α_D (γ ≈ 7e-7 cm⁻¹ at 1 Pa).
    expectRelativeClose(state.voigtHalfWidthCm[0], state.dopplerHalfWidthCm[0], 2e-3)
  })

  it('when a molecule is absent or unknown to the engine, returns zero strength without look-ups', () => {
    // Lines of gases without column add nothing (Beer–Lambert: τ ∝ column).
    const table = toLineTable([
      line({ moleculeId: 1, wavenumberCm: 600 }), // H2O, not in the layer
      line({ moleculeId: 5, isotopologueId: 9, wavenumberCm: 650 }), // CO: not an engine gas
      line({ wavenumberCm: 700 }),
    ])
    const state = createLayerLineState(3)
    computeLayerLineState(table, singleLayer(ATM_PA, 250, 1e21), state)
    expect(Array.from(state.integratedOpticalDepthCm.subarray(0, 2))).toEqual([0, 0])
    expect(state.integratedOpticalDepthCm[2]).toBeGreaterThan(0)
    expect(state.activeCount).toBe(1)
    expect(state.length).toBe(3)
  })

  it('when a present gas has zero column, returns zero strength', () => {
    const layer: AtmosphereLayer = { ...singleLayer(ATM_PA, 250, 0), meanVmr: { CO2: 0 } }
    const state = createLayerLineState(1)
    computeLayerLineState(toLineTable([line()]), layer, state)
    expect(state.integratedOpticalDepthCm[0]).toBe(0)
    expect(state.activeCount).toBe(0)
  })

  it('when the state is too small, the layer invalid or the shift too large, throws', () => {
    const table = toLineTable([line(), line({ wavenumberCm: 668 })])
    expect(() =>
      computeLayerLineState(table, singleLayer(ATM_PA, 250, 1e21), createLayerLineState(1)),
    ).toThrow(/smaller than the line table/)
    const state = createLayerLineState(2)
    expect(() => computeLayerLineState(table, singleLayer(-1, 250, 1e21), state)).toThrow(
      PhysicsError,
    )
    expect(() => computeLayerLineState(table, singleLayer(ATM_PA, 250, -5), state)).toThrow(
      /column of CO2/,
    )
    const shifted = toLineTable([line({ pressureShiftCmPerAtm: -2 })])
    expect(() => computeLayerLineState(shifted, singleLayer(ATM_PA, 250, 1e21), state)).toThrow(
      /pressure shift/,
    )
  })
})
