/**
 * Total internal partition functions of the linear isotopologues, by direct summation over the
 * same rovibrational levels that the band generator uses.
 */
import { C2_CM_K } from '../../physics/constants'
import { PhysicsError, assertFiniteInRange } from '../../physics/errors'
import { getIsotopologue } from '../../physics/spectroscopy/isotopologue-lookup'
import {
  defaultPartitionFunctionLookup,
  type PartitionFunction,
  type PartitionFunctionLookup,
} from '../../physics/spectroscopy/partition-function'
import {
  LINEAR_ISOTOPOLOGUES,
  type LinearIsotopologueConstants,
  type LinearVibrationalLevel,
} from '../constants/linear-levels'
import { rovibrationalEnergyCm, sublevelParities } from './rotational-energy'
import { nuclearSpinWeight } from './spin-statistics'

/** Temperature range accepted by the level-sum partition functions, K. */
export const LINEAR_PARTITION_FUNCTION_RANGE_K = { min: 10, max: 1000 } as const

/** Terms with c₂(E − E_min)/T above this are dropped from the rotational sums (e^−50 ≈ 2e-22). */
const MAX_REDUCED_ENERGY = 50

/**
 * Rotational level sum of one vibrational level, relative to its own lowest level:
 * Σ_{J ≥ l, p} g_ns (2J+1) exp(−c₂[E(J,p) − E_min]/T). Returns { sum, minimumEnergyCm }.
 */
function rotationalSum(
  isotopologue: LinearIsotopologueConstants,
  level: LinearVibrationalLevel,
  temperatureK: number,
): { sum: number; minimumEnergyCm: number } {
  const parities = sublevelParities(level)
  const c2OverT = C2_CM_K / temperatureK
  const minimumEnergyCm = Math.min(...parities.map((p) => rovibrationalEnergyCm(level, level.l, p)))
  let sum = 0
  for (let j = level.l; j <= 1000; j++) {
    let smallest = Infinity
    for (const parity of parities) {
      const reduced = c2OverT * (rovibrationalEnergyCm(level, j, parity) - minimumEnergyCm)
      smallest = Math.min(smallest, reduced)
      const weight = nuclearSpinWeight(isotopologue, level, j, parity)
      if (weight > 0) sum += weight * (2 * j + 1) * Math.exp(-reduced)
    }
    if (smallest > MAX_REDUCED_ENERGY) return { sum, minimumEnergyCm }
  }
  throw new PhysicsError('OUT_OF_RANGE', 'rotational sum did not converge by J = 1000', {
    code: isotopologue.code,
    level: level.label,
    temperatureK,
  })
}

/**
 * Harmonic-oscillator remainder Σ d exp(−c₂E_h/T) over the normal-mode states (v₁, v₂, l, v₃) not
 * represented by a listed level, E_h = v₁ν₁ + v₂ν₂ + v₃ν₃, d = 1 (l = 0) or 2 (l > 0):
 * the closed-form harmonic product 1/[(1 − x₁)(1 − x₂)²(1 − x₃)], x_i = e^{−c₂ν_i/T}, minus the
 * harmonic terms of the listed states (clamped at 0 against rounding).
 */
function harmonicRemainder(isotopologue: LinearIsotopologueConstants, temperatureK: number) {
  const { nu1, nu2, nu3 } = isotopologue.harmonicFundamentalsCm
  const c2OverT = C2_CM_K / temperatureK
  const x1 = Math.exp(-c2OverT * nu1)
  const x2 = Math.exp(-c2OverT * nu2)
  const x3 = Math.exp(-c2OverT * nu3)
  const product = 1 / ((1 - x1) * (1 - x2) * (1 - x2) * (1 - x3))
  let listed = 0
  for (const level of isotopologue.levels) {
    const { v1, v2, v3 } = level.quanta
    listed += (level.l === 0 ? 1 : 2) * x1 ** v1 * x2 ** v2 * x3 ** v3
  }
  return Math.max(0, product - listed)
}

/** Throws unless the listed levels map to distinct, valid normal-mode states. */
function checkLevelQuanta(isotopologue: LinearIsotopologueConstants): void {
  const keys = new Set<string>()
  for (const level of isotopologue.levels) {
    const { v1, v2, v3 } = level.quanta
    const key = `${v1},${v2},${level.l},${v3}`
    if (level.l > v2 || (v2 - level.l) % 2 !== 0 || keys.has(key)) {
      throw new PhysicsError(
        'INVALID_ARGUMENT',
        `level ${level.label} of ${isotopologue.code}: quanta ${key} invalid or repeated`,
        { key },
      )
    }
    keys.add(key)
  }
}

/**
 * Total internal partition function Q(T) of a linear isotopologue by direct level summation.
 *
 * Method: Q(T) = g_i { Σ_v Σ_{J ≥ l_v, p = e/f} g_ns (2J+1) exp(−c₂E(v,J,p)/T)
 *                      + Q_rot,0(T) Σ_{unlisted h} d_h exp(−c₂E_h/T) },
 * where the first sum runs over the listed vibrational levels with the energies and nuclear-spin
 * weights used by the band generator, g_i is the state-independent degeneracy of the isotopologue
 * table, Q_rot,0 the rotational sum of the ground state and the second sum a harmonic-oscillator
 * count of the vibrational states not listed (E_h = v₁ν₁ + v₂ν₂ + v₃ν₃, d_h = 2 for l > 0),
 * evaluated as the closed-form harmonic product minus the harmonic terms of the listed states.
 * Notes: at 296 K the listed levels carry all but ~1e-5 of Q, and Q(296) agrees with the published
 * totals to better than 0.01 % (626: 286.10 vs 286.09; 446: 4984.7 vs 4984.9; tests). Above
 * ~500 K the harmonic remainder (no anharmonicity, no rotation–vibration coupling) makes Q
 * uncertain by ~1 % or more. Dimensionless.
 * Accepts 10–1000 K.
 * Source: statistical thermodynamics of linear molecules, Herzberg 1945, Infrared and Raman
 * Spectra, ch. V (from memory); nuclear statistics as `nuclearSpinWeight`; published Q(296) for
 * comparison: Gordon et al. 2022, JQSRT 277, 107949 (isotopologue table).
 * @param isotopologue isotopologue constants
 */
export function linearPartitionFunction(
  isotopologue: LinearIsotopologueConstants,
): PartitionFunction {
  const stateIndependentDegeneracy = getIsotopologue(
    isotopologue.moleculeId,
    isotopologue.isotopologueId,
  ).stateIndependentDegeneracy
  checkLevelQuanta(isotopologue)
  const ground = isotopologue.levels[0]
  const { min, max } = LINEAR_PARTITION_FUNCTION_RANGE_K
  return (temperatureK: number): number => {
    assertFiniteInRange('temperatureK', temperatureK, min, max)
    const c2OverT = C2_CM_K / temperatureK
    let sum = 0
    for (const level of isotopologue.levels) {
      const { sum: rotational, minimumEnergyCm } = rotationalSum(isotopologue, level, temperatureK)
      sum += rotational * Math.exp(-c2OverT * minimumEnergyCm)
    }
    const groundRotational = rotationalSum(isotopologue, ground, temperatureK).sum
    sum += groundRotational * harmonicRemainder(isotopologue, temperatureK)
    return stateIndependentDegeneracy * sum
  }
}

/** The linear isotopologue constants for (molecule, isotopologue), or undefined. */
export function findLinearIsotopologue(
  moleculeId: number,
  isotopologueId: number,
): LinearIsotopologueConstants | undefined {
  return LINEAR_ISOTOPOLOGUES.find(
    (iso) => iso.moleculeId === moleculeId && iso.isotopologueId === isotopologueId,
  )
}

/**
 * Partition-function look-up for the optics code: the level-sum functions of the catalogue's linear
 * isotopologues (CO2 626, 636, 628; N2O 446), and the approximate table functions of
 * `shared/physics/spectroscopy` for every other isotopologue.
 */
export const linearPartitionFunctionLookup: PartitionFunctionLookup = (
  moleculeId,
  isotopologueId,
) => {
  const linear = findLinearIsotopologue(moleculeId, isotopologueId)
  return linear
    ? linearPartitionFunction(linear)
    : defaultPartitionFunctionLookup(moleculeId, isotopologueId)
}
