import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { voigtProfileAccurate } from '../../../../shared/physics/spectroscopy/line-shape'
import { toLineTable, type SpectralLine } from '../../../../shared/physics/spectroscopy/line'
import {
  dopplerHalfWidthCm,
  dopplerHalfWidths,
  lorentzHalfWidthCm,
  lorentzHalfWidths,
  pressureShiftedWavenumberCm,
  pressureShiftedWavenumbers,
  voigtHalfWidthCm,
} from '../../../../shared/physics/spectroscopy/widths'
import { expectRelativeClose } from '../../../support/expect-close'

/** Asserts that `value` rounds to `printed` at the printed number of significant digits. */
function expectRoundsTo(value: number, printed: number, significantDigits: number): void {
  expect(Number(value.toPrecision(significantDigits)), `${value}`).toBe(printed)
}

const CO2_626_MOLAR_MASS = 43.98983 // Gordon et al. 2022, JQSRT 277, 107949, isotopologue table
const H2O_161_MOLAR_MASS = 18.010565 // Gordon et al. 2022, JQSRT 277, 107949, isotopologue table

function line(overrides: Partial<SpectralLine>): SpectralLine {
  return {
    moleculeId: 2,
    isotopologueId: 1,
    wavenumberCm: 667.38,
    intensityCmPerMolecule: 1e-19,
    einsteinAPerS: 1,
    airHalfWidthCmPerAtm: 0.072,
    selfHalfWidthCmPerAtm: 0.095,
    lowerStateEnergyCm: 100,
    temperatureExponentAir: 0.75,
    pressureShiftCmPerAtm: -0.0012,
    ...overrides,
  }
}

describe('dopplerHalfWidthCm', () => {
  it('when CO2 at 667 cm⁻¹, returns 6.20e-4 cm⁻¹ at 296 K and 5.34e-4 cm⁻¹ at 220 K', () => {
    // Computed by hand from α_D = (ν/c)√(2 ln2 kT/m) (CODATA 2018), 3 significant digits.
    expectRoundsTo(dopplerHalfWidthCm(667, 296, CO2_626_MOLAR_MASS), 6.2e-4, 3)
    expectRoundsTo(dopplerHalfWidthCm(667, 220, CO2_626_MOLAR_MASS), 5.34e-4, 3)
  })

  it('when H2O at 1594.75 cm⁻¹ and 296 K, returns 2.32e-3 cm⁻¹', () => {
    // Computed by hand from the same formula, 3 significant digits.
    expectRoundsTo(dopplerHalfWidthCm(1594.75, 296, H2O_161_MOLAR_MASS), 2.32e-3, 3)
  })

  it('when the temperature or mass is not positive, throws OUT_OF_RANGE', () => {
    expect(() => dopplerHalfWidthCm(667, 0, 44)).toThrow(PhysicsError)
    expect(() => dopplerHalfWidthCm(667, 296, -1)).toThrow(PhysicsError)
  })

  it('when applied to a table, returns the scalar value per line with the table molar masses', () => {
    const table = toLineTable([
      line({ wavenumberCm: 700 }),
      line({ moleculeId: 1, isotopologueId: 1, wavenumberCm: 1594.75 }),
      line({ wavenumberCm: 600, isotopologueId: 2 }),
    ])
    const out = new Float64Array(3)
    dopplerHalfWidths(table, 250, out)
    // Molar masses: Gordon et al. 2022, JQSRT 277, 107949, isotopologue table (636: 44.993185).
    expectRelativeClose(out[0], dopplerHalfWidthCm(600, 250, 44.993185), 1e-15)
    expectRelativeClose(out[1], dopplerHalfWidthCm(700, 250, CO2_626_MOLAR_MASS), 1e-15)
    expectRelativeClose(out[2], dopplerHalfWidthCm(1594.75, 250, H2O_161_MOLAR_MASS), 1e-15)
  })

  it('when a line belongs to an isotopologue missing from the table, throws UNSUPPORTED', () => {
    const table = toLineTable([line({ moleculeId: 7, isotopologueId: 1 })])
    expect(() => dopplerHalfWidths(table, 250, new Float64Array(1))).toThrow(/no isotopologue/)
  })
})

describe('lorentzHalfWidthCm', () => {
  it('when in air at 296 K and 1 atm without self pressure, returns γ_air', () => {
    // Definition of γ_air (Rothman et al. 1998 Appendix, from memory).
    expect(lorentzHalfWidthCm(0.072, 0.095, 0.75, 1, 0, 296)).toBe(0.072)
  })

  it('when the gas is pure, returns γ_self p', () => {
    expectRelativeClose(lorentzHalfWidthCm(0.072, 0.095, 0.75, 0.5, 0.5, 296), 0.0475, 1e-15)
  })

  it('when at 220 K, returns γ (296/220)^n with the mixed pressure sum', () => {
    // (296/220)^0.75 = exp(0.75 × 0.296 732) = 1.249 257 (computed, 7 digits).
    const expected = 1.249257 * (0.072 * 0.2 + 0.095 * 0.05)
    expectRelativeClose(lorentzHalfWidthCm(0.072, 0.095, 0.75, 0.25, 0.05, 220), expected, 1e-6)
  })

  it('when p_self exceeds p or p is negative, throws OUT_OF_RANGE', () => {
    expect(() => lorentzHalfWidthCm(0.07, 0.09, 0.7, 0.1, 0.2, 296)).toThrow(PhysicsError)
    expect(() => lorentzHalfWidthCm(0.07, 0.09, 0.7, -1, 0, 296)).toThrow(PhysicsError)
  })

  it('when applied to a table, uses each molecule partial pressure', () => {
    const table = toLineTable([
      line({ wavenumberCm: 700 }),
      line({
        moleculeId: 1,
        wavenumberCm: 1594.75,
        airHalfWidthCmPerAtm: 0.09,
        selfHalfWidthCmPerAtm: 0.45,
      }),
    ])
    const selfPressure: number[] = []
    selfPressure[1] = 0.01
    selfPressure[2] = 4e-4
    const out = new Float64Array(2)
    lorentzHalfWidths(table, 0.8, selfPressure, 230, out)
    expect(out[0]).toBe(lorentzHalfWidthCm(0.072, 0.095, 0.75, 0.8, 4e-4, 230))
    expect(out[1]).toBe(lorentzHalfWidthCm(0.09, 0.45, 0.75, 0.8, 0.01, 230))
  })

  it('when a molecule has no partial pressure, throws OUT_OF_RANGE', () => {
    const table = toLineTable([line({ moleculeId: 3 })])
    expect(() => lorentzHalfWidths(table, 1, [], 296, new Float64Array(1))).toThrow(
      /partial pressure/,
    )
  })
})

describe('pressureShiftedWavenumberCm', () => {
  it('when at 0.5 atm, returns ν + δ p', () => {
    expectRelativeClose(pressureShiftedWavenumberCm(667.38, -0.0012, 0.5), 667.3794, 1e-15)
    const table = toLineTable([line({})])
    const out = new Float64Array(1)
    pressureShiftedWavenumbers(table, 0.5, out)
    expect(out[0]).toBe(pressureShiftedWavenumberCm(667.38, -0.0012, 0.5))
  })
})

describe('voigtHalfWidthCm (Olivero & Longbothum 1977)', () => {
  /** Half width at half maximum of the accurate Voigt profile, by bisection. */
  function measuredHalfWidth(alphaD: number, gamma: number): number {
    const half = voigtProfileAccurate(0, alphaD, gamma) / 2
    let lo = 0
    let hi = 10 * (alphaD + gamma)
    for (let k = 0; k < 100; k++) {
      const mid = (lo + hi) / 2
      if (voigtProfileAccurate(mid, alphaD, gamma) > half) lo = mid
      else hi = mid
    }
    return (lo + hi) / 2
  }

  it('when compared with the HWHM of the accurate Voigt profile, returns it to 2.5e-4', () => {
    // Olivero & Longbothum quote ≈0.02 % (from memory); measured maximum 2.4e-4 near γ/α_D = 0.3.
    for (const ratio of [0, 0.01, 0.1, 0.3, 0.5, 1, 2, 3, 10, 100]) {
      const alphaD = 6.2e-4
      expectRelativeClose(
        voigtHalfWidthCm(alphaD, ratio * alphaD),
        measuredHalfWidth(alphaD, ratio * alphaD),
        2.5e-4,
        `γ/α_D = ${ratio}`,
      )
    }
  })

  it('when one width is zero, returns the other (Doppler exactly, Lorentz to 1e-5)', () => {
    // Limits of the formula: 0.5346 + √0.2166 = 1.000003.
    expect(voigtHalfWidthCm(6.2e-4, 0)).toBe(6.2e-4)
    expectRelativeClose(voigtHalfWidthCm(0, 0.07), 0.07, 1e-5)
  })
})
