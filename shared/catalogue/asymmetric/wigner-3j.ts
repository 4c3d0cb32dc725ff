/**
 * Wigner 3j symbols for integer angular momenta, by the Racah formula with a table of log
 * factorials. Used for direction-cosine matrix elements in the symmetric-top basis.
 */
import { PhysicsError } from '../../physics/errors'

/** A table of ln(k!) for k = 0 … size − 1. */
export function logFactorialTable(size: number): Float64Array {
  if (!Number.isInteger(size) || size < 1) {
    throw new PhysicsError('INVALID_ARGUMENT', `log-factorial table size must be an integer ≥ 1`, {
      size,
    })
  }
  const table = new Float64Array(size)
  for (let k = 2; k < size; k++) table[k] = table[k - 1] + Math.log(k)
  return table
}

/**
 * Wigner 3j symbol (j1 j2 j3; m1 m2 m3) for integer arguments.
 *
 * Method: Racah's formula
 * (j1 j2 j3; m1 m2 m3) = (−1)^{j1−j2−m3} √Δ(j1 j2 j3) √[(j1+m1)!(j1−m1)!(j2+m2)!(j2−m2)!(j3+m3)!(j3−m3)!]
 *   × Σ_k (−1)^k / [k! (j3−j2+k+m1)! (j3−j1+k−m2)! (j1+j2−j3−k)! (j1−k−m1)! (j2−k+m2)!],
 * Δ = (j1+j2−j3)!(j1−j2+j3)!(−j1+j2+j3)!/(j1+j2+j3+1)!, each term formed as exp of a sum of log
 * factorials. Zero unless m1 + m2 + m3 = 0, |m_i| ≤ j_i and the triangle rule hold.
 * Notes: integer j only (all Tauline needs). With j2 = 1 the sum has at most two terms and the
 * result is accurate to ~1e-14 relative; for large j2 the alternating sum can lose digits.
 * Dimensionless.
 * Source: Edmonds, Angular Momentum in Quantum Mechanics (1957), eq. (3.7.3); Zare, Angular
 * Momentum (1988), eq. (2.34) (from memory).
 * @param logFactorial table from `logFactorialTable`, length > j1 + j2 + j3 + 1
 */
export function wigner3j(
  j1: number,
  j2: number,
  j3: number,
  m1: number,
  m2: number,
  m3: number,
  logFactorial: Float64Array,
): number {
  if (m1 + m2 + m3 !== 0) return 0
  if (Math.abs(m1) > j1 || Math.abs(m2) > j2 || Math.abs(m3) > j3) return 0
  if (j3 < Math.abs(j1 - j2) || j3 > j1 + j2) return 0
  if (j1 + j2 + j3 + 1 >= logFactorial.length) {
    throw new PhysicsError('OUT_OF_RANGE', 'log-factorial table too short for the 3j symbol', {
      j1,
      j2,
      j3,
      tableLength: logFactorial.length,
    })
  }
  const lf = logFactorial
  const logPrefactor =
    0.5 *
    (lf[j1 + j2 - j3] +
      lf[j1 - j2 + j3] +
      lf[-j1 + j2 + j3] -
      lf[j1 + j2 + j3 + 1] +
      lf[j1 + m1] +
      lf[j1 - m1] +
      lf[j2 + m2] +
      lf[j2 - m2] +
      lf[j3 + m3] +
      lf[j3 - m3])
  const kMin = Math.max(0, j2 - j3 - m1, j1 - j3 + m2)
  const kMax = Math.min(j1 + j2 - j3, j1 - m1, j2 + m2)
  let sum = 0
  for (let k = kMin; k <= kMax; k++) {
    const logTerm =
      logPrefactor -
      (lf[k] +
        lf[j3 - j2 + k + m1] +
        lf[j3 - j1 + k - m2] +
        lf[j1 + j2 - j3 - k] +
        lf[j1 - k - m1] +
        lf[j2 - k + m2])
    sum += (k % 2 === 0 ? 1 : -1) * Math.exp(logTerm)
  }
  const phase = (j1 - j2 - m3) % 2 === 0 ? 1 : -1
  return phase * sum
}
