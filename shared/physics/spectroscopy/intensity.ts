/**
 * Temperature scaling of line intensities from the database reference temperature (296 K).
 */
import { C2_CM_K, LINE_REFERENCE_TEMPERATURE_K } from '../constants'
import { PhysicsError, assertFiniteInRange } from '../errors'
import type { LineTable } from './line'
import {
  defaultPartitionFunctionLookup,
  type PartitionFunction,
  type PartitionFunctionLookup,
} from './partition-function'

/**
 * Line intensity at temperature T from its value at the reference temperature.
 *
 * Method: S(T) = S(T_ref) · Q(T_ref)/Q(T) · exp(−c₂E″/T)/exp(−c₂E″/T_ref)
 *               · [1 − exp(−c₂ν/T)] / [1 − exp(−c₂ν/T_ref)].
 * The two Boltzmann factors are combined into exp(−c₂E″(1/T − 1/T_ref)) (no underflow of each
 * factor for large E″), and 1 − exp(−a) is evaluated as −expm1(−a) (no cancellation for small ν).
 * Notes: local thermodynamic equilibrium; c₂ = hc/k (CODATA 2018). Units: S in
 * cm⁻¹/(molecule cm⁻²) (any unit, the result has the same one), ν and E″ in cm⁻¹, T in K.
 * Source: Rothman et al. 1998, JQSRT 60, 665–710, Appendix (intensity temperature conversion;
 * from memory); the same form in Šimečková et al. 2006, JQSRT 98, 130 (from memory).
 * @param intensityRefCmPerMolecule S(T_ref), ≥ 0
 * @param wavenumberCm line position ν, > 0
 * @param lowerStateEnergyCm E″, ≥ 0
 * @param temperatureK T, K (> 0)
 * @param partitionFunction Q(T) of the line's isotopologue
 * @param referenceTemperatureK T_ref, K (default 296)
 */
export function lineIntensityAtTemperature(
  intensityRefCmPerMolecule: number,
  wavenumberCm: number,
  lowerStateEnergyCm: number,
  temperatureK: number,
  partitionFunction: PartitionFunction,
  referenceTemperatureK: number = LINE_REFERENCE_TEMPERATURE_K,
): number {
  assertFiniteInRange('intensityRefCmPerMolecule', intensityRefCmPerMolecule, 0, Infinity)
  assertFiniteInRange('wavenumberCm', wavenumberCm, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('lowerStateEnergyCm', lowerStateEnergyCm, 0, Infinity)
  assertFiniteInRange('temperatureK', temperatureK, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('referenceTemperatureK', referenceTemperatureK, Number.MIN_VALUE, Infinity)
  const partitionRatio = partitionFunction(referenceTemperatureK) / partitionFunction(temperatureK)
  assertFiniteInRange('Q(T_ref)/Q(T)', partitionRatio, Number.MIN_VALUE, Infinity)
  const result =
    intensityRefCmPerMolecule *
    partitionRatio *
    Math.exp(-C2_CM_K * lowerStateEnergyCm * (1 / temperatureK - 1 / referenceTemperatureK)) *
    (Math.expm1((-C2_CM_K * wavenumberCm) / temperatureK) /
      Math.expm1((-C2_CM_K * wavenumberCm) / referenceTemperatureK))
  if (!Number.isFinite(result)) {
    throw new PhysicsError('OUT_OF_RANGE', 'scaled line intensity overflows', {
      intensityRefCmPerMolecule,
      lowerStateEnergyCm,
      temperatureK,
    })
  }
  return result
}

/**
 * Scales every line intensity of a table from 296 K to temperature T, writing into `out`.
 *
 * Method: the formula of `lineIntensityAtTemperature` per line, with Q(296)/Q(T) evaluated once per
 * distinct (molecule, isotopologue) pair before use.
 * Notes: no allocation per line (one small cache map per call). Table values are assumed
 * validated (as by `toLineTable`). Units: out in cm⁻¹/(molecule cm⁻²).
 * Source: Rothman et al. 1998, JQSRT 60, 665, Appendix (from memory).
 * @param table line table (intensities at 296 K)
 * @param temperatureK T, K
 * @param out output, length ≥ table.length; out[i] = S_i(T)
 * @param lookup partition function per isotopologue (default: the approximate table functions)
 */
export function scaleLineIntensities(
  table: LineTable,
  temperatureK: number,
  out: Float64Array,
  lookup: PartitionFunctionLookup = defaultPartitionFunctionLookup,
): void {
  assertFiniteInRange('temperatureK', temperatureK, Number.MIN_VALUE, Infinity)
  if (out.length < table.length) {
    throw new PhysicsError('INVALID_ARGUMENT', 'output array shorter than the line table', {
      outLength: out.length,
      tableLength: table.length,
    })
  }
  const reference = LINE_REFERENCE_TEMPERATURE_K
  const ratioCache = new Map<number, number>()
  const inverseTemperatureDifference = 1 / temperatureK - 1 / reference
  const c2OverT = C2_CM_K / temperatureK
  const c2OverTref = C2_CM_K / reference
  let lastKey = -1
  let lastRatio = 0
  for (let i = 0; i < table.length; i++) {
    const molecule = table.moleculeId[i]
    const isotopologue = table.isotopologueId[i]
    const key = molecule * 1000 + isotopologue
    if (key !== lastKey) {
      let ratio = ratioCache.get(key)
      if (ratio === undefined) {
        const q = lookup(molecule, isotopologue)
        ratio = q(reference) / q(temperatureK)
        assertFiniteInRange('Q(T_ref)/Q(T)', ratio, Number.MIN_VALUE, Infinity)
        ratioCache.set(key, ratio)
      }
      lastKey = key
      lastRatio = ratio
    }
    const nu = table.wavenumberCm[i]
    out[i] =
      table.intensityCmPerMolecule[i] *
      lastRatio *
      Math.exp(-C2_CM_K * table.lowerStateEnergyCm[i] * inverseTemperatureDifference) *
      (Math.expm1(-c2OverT * nu) / Math.expm1(-c2OverTref * nu))
  }
}
