import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { symmetricEigen } from '../../../../shared/catalogue/asymmetric/jacobi-eigen'
import { expectAbsoluteClose, seededRandom } from '../../../support/expect-close'

function randomSymmetric(n: number, random: () => number): Float64Array {
  const a = new Float64Array(n * n)
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const value = 2 * random() - 1
      a[i * n + j] = value
      a[j * n + i] = value
    }
  }
  return a
}

describe('symmetricEigen', () => {
  it('when given random symmetric matrices, returns eigenvalues summing to the trace that reconstruct the matrix', () => {
    // Invariants (Golub & Van Loan 1996, §8.1): Σλ = tr A, A = V Λ Vᵀ, VᵀV = I. Tolerance 1e-12 ‖A‖.
    const random = seededRandom(20240611)
    for (const n of [1, 2, 3, 5, 12, 31, 60]) {
      const a = randomSymmetric(n, random)
      const { values, vectors } = symmetricEigen(a, n)
      let trace = 0
      let norm = 0
      for (let i = 0; i < n; i++) trace += a[i * n + i]
      for (const value of a) norm = Math.max(norm, Math.abs(value))
      const sum = values.reduce((s, v) => s + v, 0)
      expectAbsoluteClose(sum, trace, 1e-12 * n * norm, `trace n=${n}`)
      for (let k = 1; k < n; k++) expect(values[k]).toBeGreaterThanOrEqual(values[k - 1])
      let reconstruction = 0
      let orthogonality = 0
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          let r = 0
          let o = 0
          for (let k = 0; k < n; k++) {
            r += vectors[i * n + k] * values[k] * vectors[j * n + k]
            o += vectors[k * n + i] * vectors[k * n + j]
          }
          reconstruction = Math.max(reconstruction, Math.abs(r - a[i * n + j]))
          orthogonality = Math.max(orthogonality, Math.abs(o - (i === j ? 1 : 0)))
        }
      }
      expect(reconstruction, `reconstruction n=${n}`).toBeLessThan(1e-12 * n * norm)
      expect(orthogonality, `orthogonality n=${n}`).toBeLessThan(1e-12 * n)
    }
  })

  it('when given the second-difference matrix tridiag(−1, 2, −1), returns 2 − 2cos(kπ/(n+1))', () => {
    // Analytic eigenvalues of the 1-D discrete Laplacian (e.g. Golub & Van Loan 1996, §4.8);
    // absolute tolerance 1e-13.
    const n = 25
    const a = new Float64Array(n * n)
    for (let i = 0; i < n; i++) {
      a[i * n + i] = 2
      if (i + 1 < n) {
        a[i * n + i + 1] = -1
        a[(i + 1) * n + i] = -1
      }
    }
    const { values } = symmetricEigen(a, n)
    for (let k = 1; k <= n; k++) {
      expectAbsoluteClose(values[k - 1], 2 - 2 * Math.cos((k * Math.PI) / (n + 1)), 1e-13, `k=${k}`)
    }
  })

  it('when given [[2, 1], [1, 2]], returns 1 and 3 with vectors (1, −1)/√2 and (1, 1)/√2', () => {
    // Analytic 2 × 2 case (common practice).
    const { values, vectors } = symmetricEigen([2, 1, 1, 2], 2)
    expectAbsoluteClose(values[0], 1, 1e-15)
    expectAbsoluteClose(values[1], 3, 1e-15)
    expectAbsoluteClose(Math.abs(vectors[0 * 2 + 0]), Math.SQRT1_2, 1e-15)
    expectAbsoluteClose(vectors[0 * 2 + 0] * vectors[1 * 2 + 0], -0.5, 1e-15)
    expectAbsoluteClose(vectors[0 * 2 + 1] * vectors[1 * 2 + 1], 0.5, 1e-15)
  })

  it('when given a diagonal matrix, returns its diagonal sorted, with zero sweeps', () => {
    // Exact (common practice).
    const result = symmetricEigen([3, 0, 0, 0, -1, 0, 0, 0, 2], 3)
    expect(Array.from(result.values)).toEqual([-1, 2, 3])
    expect(result.sweeps).toBe(0)
  })

  it('when run twice on the same matrix, returns bit-identical results', () => {
    // Determinism (common practice).
    const a = randomSymmetric(20, seededRandom(7))
    const first = symmetricEigen(a, 20)
    const second = symmetricEigen(a, 20)
    expect(Array.from(second.values)).toEqual(Array.from(first.values))
    expect(Array.from(second.vectors)).toEqual(Array.from(first.vectors))
  })

  it('when given n = 0, a short array or a non-finite entry, throws PhysicsError', () => {
    expect(() => symmetricEigen([], 0)).toThrow(PhysicsError)
    expect(() => symmetricEigen([1, 2, 3], 2)).toThrow(PhysicsError)
    expect(() => symmetricEigen([1, Number.NaN, Number.NaN, 1], 2)).toThrow(PhysicsError)
  })
})
