/**
 * Total internal partition functions built from explicit rotational level sums (with nuclear-spin
 * weights) times a vibrational level sum.
 */
import { C2_CM_K } from '../../physics/constants'
import { PhysicsError, assertFiniteInRange } from '../../physics/errors'
import type { PartitionFunction } from '../../physics/spectroscopy/partition-function'
import { vibrationalPartitionFunction } from '../../physics/spectroscopy/partition-function'
import type { VibrationalLevel } from '../../physics/spectroscopy/isotopologues'

/** Temperature range accepted by the level-sum partition functions of this folder, K. */
export const LEVEL_SUM_PARTITION_FUNCTION_RANGE_K = { min: 50, max: 500 } as const

/**
 * A partition function from rotational levels and a vibrational level list.
 *
 * Method: Q(T) = Q_rot(T) · Q_vib(T), Q_rot = Σ_i g_i exp(−c₂E_i/T) with g_i the full
 * statistical weight of level i (nuclear spin × (2J + 1)), Q_vib = 1 + Σ_v g_v exp(−c₂G_v/T)
 * (`vibrationalPartitionFunction`). The sum is formed in ascending-energy order for determinism.
 * Notes: the product form ignores rotation–vibration coupling (the excited states are taken to
 * have the ground-state rotational manifold), a few-0.1 % effect at 296 K for these molecules.
 * Accuracy otherwise that of the levels and of the truncation (the caller includes enough J).
 * Accepts 50–500 K (the range over which the level lists of this folder are complete). Dimensionless.
 * Source: statistical thermodynamics, e.g. Herzberg 1945, Infrared and Raman Spectra, ch. V;
 * Gamache et al. 2017, JQSRT 203, 70 (total internal partition sums; from memory).
 * @param energiesCm rotational level energies, cm⁻¹ (≥ 0)
 * @param weights statistical weights g_i (≥ 0), same length
 * @param vibrationalLevels vibrational term values and degeneracies
 */
export function createLevelSumPartitionFunction(
  energiesCm: ArrayLike<number>,
  weights: ArrayLike<number>,
  vibrationalLevels: readonly VibrationalLevel[],
): PartitionFunction {
  if (energiesCm.length !== weights.length || energiesCm.length === 0) {
    throw new PhysicsError(
      'INVALID_ARGUMENT',
      'energies and weights must be non-empty, equal length',
      {
        energies: energiesCm.length,
        weights: weights.length,
      },
    )
  }
  const order = Array.from({ length: energiesCm.length }, (_, i) => i)
  order.sort((a, b) => energiesCm[a] - energiesCm[b] || a - b)
  const e = new Float64Array(order.length)
  const g = new Float64Array(order.length)
  order.forEach((source, i) => {
    assertFiniteInRange('energyCm', energiesCm[source], 0, Infinity)
    assertFiniteInRange('weight', weights[source], 0, Infinity)
    e[i] = energiesCm[source]
    g[i] = weights[source]
  })
  const levels = vibrationalLevels.map((level) => ({ ...level }))
  const { min, max } = LEVEL_SUM_PARTITION_FUNCTION_RANGE_K
  return (temperatureK: number): number => {
    assertFiniteInRange('temperatureK', temperatureK, min, max)
    const factor = -C2_CM_K / temperatureK
    let sum = 0
    for (let i = 0; i < e.length; i++) sum += g[i] * Math.exp(factor * e[i])
    return sum * vibrationalPartitionFunction(levels, temperatureK)
  }
}
