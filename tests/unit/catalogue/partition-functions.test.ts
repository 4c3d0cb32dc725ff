import { describe, expect, it } from 'vitest'
import {
  LEVEL_SUM_ISOTOPOLOGUES,
  createBuiltInPartitionFunctionLookup,
} from '../../../shared/catalogue/partition-functions'
import { PhysicsError } from '../../../shared/physics/errors'
import { approximatePartitionFunction } from '../../../shared/physics/spectroscopy/partition-function'
import { getIsotopologue } from '../../../shared/physics/spectroscopy/isotopologue-lookup'
import { expectRelativeClose } from '../../support/expect-close'

describe('createBuiltInPartitionFunctionLookup', () => {
  const lookup = createBuiltInPartitionFunctionLookup()

  it('when asked for each catalogue isotopologue at 296 K, returns the published Q(296)', () => {
    // Published Q(296): isotopologue table of the public spectroscopic database, Gordon et al.
    // 2022, JQSRT 277, 107949. Tolerances: the level sums of the
    // linear molecules, H2O and CH4 reproduce them to 1e-4; O3 (Watson levels of (000) only, rigid
    // product with Q_vib) to 0.5 % (measured −0.40 %).
    const published: [number, number, number, number, string][] = [
      [2, 1, 286.09, 1e-4, 'CO2 626'],
      [2, 2, 576.64, 1e-4, 'CO2 636'],
      [2, 3, 607.81, 1e-4, 'CO2 628'],
      [4, 1, 4984.9, 1e-4, 'N2O 446'],
      [1, 1, 174.58, 1e-4, 'H2O 161'],
      [3, 1, 3483.71, 5e-3, 'O3 666'],
      [6, 1, 590.48, 1e-4, 'CH4 211'],
    ]
    expect(published.length).toBe(LEVEL_SUM_ISOTOPOLOGUES.length)
    for (const [moleculeId, isotopologueId, q296, tolerance, label] of published) {
      expectRelativeClose(lookup(moleculeId, isotopologueId)(296), q296, tolerance, label)
    }
  })

  it('when asked for an isotopologue the catalogue does not generate, returns the approximate Q', () => {
    // CO2 627 (2, 4) and H2O 181 (1, 2): table functions, exact at 296 K by construction.
    for (const [moleculeId, isotopologueId] of [
      [2, 4],
      [1, 2],
    ]) {
      const record = getIsotopologue(moleculeId, isotopologueId)
      const q = lookup(moleculeId, isotopologueId)
      expect(q(250)).toBe(approximatePartitionFunction(record)(250))
      expectRelativeClose(q(296), record.partitionFunction296, 1e-12)
    }
  })

  it('when asked twice, returns the same function object (built once)', () => {
    expect(lookup(3, 1)).toBe(lookup(3, 1))
    expect(lookup(2, 1)).toBe(lookup(2, 1))
    expect(lookup(2, 4)).toBe(lookup(2, 4))
  })

  it('when a level sum differs from the approximation at 220 K, stays within 1 % of it', () => {
    // The approximate form is expected within ~1 % over 150–350 K (its doc comment, an estimate);
    // both are anchored near Q(296), so this is a plausibility band, not an accuracy test.
    for (const [moleculeId, isotopologueId] of LEVEL_SUM_ISOTOPOLOGUES) {
      const record = getIsotopologue(moleculeId, isotopologueId)
      const levelSum = lookup(moleculeId, isotopologueId)
      const ratio296 = levelSum(296) / record.partitionFunction296
      expectRelativeClose(
        levelSum(220) / ratio296,
        approximatePartitionFunction(record)(220),
        0.01,
        record.code,
      )
    }
  })

  it('when T is outside a level sum range or the isotopologue is unknown, throws PhysicsError', () => {
    // Level-sum ranges: 50–500 K for H2O, O3, CH4 (LEVEL_SUM_PARTITION_FUNCTION_RANGE_K).
    expect(() => lookup(1, 1)(600)).toThrow(PhysicsError)
    expect(() => lookup(99, 1)).toThrow(PhysicsError)
  })
})
