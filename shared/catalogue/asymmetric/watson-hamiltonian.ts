/**
 * Rotational levels of an asymmetric top from Watson's A-reduced Hamiltonian (I^r representation)
 * in the symmetric-top basis |J, K⟩, diagonalised per J in the four Wang blocks E+, E−, O+, O−,
 * with J_{Ka,Kc} labels from the symmetry of each block.
 */
import { PhysicsError, assertFiniteInRange } from '../../physics/errors'
import type { WatsonConstantsCm } from './constants/types'
import { symmetricEigen } from './jacobi-eigen'

/** Wang block: parity of K and sign of the combination (|K⟩ ± |−K⟩)/√2. */
export type WangBlock = 'E+' | 'E-' | 'O+' | 'O-'

/** One rotational level J_{Ka,Kc}. */
export interface RotationalLevel {
  /** Total angular momentum J. */
  j: number
  /** Ka (K₋₁), the prolate-limit K. */
  ka: number
  /** Kc (K₊₁), the oblate-limit K. */
  kc: number
  /** Rotational energy, cm⁻¹ (relative to the J = 0 level of the same vibrational state). */
  energyCm: number
  /** Wang block the level belongs to. */
  block: WangBlock
  /**
   * Eigenvector in the symmetric-top basis: component of |J, K⟩ at index K + J (length 2J + 1),
   * real, normalised.
   */
  vector: Float64Array
}

/** Largest J accepted (keeps the matrices and log-factorial tables small). */
export const MAX_ROTATIONAL_J = 200

function checkJ(j: number): void {
  if (!Number.isInteger(j) || j < 0 || j > MAX_ROTATIONAL_J) {
    throw new PhysicsError('OUT_OF_RANGE', `J must be an integer in [0, ${MAX_ROTATIONAL_J}]`, {
      j,
    })
  }
}

function checkConstants(constants: WatsonConstantsCm): void {
  for (const key of ['A', 'B', 'C'] as const) {
    assertFiniteInRange(key, constants[key], Number.MIN_VALUE, Infinity)
  }
  if (!(constants.A >= constants.B && constants.B >= constants.C)) {
    throw new PhysicsError('INVALID_ARGUMENT', 'rotational constants must satisfy A ≥ B ≥ C', {
      A: constants.A,
      B: constants.B,
      C: constants.C,
    })
  }
  const optional = ['DeltaJ', 'DeltaJK', 'DeltaK', 'deltaJ', 'deltaK'] as const
  for (const key of optional) assertFiniteInRange(key, constants[key], -Infinity, Infinity)
  const sextic = ['HJ', 'HJK', 'HKJ', 'HK', 'hJ', 'hJK', 'hK'] as const
  for (const key of sextic) {
    const value = constants[key]
    if (value !== undefined) assertFiniteInRange(key, value, -Infinity, Infinity)
  }
}

/**
 * Diagonal matrix element ⟨J,K|H|J,K⟩ of the A-reduced Hamiltonian, cm⁻¹.
 *
 * Method: with X = J(J+1),
 * E = ½(B+C)(X − K²) + A K² − Δ_J X² − Δ_JK X K² − Δ_K K⁴ + H_J X³ + H_JK X² K² + H_KJ X K⁴ + H_K K⁶.
 * Source: Watson 1977 (Vibrational Spectra and Structure vol. 6, ed. Durig), A reduction; Gordy &
 * Cook, Microwave Molecular Spectra, 3rd ed. (1984), ch. 8 (from memory).
 */
export function watsonDiagonalCm(constants: WatsonConstantsCm, j: number, k: number): number {
  const x = j * (j + 1)
  const k2 = k * k
  const c = constants
  return (
    0.5 * (c.B + c.C) * (x - k2) +
    c.A * k2 -
    c.DeltaJ * x * x -
    c.DeltaJK * x * k2 -
    c.DeltaK * k2 * k2 +
    (c.HJ ?? 0) * x * x * x +
    (c.HJK ?? 0) * x * x * k2 +
    (c.HKJ ?? 0) * x * k2 * k2 +
    (c.HK ?? 0) * k2 * k2 * k2
  )
}

/**
 * Off-diagonal matrix element ⟨J,K+2|H|J,K⟩ (= ⟨J,K|H|J,K+2⟩, real) of the A-reduced
 * Hamiltonian, cm⁻¹.
 *
 * Method: J_x² − J_y² = ½(J₊² + J₋²) with ⟨K+2|J₊²|K⟩ = f(J,K) = √{[X − K(K+1)][X − (K+1)(K+2)]}
 * (phase convention of Zare 1988, positive), so
 * ⟨K+2|H|K⟩ = f(J,K)·[¼(B − C) − δ_J X − ½δ_K(K² + K′²) + h_J X² + ½h_JK X (K² + K′²)
 * + ½h_K(K⁴ + K′⁴)], K′ = K + 2.
 * Source: as `watsonDiagonalCm`.
 */
export function watsonOffDiagonalCm(constants: WatsonConstantsCm, j: number, k: number): number {
  const x = j * (j + 1)
  const kp = k + 2
  const f2 = (x - k * (k + 1)) * (x - (k + 1) * (k + 2))
  if (f2 <= 0) return 0
  const c = constants
  const k2 = k * k
  const kp2 = kp * kp
  const sum2 = k2 + kp2
  const sum4 = k2 * k2 + kp2 * kp2
  return (
    Math.sqrt(f2) *
    (0.25 * (c.B - c.C) -
      c.deltaJ * x -
      0.5 * c.deltaK * sum2 +
      (c.hJ ?? 0) * x * x +
      0.5 * (c.hJK ?? 0) * x * sum2 +
      0.5 * (c.hK ?? 0) * sum4)
  )
}

/**
 * The full (2J+1) × (2J+1) Hamiltonian matrix of one J in the |J,K⟩ basis (row-major, index K + J).
 *
 * Method: `watsonDiagonalCm` on the diagonal, `watsonOffDiagonalCm` on the ΔK = ±2 diagonals.
 * Notes: for tests and small J; the level computation uses the Wang blocks. Units cm⁻¹.
 * Source: as `watsonDiagonalCm`.
 */
export function watsonHamiltonianMatrix(constants: WatsonConstantsCm, j: number): Float64Array {
  checkConstants(constants)
  checkJ(j)
  const n = 2 * j + 1
  const h = new Float64Array(n * n)
  for (let k = -j; k <= j; k++) {
    h[(k + j) * n + (k + j)] = watsonDiagonalCm(constants, j, k)
    if (k + 2 <= j) {
      const off = watsonOffDiagonalCm(constants, j, k)
      h[(k + 2 + j) * n + (k + j)] = off
      h[(k + j) * n + (k + 2 + j)] = off
    }
  }
  return h
}

/** The K values (≥ 0) spanning a Wang block of a given J. */
function blockKs(j: number, block: WangBlock): number[] {
  const ks: number[] = []
  const odd = block === 'O+' || block === 'O-'
  const plus = block === 'E+' || block === 'O+'
  for (let k = odd ? 1 : plus ? 0 : 2; k <= j; k += 2) ks.push(k)
  return ks
}

/**
 * Labels (Ka, Kc) of the levels of one Wang block, in ascending energy.
 *
 * Method: Ka equals the K parity class of the block. Under the C2 rotation about the b (= x) axis
 * the Wang function (|K⟩ ± |−K⟩)/√2 has the eigenvalue ±(−1)^J, and the asymmetric-top level
 * J_{Ka,Kc} has (−1)^{Ka+Kc}; hence Kc = J − Ka in the + blocks and Kc = J − Ka + 1 in the −
 * blocks. Within one block (one symmetry species) levels do not cross, so their energy order
 * is the rigid-rotor order, i.e. increasing Ka.
 * Source: King, Hainer & Cross 1943, J. Chem. Phys. 11, 27 (symmetry classification); Gordy &
 * Cook ch. 7 (from memory).
 */
function blockLabels(j: number, block: WangBlock): Array<{ ka: number; kc: number }> {
  const plus = block === 'E+' || block === 'O+'
  return blockKs(j, block).map((ka) => ({ ka, kc: plus ? j - ka : j - ka + 1 }))
}

const BLOCKS: readonly WangBlock[] = ['E+', 'E-', 'O+', 'O-']

/**
 * Rotational levels of one J: energies, J_{Ka,Kc} labels and eigenvectors.
 *
 * Method: the Hamiltonian (`watsonHamiltonianMatrix`) factorises in the Wang basis
 * {|0⟩, (|K⟩ ± |−K⟩)/√2} into four blocks E± (even K) and O± (odd K); each block is tridiagonal in
 * K and is diagonalised by `symmetricEigen` (Jacobi). Eigenvectors are transformed back to the
 * |J, K⟩ basis. Labels as in the block-label rule above.
 * Notes: returns 2J + 1 levels sorted by τ = Ka − Kc (the rigid-rotor energy order; with
 * centrifugal distortion, near-degenerate pairs of different symmetry may be out of energy order).
 * Accuracy is that of the constants: the Watson expansion converges poorly for light molecules
 * at high K (see the water constants table). Units cm⁻¹.
 * Source: Wang 1929, Phys. Rev. 34, 243 (Wang transformation); Gordy & Cook ch. 7–8 (from memory).
 */
export function asymmetricTopLevels(constants: WatsonConstantsCm, j: number): RotationalLevel[] {
  checkConstants(constants)
  checkJ(j)
  const n = 2 * j + 1
  const levels: RotationalLevel[] = []
  for (const block of BLOCKS) {
    const ks = blockKs(j, block)
    const size = ks.length
    if (size === 0) continue
    const sign = block === 'E+' || block === 'O+' ? 1 : -1
    const m = new Float64Array(size * size)
    for (let a = 0; a < size; a++) {
      const k = ks[a]
      let diagonal = watsonDiagonalCm(constants, j, k)
      // ⟨K=1,±|H|K=1,±⟩ picks up ±⟨1|H|−1⟩ (the ΔK = 2 element from K = −1 to K = +1).
      if (k === 1) diagonal += sign * watsonOffDiagonalCm(constants, j, -1)
      m[a * size + a] = diagonal
      if (a + 1 < size) {
        let off = watsonOffDiagonalCm(constants, j, k)
        // ⟨(|2⟩ + |−2⟩)/√2|H|0⟩ = √2 ⟨2|H|0⟩.
        if (k === 0) off *= Math.SQRT2
        m[a * size + a + 1] = off
        m[(a + 1) * size + a] = off
      }
    }
    const eigen = symmetricEigen(m, size)
    const labels = blockLabels(j, block)
    for (let e = 0; e < size; e++) {
      const vector = new Float64Array(n)
      for (let a = 0; a < size; a++) {
        const coefficient = eigen.vectors[a * size + e]
        const k = ks[a]
        if (k === 0) {
          vector[j] = coefficient
        } else {
          vector[k + j] = coefficient * Math.SQRT1_2
          vector[-k + j] = sign * coefficient * Math.SQRT1_2
        }
      }
      levels.push({
        j,
        ka: labels[e].ka,
        kc: labels[e].kc,
        energyCm: eigen.values[e],
        block,
        vector,
      })
    }
  }
  levels.sort((x, y) => x.ka - x.kc - (y.ka - y.kc))
  return levels
}

/**
 * Rotational levels for J = 0 … jMax (index J of the result).
 *
 * Method: `asymmetricTopLevels` per J. Units cm⁻¹. Source: as `asymmetricTopLevels`.
 */
export function asymmetricTopLevelsUpTo(
  constants: WatsonConstantsCm,
  jMax: number,
): RotationalLevel[][] {
  checkJ(jMax)
  const result: RotationalLevel[][] = []
  for (let j = 0; j <= jMax; j++) result.push(asymmetricTopLevels(constants, j))
  return result
}
