import { describe, expect, it } from 'vitest'
import { C2_CM_K } from '../../../../shared/physics/constants'
import { PhysicsError } from '../../../../shared/physics/errors'
import { getIsotopologue } from '../../../../shared/physics/spectroscopy/isotopologue-lookup'
import {
  ISOTOPOLOGUES,
  type IsotopologueRecord,
} from '../../../../shared/physics/spectroscopy/isotopologues'
import {
  approximatePartitionFunction,
  defaultPartitionFunctionLookup,
  vibrationalPartitionFunction,
} from '../../../../shared/physics/spectroscopy/partition-function'
import { expectRelativeClose } from '../../../support/expect-close'

describe('vibrationalPartitionFunction', () => {
  it('when given the CO2 626 levels at 296 K, returns 1.0845', () => {
    // Q_vib(296) = 1.0845, computed by hand from the CO2 626 levels (Rothman et al. 1992, JQSRT 48,
    // 537; from memory); 5 significant digits.
    const q = vibrationalPartitionFunction(getIsotopologue(2, 1).vibrationalLevels, 296)
    expect(Math.abs(q - 1.0845)).toBeLessThan(5e-5)
  })

  it('when given one doubly degenerate level at 667.38 cm⁻¹ and 220 K, returns 1 + 0.025 44', () => {
    // g·exp(−c₂·667.38/220) = 0.025 44 (computed by hand, CODATA 2018 c₂).
    const q = vibrationalPartitionFunction([{ energyCm: 667.38, degeneracy: 2 }], 220)
    expect(Math.abs(q - 1.02544)).toBeLessThan(5e-6)
  })
})

describe('approximatePartitionFunction', () => {
  it('when at 296 K, returns the tabulated Q(296) of every isotopologue', () => {
    // Q(296) column of the Gordon et al. 2022 isotopologue table (JQSRT 277, 107949).
    const expected: Record<string, number> = {
      '626': 286.09,
      '636': 576.64,
      '666': 3483.71,
      '446': 4984.9,
      '211': 590.48,
      '161': 174.58,
    }
    for (const [code, q296] of Object.entries(expected)) {
      const record = ISOTOPOLOGUES.find((r) => r.code === code) as IsotopologueRecord
      expectRelativeClose(approximatePartitionFunction(record)(296), q296, 1e-14, code)
    }
  })

  it('when CO2 626 at 150–350 K, returns the rigid-rotor × Q_vib ratio to 0.2 %', () => {
    // Consistency check: Q_rot(even J) ≈ kT/(2hcB₀) + 1/6 (high-temperature rigid-rotor expansion
    // Q = (kT/σhcB)(1 + hcB/3kT + …) with symmetry number σ = 2, Herzberg 1950 ch. III; from
    // memory) with B₀ = 0.390 218 9 cm⁻¹ (Rothman et al. 1992, JQSRT 48, 537; from memory), times
    // Q_vib of the level list.
    const record = getIsotopologue(2, 1)
    const q = approximatePartitionFunction(record)
    const rigidRotor = (t: number) =>
      (t / C2_CM_K / (2 * 0.3902189) + 1 / 6) *
      vibrationalPartitionFunction(record.vibrationalLevels, t)
    for (const t of [150, 200, 220, 250, 350]) {
      expectRelativeClose(q(t) / q(296), rigidRotor(t) / rigidRotor(296), 2e-3, `${t} K`)
    }
  })

  it('when a nonlinear molecule has no vibrational levels, returns Q(296)(T/296)^1.5', () => {
    // Classical rotational partition function of a nonlinear rotor ∝ T^3/2 (Herzberg 1945, from memory).
    const record: IsotopologueRecord = { ...getIsotopologue(1, 1), vibrationalLevels: [] }
    expectRelativeClose(
      approximatePartitionFunction(record)(200),
      174.58 * (200 / 296) ** 1.5,
      1e-14,
    )
  })

  it('when outside 50–1000 K, throws OUT_OF_RANGE', () => {
    const q = defaultPartitionFunctionLookup(1, 1)
    expect(() => q(40)).toThrow(PhysicsError)
    expect(() => q(Number.NaN)).toThrow(PhysicsError)
    expect(() => q(1001)).toThrow(PhysicsError)
  })

  it('when the isotopologue is unknown, throws UNSUPPORTED', () => {
    expect(() => defaultPartitionFunctionLookup(2, 99)).toThrow(
      expect.objectContaining({ code: 'UNSUPPORTED' }),
    )
  })
})
