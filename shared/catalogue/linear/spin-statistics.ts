/**
 * Nuclear-spin statistics of the rotational levels of linear molecules.
 */
import type {
  LinearIsotopologueConstants,
  LinearVibrationalLevel,
} from '../constants/linear-levels'
import type { RotationalParity } from './rotational-energy'

/**
 * Relative nuclear-spin weight (0 or 1) of a rovibrational level; 0 means the level does not exist.
 *
 * Method: in ¹⁶O¹²C¹⁶O and ¹⁶O¹³C¹⁶O the two ¹⁶O nuclei are spin-0 bosons, so only levels symmetric
 * under their exchange exist. The total parity is ±(−1)^J (+ for e, − for f levels), and a level is
 * exchange-symmetric when (parity +, vibrational state g) or (parity −, state u). Hence: Σg⁺ ground
 * state only even J; Πu (01101) e levels odd J, f levels even J; Δg (02201) e even, f odd;
 * Σu⁺ (00011) only odd J. Molecules without the symmetry (628, 627, N2O) keep every level
 * (weight 1).
 * Notes: the state-independent factor g_i (e.g. 2 for ¹³C, 9 for ¹⁴N₂) is NOT included here; it is
 * carried by the partition function and the statistical weights, as in the database convention.
 * Source: Herzberg 1945, Infrared and Raman Spectra, ch. I–IV (symmetry of rotational levels and
 * nuclear statistics; from memory).
 * @param isotopologue isotopologue constants
 * @param level vibrational level
 * @param j J (integer ≥ l)
 * @param parity e or f
 */
export function nuclearSpinWeight(
  isotopologue: LinearIsotopologueConstants,
  level: LinearVibrationalLevel,
  j: number,
  parity: RotationalParity,
): 0 | 1 {
  if (!isotopologue.exchangeSymmetric) return 1
  const parityPlus = (parity === 'e') === (j % 2 === 0)
  return parityPlus === (level.inversion === 'g') ? 1 : 0
}
