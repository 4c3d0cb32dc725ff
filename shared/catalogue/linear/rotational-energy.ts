/**
 * Rotational energy levels of a vibrational level of a linear molecule, with e/f l-type doubling.
 */
import { PhysicsError, assertFiniteInRange } from '../../physics/errors'
import type { LinearVibrationalLevel } from '../constants/linear-levels'

/** e/f parity label of a rotational level (Brown et al. 1975, J. Mol. Spectrosc. 55, 500). */
export type RotationalParity = 'e' | 'f'

/** Largest J accepted by the level functions. */
export const MAX_ROTATIONAL_J = 1000

/**
 * The e/f sublevels that exist for a vibrational level with angular momentum l (before nuclear
 * spin statistics): Σ⁺ levels (l = 0) have only e levels; l ≥ 1 levels have both.
 * Source: Brown et al. 1975, J. Mol. Spectrosc. 55, 500 (e/f convention; from memory).
 */
export function sublevelParities(level: LinearVibrationalLevel): readonly RotationalParity[] {
  return level.l === 0 ? ['e'] : ['e', 'f']
}

/**
 * Effective rotational constant of the e or f sublevel.
 *
 * Method: B_e = B − q/2, B_f = B + q/2 for Π levels (l = 1); B for all others (the l-doubling of
 * Δ and Φ levels is of higher order and neglected).
 * Notes: units cm⁻¹. Source: Herzberg 1945, Infrared and Raman Spectra, ch. IV (l-type doubling;
 * from memory).
 */
export function sublevelRotationalConstantCm(
  level: LinearVibrationalLevel,
  parity: RotationalParity,
): number {
  if (level.l !== 1) return level.rotationalConstantCm
  const half = level.lDoublingCm / 2
  return parity === 'e' ? level.rotationalConstantCm - half : level.rotationalConstantCm + half
}

/**
 * Rotational term F(J) of a vibrational level.
 *
 * Method: F(J) = B_p [J(J+1) − l²] − D [J(J+1) − l²]², B_p the e/f rotational constant.
 * Notes: J ≥ l (throws otherwise); F(l) = B_p l. Units cm⁻¹.
 * Source: Herzberg 1945, Infrared and Raman Spectra, ch. IV, rotational energy of linear molecules
 * with vibrational angular momentum (from memory).
 * @param level vibrational level
 * @param j rotational quantum number J (integer, l ≤ J ≤ 1000)
 * @param parity e or f (f only for l ≥ 1)
 */
export function rotationalTermCm(
  level: LinearVibrationalLevel,
  j: number,
  parity: RotationalParity,
): number {
  checkLevelArguments(level, j, parity)
  const x = j * (j + 1) - level.l * level.l
  return sublevelRotationalConstantCm(level, parity) * x - level.centrifugalDistortionCm * x * x
}

/**
 * Energy of a rovibrational level above the ground level (J = 0 of the ground state).
 *
 * Method: E = T_v + F(J), with term value T_v = G_v + B_p l², where G_v is the published
 * vibrational energy (the published convention absorbs −B l² into G_v so that perpendicular Q
 * branches sit at G′ − G″; see `constants/linear-levels.ts`). Equivalently
 * E = G_v + B_p J(J+1) − D [J(J+1) − l²]².
 * Notes: units cm⁻¹. Source: Herzberg 1945, ch. IV (from memory); convention as in the level table.
 * @param level vibrational level
 * @param j J (integer, l ≤ J ≤ 1000)
 * @param parity e or f
 */
export function rovibrationalEnergyCm(
  level: LinearVibrationalLevel,
  j: number,
  parity: RotationalParity,
): number {
  const termValue = level.energyCm + sublevelRotationalConstantCm(level, parity) * level.l * level.l
  return termValue + rotationalTermCm(level, j, parity)
}

function checkLevelArguments(level: LinearVibrationalLevel, j: number, parity: RotationalParity) {
  assertFiniteInRange('J', j, level.l, MAX_ROTATIONAL_J)
  if (!Number.isInteger(j)) {
    throw new PhysicsError('INVALID_ARGUMENT', `J must be an integer, got ${j}`, { j })
  }
  if (parity !== 'e' && parity !== 'f') {
    throw new PhysicsError('INVALID_ARGUMENT', `parity must be 'e' or 'f'`, { parity })
  }
  if (parity === 'f' && level.l === 0) {
    throw new PhysicsError('INVALID_ARGUMENT', `Σ⁺ level ${level.label} has no f sublevels`, {
      label: level.label,
    })
  }
}
