import { describe, expect, it } from 'vitest'
import { ISOTOPOLOGUES } from '../../../../shared/physics/spectroscopy/isotopologues'
import { findIsotopologue } from '../../../../shared/physics/spectroscopy/isotopologue-lookup'
import { expectRelativeClose } from '../../../support/expect-close'

// Atomic masses, u: 2016 Atomic Mass Evaluation (Wang et al. 2017, Chinese Phys. C 41, 030003;
// from memory). 12C is exact by definition.
const ATOMIC_MASS: Record<string, number> = {
  '1H': 1.00782503223,
  '2H': 2.01410177812,
  '12C': 12,
  '13C': 13.00335483507,
  '14N': 14.00307400443,
  '16O': 15.99491461957,
  '17O': 16.9991317565,
  '18O': 17.99915961286,
}

/** Mass from a formula such as '(12C)(16O)2', 'H2(16O)', 'HD(16O)' or '(12C)H4'. */
function formulaMass(formula: string): number {
  let mass = 0
  for (const match of formula.matchAll(/(\((\d+[A-Z][a-z]?)\)|H|D)(\d*)/g)) {
    const atom = match[2] ?? (match[1] === 'D' ? '2H' : '1H')
    mass += ATOMIC_MASS[atom] * (match[3] ? Number(match[3]) : 1)
  }
  return mass
}

describe('ISOTOPOLOGUES', () => {
  it('when molar masses are recomputed from atomic masses, returns the table values to 1e-7', () => {
    // The table values (Gordon et al. 2022, JQSRT 277, 107949) carry 6–8 significant digits.
    expect(ISOTOPOLOGUES.length).toBe(12)
    for (const record of ISOTOPOLOGUES) {
      expectRelativeClose(record.molarMassGPerMol, formulaMass(record.formula), 1e-7, record.code)
    }
  })

  it('when abundances of one molecule are summed, returns at most 1', () => {
    const sums = new Map<number, number>()
    for (const record of ISOTOPOLOGUES) {
      sums.set(record.moleculeId, (sums.get(record.moleculeId) ?? 0) + record.abundance)
    }
    for (const [molecule, sum] of sums) expect(sum, `molecule ${molecule}`).toBeLessThanOrEqual(1)
    // CO2: the five listed isotopologues hold > 99.99 % (Gordon et al. 2022 abundances).
    expect(sums.get(2)).toBeGreaterThan(0.9999)
  })

  it('when looked up by molecule and isotopologue number, returns the unique record', () => {
    const keys = new Set(ISOTOPOLOGUES.map((r) => `${r.moleculeId}/${r.isotopologueId}`))
    expect(keys.size).toBe(ISOTOPOLOGUES.length)
    expect(findIsotopologue(2, 2)?.code).toBe('636')
    expect(findIsotopologue(1, 4)?.code).toBe('162')
    expect(findIsotopologue(5, 1)).toBeUndefined()
  })

  it('when vibrational levels are listed, returns positive energies and integer degeneracies', () => {
    for (const record of ISOTOPOLOGUES) {
      expect(record.vibrationalLevels.length, record.code).toBeGreaterThan(0)
      for (const level of record.vibrationalLevels) {
        expect(level.energyCm).toBeGreaterThan(0)
        expect(Number.isInteger(level.degeneracy) && level.degeneracy >= 1).toBe(true)
      }
    }
  })
})
