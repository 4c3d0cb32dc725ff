import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  lineIntensityAtTemperature,
  scaleLineIntensities,
} from '../../../../shared/physics/spectroscopy/intensity'
import { getIsotopologue } from '../../../../shared/physics/spectroscopy/isotopologue-lookup'
import { toLineTable, type SpectralLine } from '../../../../shared/physics/spectroscopy/line'
import { approximatePartitionFunction } from '../../../../shared/physics/spectroscopy/partition-function'
import { expectRelativeClose } from '../../../support/expect-close'

const constantQ = () => 1

function line(overrides: Partial<SpectralLine>): SpectralLine {
  return {
    moleculeId: 2,
    isotopologueId: 1,
    wavenumberCm: 667.38,
    intensityCmPerMolecule: 3e-19,
    einsteinAPerS: 1,
    airHalfWidthCmPerAtm: 0.072,
    selfHalfWidthCmPerAtm: 0.095,
    lowerStateEnergyCm: 100,
    temperatureExponentAir: 0.75,
    pressureShiftCmPerAtm: 0,
    ...overrides,
  }
}

describe('lineIntensityAtTemperature', () => {
  it('when T equals the reference temperature, returns S unchanged', () => {
    expect(lineIntensityAtTemperature(3.2e-19, 667.38, 1234.5, 296, constantQ)).toBe(3.2e-19)
  })

  it('when ν = E″ = 667.38 cm⁻¹ and T = 220 K, returns the product of the hand-computed factors', () => {
    // Computed by hand with CODATA 2018 c₂: exp(−c₂·667.38/T) = 0.012 720 (220 K), 0.039 009 (296
    // K). Boltzmann ratio 0.012720/0.039009; stimulated-emission ratio (1 − 0.012720)/(1 −
    // 0.039009).
    const expected = (0.01272 / 0.039009) * ((1 - 0.01272) / (1 - 0.039009))
    // The table factors have 5 significant digits: relative tolerance 1e-4.
    expectRelativeClose(
      lineIntensityAtTemperature(1, 667.38, 667.38, 220, constantQ),
      expected,
      1e-4,
    )
  })

  it('when ν → 0, returns the stimulated-emission limit T_ref/T without cancellation', () => {
    // (1 − e^{−a})/(1 − e^{−b}) → a/b = T_ref/T for small ν (analytic limit; correction ~1e-9).
    expectRelativeClose(lineIntensityAtTemperature(1, 1e-6, 0, 250, constantQ), 296 / 250, 1e-8)
  })

  it('when Q ∝ T, returns the extra factor T_ref/T', () => {
    // Q(T_ref)/Q(T) factor of the scaling formula (Rothman et al. 1998 Appendix, from memory).
    const withQ = lineIntensityAtTemperature(1, 2349.14, 300, 250, (t) => 2 * t)
    const without = lineIntensityAtTemperature(1, 2349.14, 300, 250, constantQ)
    expectRelativeClose(withQ / without, 296 / 250, 1e-14)
  })

  it('when E″ is large and T low, returns the small positive value instead of 0/0', () => {
    // exp(−c₂E″/T) alone underflows for E″ = 6e4 cm⁻¹ at 100 K (exponent −863); the combined
    // exponent −c₂E″(1/T − 1/T_ref) = −571 does not. Small ν: stimulated factor → T_ref/T.
    // c₂ = 1.438 776 877 cm K (CODATA 2018, Tiesinga et al. 2021, Rev. Mod. Phys. 93, 025010).
    const s = lineIntensityAtTemperature(1, 1e-6, 60000, 100, constantQ)
    expect(s).toBeGreaterThan(0)
    const expectedLog = -1.438776877 * 60000 * (1 / 100 - 1 / 296) + Math.log(2.96)
    expectRelativeClose(Math.log(s), expectedLog, 1e-9)
  })

  it('when an input is negative or not finite, throws OUT_OF_RANGE', () => {
    expect(() => lineIntensityAtTemperature(-1, 667, 0, 250, constantQ)).toThrow(PhysicsError)
    expect(() => lineIntensityAtTemperature(1, 0, 0, 250, constantQ)).toThrow(PhysicsError)
    expect(() => lineIntensityAtTemperature(1, 667, 0, Number.NaN, constantQ)).toThrow(PhysicsError)
    expect(() => lineIntensityAtTemperature(1, 667, 0, 250, () => 0)).toThrow(PhysicsError)
  })
})

describe('scaleLineIntensities', () => {
  it('when applied to a table of several isotopologues, returns the scalar result per line', () => {
    const lines = [
      line({ wavenumberCm: 720.8, lowerStateEnergyCm: 667.38 + 50 }),
      line({
        moleculeId: 1,
        wavenumberCm: 1594.75,
        lowerStateEnergyCm: 23.8,
        intensityCmPerMolecule: 1e-20,
      }),
      line({ isotopologueId: 2, wavenumberCm: 648.48, lowerStateEnergyCm: 12 }),
      line({ wavenumberCm: 667.4, lowerStateEnergyCm: 2.3 }),
    ]
    const table = toLineTable(lines)
    const out = new Float64Array(table.length)
    scaleLineIntensities(table, 230, out)
    for (let i = 0; i < table.length; i++) {
      const source = lines[table.sourceIndex[i]]
      const q = approximatePartitionFunction(
        getIsotopologue(source.moleculeId, source.isotopologueId),
      )
      const expected = lineIntensityAtTemperature(
        source.intensityCmPerMolecule,
        source.wavenumberCm,
        source.lowerStateEnergyCm,
        230,
        q,
      )
      expectRelativeClose(out[i], expected, 1e-14, `row ${i}`)
    }
  })

  it('when the output is too short or an isotopologue is unknown, throws', () => {
    const table = toLineTable([line({}), line({ moleculeId: 9 })])
    expect(() => scaleLineIntensities(table, 250, new Float64Array(1))).toThrow(PhysicsError)
    expect(() => scaleLineIntensities(table, 250, new Float64Array(2))).toThrow(/no isotopologue/)
  })
})
