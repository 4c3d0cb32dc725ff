/**
 * Hönl–London (rotational line-strength) factors of linear-molecule vibration–rotation bands.
 */
import { PhysicsError, assertFiniteInRange } from '../../physics/errors'

/** Rotational branch: ΔJ = J′ − J″ = −1 (P), 0 (Q), +1 (R). */
export type BranchDeltaJ = -1 | 0 | 1

/**
 * Hönl–London factor L(J″) for a transition from lower level (J″, l″) with Δl = l′ − l″.
 *
 * Method (J = J″, l = l″):
 * - Δl = +1: R (J+l+2)(J+l+1)/[2(J+1)], Q (J+l+1)(J−l)(2J+1)/[2J(J+1)], P (J−l−1)(J−l)/(2J);
 * - Δl = −1: the same with l → −l;
 * - Δl = 0: R (J+1+l)(J+1−l)/(J+1), Q l²(2J+1)/[J(J+1)], P (J+l)(J−l)/J.
 * Each set sums to 2J+1 over the three branches. Factors vanish where the upper level does not
 * exist (J′ < l′); Q of a Σ–Σ band is 0. For l″ = 0 and Δl = +1 they reduce to (J+2)/2, (2J+1)/2,
 * (J−1)/2; for Σ–Σ to J+1 and J.
 * Notes: dimensionless; |Δl| ≤ 1 only (throws UNSUPPORTED otherwise). The factors are those of the
 * (e + f) pair; see `band-generator.ts` for how a pair is split between e and f sublevels.
 * Source: Herzberg 1945, Infrared and Raman Spectra, ch. IV, Table of
 * intensity factors for linear molecules (from memory).
 * @param deltaJ branch (−1 P, 0 Q, +1 R)
 * @param lowerJ J″ (integer ≥ l″)
 * @param lowerL l″ (integer ≥ 0)
 * @param deltaL l′ − l″ (−1, 0 or +1)
 */
export function honlLondonFactor(
  deltaJ: BranchDeltaJ,
  lowerJ: number,
  lowerL: number,
  deltaL: number,
): number {
  assertFiniteInRange('lowerL', lowerL, 0, 100)
  assertFiniteInRange('lowerJ', lowerJ, lowerL, 10000)
  if (!Number.isInteger(lowerJ) || !Number.isInteger(lowerL)) {
    throw new PhysicsError('INVALID_ARGUMENT', 'J″ and l″ must be integers', { lowerJ, lowerL })
  }
  if (deltaL !== -1 && deltaL !== 0 && deltaL !== 1) {
    throw new PhysicsError('UNSUPPORTED', `|Δl| > 1 bands are not supported (Δl = ${deltaL})`, {
      deltaL,
    })
  }
  if (deltaL === -1 && lowerL === 0) {
    throw new PhysicsError('INVALID_ARGUMENT', 'Δl = −1 needs l″ ≥ 1', { lowerL, deltaL })
  }
  const j = lowerJ
  if (deltaL === 0) {
    const l = lowerL
    if (deltaJ === 1) return ((j + 1 + l) * (j + 1 - l)) / (j + 1)
    if (j === 0) return 0
    if (deltaJ === 0) return (l * l * (2 * j + 1)) / (j * (j + 1))
    return ((j + l) * (j - l)) / j
  }
  const l = deltaL === 1 ? lowerL : -lowerL
  if (deltaJ === 1) return Math.max(0, ((j + l + 2) * (j + l + 1)) / (2 * (j + 1)))
  if (j === 0) return 0
  if (deltaJ === 0) return Math.max(0, ((j + l + 1) * (j - l) * (2 * j + 1)) / (2 * j * (j + 1)))
  return Math.max(0, ((j - l - 1) * (j - l)) / (2 * j))
}
