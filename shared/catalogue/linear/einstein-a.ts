/**
 * Einstein A coefficient of a line from its intensity.
 */
import { C2_CM_K, SPEED_OF_LIGHT_CM_PER_S } from '../../physics/constants'
import { PhysicsError, assertFiniteInRange } from '../../physics/errors'

/**
 * Einstein A coefficient of a line from its intensity at a reference temperature.
 *
 * Method: S = g′ A I_a exp(−c₂E″/T) [1 − exp(−c₂ν/T)] / (8π c ν² Q(T)), solved for A:
 *   A = 8π c ν² S Q(T) / (g′ I_a exp(−c₂E″/T) [1 − exp(−c₂ν/T)]),
 * with 1 − exp(−x) evaluated as −expm1(−x).
 * Notes: S in cm⁻¹/(molecule cm⁻²) including the abundance I_a; c in cm s⁻¹; ν and E″ in cm⁻¹;
 * g′ the upper-state statistical weight in the same convention as Q (both including the
 * state-independent factor g_i); result in s⁻¹.
 * Source: Šimečková, Jacquemart, Rothman, Gamache & Goldman 2006, JQSRT 98, 130, eq. (20)
 * (from memory).
 * @param intensityCmPerMolecule S(T), ≥ 0
 * @param wavenumberCm ν, > 0
 * @param lowerStateEnergyCm E″, ≥ 0
 * @param upperStatisticalWeight g′, > 0
 * @param abundance I_a, in (0, 1]
 * @param partitionFunctionValue Q(T), > 0
 * @param temperatureK T, K (> 0)
 */
export function einsteinAFromIntensity(
  intensityCmPerMolecule: number,
  wavenumberCm: number,
  lowerStateEnergyCm: number,
  upperStatisticalWeight: number,
  abundance: number,
  partitionFunctionValue: number,
  temperatureK: number,
): number {
  assertFiniteInRange('intensityCmPerMolecule', intensityCmPerMolecule, 0, Infinity)
  assertFiniteInRange('wavenumberCm', wavenumberCm, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('lowerStateEnergyCm', lowerStateEnergyCm, 0, Infinity)
  assertFiniteInRange('upperStatisticalWeight', upperStatisticalWeight, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('abundance', abundance, Number.MIN_VALUE, 1)
  assertFiniteInRange('partitionFunctionValue', partitionFunctionValue, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('temperatureK', temperatureK, Number.MIN_VALUE, Infinity)
  const stimulated = -Math.expm1((-C2_CM_K * wavenumberCm) / temperatureK)
  const boltzmann = Math.exp((-C2_CM_K * lowerStateEnergyCm) / temperatureK)
  const a =
    (8 *
      Math.PI *
      SPEED_OF_LIGHT_CM_PER_S *
      wavenumberCm *
      wavenumberCm *
      intensityCmPerMolecule *
      partitionFunctionValue) /
    (upperStatisticalWeight * abundance * boltzmann * stimulated)
  if (!Number.isFinite(a)) {
    throw new PhysicsError('OUT_OF_RANGE', 'Einstein A overflows (E″ too high for T?)', {
      lowerStateEnergyCm,
      temperatureK,
    })
  }
  return a
}
