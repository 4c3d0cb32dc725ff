import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { logFactorialTable, wigner3j } from '../../../../shared/catalogue/asymmetric/wigner-3j'
import { expectAbsoluteClose } from '../../../support/expect-close'

const lf = logFactorialTable(300)

/** (j1 j2 J; m1 m2 −M) from a Clebsch–Gordan coefficient: ⟨j1 m1 j2 m2|J M⟩ (−1)^{j1−j2+M}/√(2J+1). */
function threeJFromCg(cg: number, j1: number, j2: number, bigJ: number, bigM: number): number {
  return ((j1 - j2 + bigM) % 2 === 0 ? 1 : -1) * (cg / Math.sqrt(2 * bigJ + 1))
}

describe('wigner3j', () => {
  it('when given (1 1 1; 1 −1 0), returns 1/√6', () => {
    // Edmonds 1957, Table 2 (from memory); also the J = 1 case of the formula below.
    expectAbsoluteClose(wigner3j(1, 1, 1, 1, -1, 0, lf), 1 / Math.sqrt(6), 1e-15)
  })

  it('when given (j 1 j; m 0 −m), matches ⟨j m 1 0|j m⟩ = m/√(j(j+1))', () => {
    // Condon & Shortley 1935 table of ⟨j1 m1 1 m2|j m⟩ (from memory) with the CG–3j relation
    // (Edmonds 1957, eq. 3.7.3); absolute tolerance 1e-13.
    for (const j of [1, 2, 7, 40, 90]) {
      for (const m of [-j, -1, 0, 1, j]) {
        const expected = threeJFromCg(m / Math.sqrt(j * (j + 1)), j, 1, j, m)
        expectAbsoluteClose(wigner3j(j, 1, j, m, 0, -m, lf), expected, 1e-13, `j=${j} m=${m}`)
      }
    }
  })

  it('when given (j 1 j+1; m 0 −m), matches ⟨j m 1 0|j+1 m⟩ = √[(j−m+1)(j+m+1)/((2j+1)(j+1))]', () => {
    // Condon & Shortley table (from memory); absolute tolerance 1e-13.
    for (const j of [0, 1, 3, 25, 100]) {
      for (const m of [-j, 0, j]) {
        const cg = Math.sqrt(((j - m + 1) * (j + m + 1)) / ((2 * j + 1) * (j + 1)))
        const expected = threeJFromCg(cg, j, 1, j + 1, m)
        expectAbsoluteClose(wigner3j(j, 1, j + 1, m, 0, -m, lf), expected, 1e-13, `j=${j} m=${m}`)
      }
    }
  })

  it('when summed over m1, m2, returns the orthogonality value 1/(2j3+1)', () => {
    // Σ_{m1 m2} (j1 j2 j3; m1 m2 m3)² = 1/(2j3+1) (Edmonds 1957, eq. 3.7.8); tolerance 1e-13.
    for (const [j1, j2, j3, m3] of [
      [5, 1, 6, 2],
      [12, 1, 12, -3],
      [60, 1, 59, 10],
      [3, 2, 4, 1],
    ]) {
      let sum = 0
      for (let m1 = -j1; m1 <= j1; m1++) {
        const w = wigner3j(j1, j2, j3, m1, -m1 - m3, m3, lf)
        sum += w * w
      }
      expectAbsoluteClose(sum, 1 / (2 * j3 + 1), 1e-13, `${j1} ${j2} ${j3}`)
    }
  })

  it('when the projections do not add to zero or the triangle rule fails, returns 0', () => {
    expect(wigner3j(2, 1, 2, 1, 1, 1, lf)).toBe(0)
    expect(wigner3j(5, 1, 7, 0, 0, 0, lf)).toBe(0)
    expect(wigner3j(2, 1, 2, 3, -3, 0, lf)).toBe(0)
  })

  it('when the log-factorial table is too short, throws PhysicsError', () => {
    expect(() => wigner3j(50, 1, 50, 0, 0, 0, logFactorialTable(10))).toThrow(PhysicsError)
  })
})
