import { describe, expect, it } from 'vitest'
import {
  CO2_626_LEVELS,
  CO2_628_LEVELS,
  LINEAR_ISOTOPOLOGUES,
} from '../../../../shared/catalogue/constants/linear-levels'
import { nuclearSpinWeight } from '../../../../shared/catalogue/linear/spin-statistics'

const iso626 = LINEAR_ISOTOPOLOGUES.find((iso) => iso.code === '626')!
const iso636 = LINEAR_ISOTOPOLOGUES.find((iso) => iso.code === '636')!
const iso628 = LINEAR_ISOTOPOLOGUES.find((iso) => iso.code === '628')!

describe('nuclearSpinWeight', () => {
  // Nuclear-spin statistics (Herzberg 1945, Infrared and Raman Spectra, ch. I–IV; from memory).
  it('when the level is the 626 Σg⁺ ground state, returns 1 for even J and 0 for odd J', () => {
    for (let j = 0; j <= 10; j++) {
      expect(nuclearSpinWeight(iso626, CO2_626_LEVELS.L00001, j, 'e')).toBe(j % 2 === 0 ? 1 : 0)
    }
  })

  it('when the level is 626 01101 (Πu), returns e levels for odd J and f levels for even J', () => {
    for (let j = 1; j <= 10; j++) {
      expect(nuclearSpinWeight(iso626, CO2_626_LEVELS.L01101, j, 'e')).toBe(j % 2 === 1 ? 1 : 0)
      expect(nuclearSpinWeight(iso626, CO2_626_LEVELS.L01101, j, 'f')).toBe(j % 2 === 0 ? 1 : 0)
    }
  })

  it('when the level is 626 00011 (Σu⁺), returns 1 only for odd J', () => {
    for (let j = 0; j <= 10; j++) {
      expect(nuclearSpinWeight(iso626, CO2_626_LEVELS.L00011, j, 'e')).toBe(j % 2 === 1 ? 1 : 0)
    }
  })

  it('when the level is 626 02201 (Δg), returns e for even J and f for odd J', () => {
    // Derived from the same rule (symmetric levels are parity-+ for g states); common practice.
    for (let j = 2; j <= 10; j++) {
      expect(nuclearSpinWeight(iso626, CO2_626_LEVELS.L02201, j, 'e')).toBe(j % 2 === 0 ? 1 : 0)
      expect(nuclearSpinWeight(iso626, CO2_626_LEVELS.L02201, j, 'f')).toBe(j % 2 === 1 ? 1 : 0)
    }
  })

  it('when the isotopologue is 636, applies the same rule as 626', () => {
    expect(iso636.exchangeSymmetric).toBe(true)
    expect(nuclearSpinWeight(iso636, iso636.levels[0], 1, 'e')).toBe(0)
    expect(nuclearSpinWeight(iso636, iso636.levels[0], 2, 'e')).toBe(1)
  })

  it('when the isotopologue is 628 or N2O, keeps every level', () => {
    for (let j = 0; j <= 6; j++) {
      expect(nuclearSpinWeight(iso628, CO2_628_LEVELS.L00001, j, 'e')).toBe(1)
    }
    const n2o = LINEAR_ISOTOPOLOGUES.find((iso) => iso.code === '446')!
    expect(nuclearSpinWeight(n2o, n2o.levels[1], 3, 'e')).toBe(1)
    expect(nuclearSpinWeight(n2o, n2o.levels[1], 3, 'f')).toBe(1)
  })
})
