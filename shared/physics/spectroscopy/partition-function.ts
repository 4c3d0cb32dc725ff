/**
 * Total internal partition functions Q(T) of isotopologues.
 *
 * The default here is an APPROXIMATION (rigid-rotor power law × a short vibrational level sum),
 * scaled to the tabulated Q(296). The line-catalogue work replaces it with explicit level sums.
 */
import { C2_CM_K, LINE_REFERENCE_TEMPERATURE_K } from '../constants'
import { assertFiniteInRange } from '../errors'
import { getIsotopologue } from './isotopologue-lookup'
import type { IsotopologueRecord, VibrationalLevel } from './isotopologues'

/** A partition function: temperature in K → Q (dimensionless). */
export type PartitionFunction = (temperatureK: number) => number

/** Finds the partition function of an isotopologue by database molecule and isotopologue number. */
export type PartitionFunctionLookup = (
  moleculeId: number,
  isotopologueId: number,
) => PartitionFunction

/** Temperature range accepted by the approximate partition function, K. */
export const APPROXIMATE_PARTITION_FUNCTION_RANGE_K = { min: 50, max: 1000 } as const

/**
 * Vibrational partition function from a list of levels.
 *
 * Method: Q_vib(T) = 1 + Σ_i g_i exp(−c₂ E_i / T) (ground state energy 0, degeneracy 1).
 * Notes: a direct level sum (not a harmonic product), so it is only as complete as the level list;
 * levels above ~2500 cm⁻¹ contribute < 1e-5 at 296 K. Dimensionless.
 * Source: statistical thermodynamics, e.g. Herzberg 1945, Infrared and Raman Spectra, ch. V
 * (from memory).
 * @param levels vibrational term values (cm⁻¹) and degeneracies
 * @param temperatureK temperature, K (> 0)
 */
export function vibrationalPartitionFunction(
  levels: readonly VibrationalLevel[],
  temperatureK: number,
): number {
  assertFiniteInRange('temperatureK', temperatureK, Number.MIN_VALUE, Infinity)
  let sum = 1
  for (const level of levels)
    sum += level.degeneracy * Math.exp((-C2_CM_K * level.energyCm) / temperatureK)
  return sum
}

/**
 * Approximate total internal partition function of an isotopologue.
 *
 * Method: Q(T) = Q(296) · (T/296)^j · Q_vib(T)/Q_vib(296), j = 1 for linear and 1.5 for nonlinear
 * molecules (classical rigid-rotor limit), Q_vib the level sum of `vibrationalPartitionFunction`.
 * Notes: exact at 296 K by construction. An approximation: it ignores the quantum correction to
 * the rotational sum (≈ +1/(3σ) for a linear rotor of symmetry number σ, 0.1 % of Q for CO2 at
 * 220 K), centrifugal distortion and rotation–vibration coupling; expected error ≲ 1 % for 150–350 K (estimate, not
 * measured against level sums). Accepts 50–1000 K. Dimensionless.
 * Source: high-temperature rotational partition functions, Herzberg 1945 ch. V and Herzberg 1950
 * (Spectra of Diatomic Molecules) ch. III (from memory); Q(296) from the isotopologue table.
 */
export function approximatePartitionFunction(record: IsotopologueRecord): PartitionFunction {
  const exponent = record.linear ? 1 : 1.5
  const reference = LINE_REFERENCE_TEMPERATURE_K
  const qVibReference = vibrationalPartitionFunction(record.vibrationalLevels, reference)
  const { min, max } = APPROXIMATE_PARTITION_FUNCTION_RANGE_K
  return (temperatureK: number): number => {
    assertFiniteInRange('temperatureK', temperatureK, min, max)
    const qVib = vibrationalPartitionFunction(record.vibrationalLevels, temperatureK)
    return (
      record.partitionFunction296 * (temperatureK / reference) ** exponent * (qVib / qVibReference)
    )
  }
}

/**
 * The default partition-function look-up: `approximatePartitionFunction` of the isotopologue table.
 * Throws UNSUPPORTED for isotopologues that are not in the table.
 */
export const defaultPartitionFunctionLookup: PartitionFunctionLookup = (
  moleculeId,
  isotopologueId,
) => approximatePartitionFunction(getIsotopologue(moleculeId, isotopologueId))
