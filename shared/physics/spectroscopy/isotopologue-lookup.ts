/**
 * Look-ups in the isotopologue table by database molecule and isotopologue number.
 */
import { PhysicsError } from '../errors'
import { ISOTOPOLOGUES, type IsotopologueRecord } from './isotopologues'

/** The isotopologue record, or undefined when the table has no such isotopologue. */
export function findIsotopologue(
  moleculeId: number,
  isotopologueId: number,
): IsotopologueRecord | undefined {
  return ISOTOPOLOGUES.find(
    (record) => record.moleculeId === moleculeId && record.isotopologueId === isotopologueId,
  )
}

/** The isotopologue record; throws UNSUPPORTED when the table has no such isotopologue. */
export function getIsotopologue(moleculeId: number, isotopologueId: number): IsotopologueRecord {
  const record = findIsotopologue(moleculeId, isotopologueId)
  if (!record) {
    throw new PhysicsError(
      'UNSUPPORTED',
      `no isotopologue data for molecule ${moleculeId}, isotopologue ${isotopologueId}`,
      { moleculeId, isotopologueId },
    )
  }
  return record
}

/** Molar mass of an isotopologue from the table, g mol⁻¹; throws UNSUPPORTED when unknown. */
export function isotopologueMolarMassGPerMol(moleculeId: number, isotopologueId: number): number {
  return getIsotopologue(moleculeId, isotopologueId).molarMassGPerMol
}
