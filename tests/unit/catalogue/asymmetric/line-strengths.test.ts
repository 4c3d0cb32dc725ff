import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { C2_CM_K, PLANCK_J_S } from '../../../../shared/physics/constants'
import {
  RADIATIVE_PREFACTOR_CGS,
  createDirectionCosineKernel,
  dipoleLineIntensityCmPerMolecule,
  einsteinAFromIntensityPerS,
  isAllowedBySymmetry,
  rotationalLineStrength,
  spinWeight,
} from '../../../../shared/catalogue/asymmetric/line-strengths'
import { asymmetricTopLevels } from '../../../../shared/catalogue/asymmetric/watson-hamiltonian'
import { logFactorialTable } from '../../../../shared/catalogue/asymmetric/wigner-3j'
import { WATER_STATES } from '../../../../shared/catalogue/asymmetric/constants/water'
import type { TransitionType } from '../../../../shared/catalogue/asymmetric/constants/types'
import { expectRelativeClose } from '../../../support/expect-close'

const lf = logFactorialTable(200)
const WATER_000 = WATER_STATES[0].constants
const TYPES: readonly TransitionType[] = ['a', 'b', 'c']

function strength(
  constants: typeof WATER_000,
  type: TransitionType,
  lower: [number, number, number],
  upper: [number, number, number],
): number {
  const lo = asymmetricTopLevels(constants, lower[0]).find(
    (l) => l.ka === lower[1] && l.kc === lower[2],
  )
  const up = asymmetricTopLevels(constants, upper[0]).find(
    (l) => l.ka === upper[1] && l.kc === upper[2],
  )
  if (!lo || !up) throw new Error('level missing')
  return rotationalLineStrength(
    createDirectionCosineKernel(lo.j, up.j, type, lf),
    lo.vector,
    up.vector,
  )
}

describe('rotationalLineStrength', () => {
  it('when summed over all upper levels J′ = J″, J″ ± 1, returns 2J″ + 1 for a-, b- and c-type (sum rule)', () => {
    // Σ_{J′τ′} λ = 2J″ + 1 (completeness of the direction cosines; Gordy & Cook 1984, ch. 7,
    // from memory). Relative tolerance 1e-12.
    for (const type of TYPES) {
      for (let jl = 0; jl <= 9; jl++) {
        const lower = asymmetricTopLevels(WATER_000, jl)
        for (const lo of lower) {
          let sum = 0
          for (let ju = Math.max(0, jl - 1); ju <= jl + 1; ju++) {
            if (ju + jl < 1) continue
            const kernel = createDirectionCosineKernel(jl, ju, type, lf)
            for (const up of asymmetricTopLevels(WATER_000, ju)) {
              sum += rotationalLineStrength(kernel, lo.vector, up.vector)
            }
          }
          expectRelativeClose(sum, 2 * jl + 1, 1e-12, `${type} ${jl}_${lo.ka}${lo.kc}`)
        }
      }
    }
  })

  it('when a transition violates the Ka/Kc parity rules of its type, returns (numerically) zero', () => {
    // Asymmetric-rotor selection rules (Gordy & Cook 1984, ch. 7; from memory):
    // a: ee↔eo, oe↔oo; b: ee↔oo, eo↔oe; c: ee↔oe, eo↔oo. Forbidden λ < 1e-20.
    let forbiddenMax = 0
    let allowedCount = 0
    for (const type of TYPES) {
      for (let jl = 0; jl <= 7; jl++) {
        for (let ju = Math.max(0, jl - 1); ju <= jl + 1; ju++) {
          if (ju + jl < 1) continue
          const kernel = createDirectionCosineKernel(jl, ju, type, lf)
          for (const lo of asymmetricTopLevels(WATER_000, jl)) {
            for (const up of asymmetricTopLevels(WATER_000, ju)) {
              const value = rotationalLineStrength(kernel, lo.vector, up.vector)
              if (isAllowedBySymmetry(type, lo.ka, lo.kc, up.ka, up.kc)) allowedCount++
              else forbiddenMax = Math.max(forbiddenMax, value)
            }
          }
        }
      }
    }
    expect(forbiddenMax).toBeLessThan(1e-20)
    expect(allowedCount).toBeGreaterThan(1000)
  })

  it('when the roles of upper and lower level are exchanged, returns the same λ', () => {
    // λ is symmetric (Σ over both M sets of |⟨|μ|⟩|²; common practice). Relative tolerance 1e-12.
    const forward = strength(WATER_000, 'b', [5, 2, 3], [6, 1, 6])
    const backward = strength(WATER_000, 'b', [6, 1, 6], [5, 2, 3])
    expectRelativeClose(backward, forward, 1e-12)
  })

  it('when given water 1_01 → 1_10 and 0_00 → 1_11 (b-type), returns 1.5 and 1', () => {
    // λ(1_01–1_10) = 3/2 and λ(0_00–1_11) = 1 (line-strength tables of Cross, Hainer & King 1944,
    // J. Chem. Phys. 12, 210, reproduced in Townes & Schawlow 1955, App. IV; from memory). For
    // J = 1 they do not depend on the asymmetry. Tolerance 1e-12.
    expectRelativeClose(strength(WATER_000, 'b', [1, 0, 1], [1, 1, 0]), 1.5, 1e-12)
    expectRelativeClose(strength(WATER_000, 'b', [0, 0, 0], [1, 1, 1]), 1, 1e-12)
  })

  it('when the top is a prolate symmetric top (B = C), returns the parallel-band Hönl–London factors', () => {
    // a-type R branch J → J + 1, ΔK = 0: λ = ((J+1)² − K²)/(J+1); Q branch: K²(2J+1)/(J(J+1))
    // (Δl = 0 factors with l → K; Herzberg 1945, Infrared and Raman Spectra, ch. IV; from memory).
    // Tolerance 1e-10 relative.
    const prolate = {
      A: 27.88,
      B: 10,
      C: 10,
      DeltaJ: 0,
      DeltaJK: 0,
      DeltaK: 0,
      deltaJ: 0,
      deltaK: 0,
    }
    for (const j of [1, 3, 6]) {
      for (let k = 1; k <= j; k++) {
        const lower: [number, number, number] = [j, k, j - k]
        const upperR: [number, number, number] = [j + 1, k, j + 1 - k]
        expectRelativeClose(
          strength(prolate, 'a', lower, upperR),
          ((j + 1) ** 2 - k ** 2) / (j + 1),
          1e-10,
          `R J=${j} K=${k}`,
        )
        const upperQ: [number, number, number] = [j, k, j - k + 1]
        expectRelativeClose(
          strength(prolate, 'a', lower, upperQ),
          (k * k * (2 * j + 1)) / (j * (j + 1)),
          1e-10,
          `Q J=${j} K=${k}`,
        )
      }
    }
  })

  it('when ΔJ > 1 is requested, throws PhysicsError', () => {
    expect(() => createDirectionCosineKernel(2, 4, 'a', lf)).toThrow(PhysicsError)
    expect(() => createDirectionCosineKernel(0, 0, 'b', lf)).toThrow(PhysicsError)
  })
})

describe('spinWeight', () => {
  it('when given water levels, returns 3 for ortho (Ka + Kc odd) and 1 for para', () => {
    // H2O nuclear-spin statistics (Townes & Schawlow 1955, ch. 4; from memory): 1_01 and 1_10 are
    // ortho, 0_00 and 1_11 para.
    const weights = WATER_STATES[0].spinWeights
    expect(spinWeight(weights, 0, 1)).toBe(3)
    expect(spinWeight(weights, 1, 0)).toBe(3)
    expect(spinWeight(weights, 0, 0)).toBe(1)
    expect(spinWeight(weights, 1, 1)).toBe(1)
  })
})

describe('dipoleLineIntensityCmPerMolecule and einsteinAFromIntensityPerS', () => {
  it('when combined, reproduce A = 64π⁴ν³ μ² λ / (3h(2J′+1)) of the line strength', () => {
    // Einstein A of an electric-dipole line from its strength (cgs, ν in cm⁻¹): Bernath,
    // Spectra of Atoms and Molecules (2005), ch. 1; Gordy & Cook 1984, ch. 3 (from memory).
    // Relative tolerance 1e-12.
    const nu = 18.5775
    const lambda = 1.5
    const mu = 1.8546
    const jUpper = 1
    const gns = 3
    const q = 174.58
    const s = dipoleLineIntensityCmPerMolecule(nu, 23.794, gns, lambda, mu, q, 0.997317, 296)
    const a = einsteinAFromIntensityPerS(s, nu, 23.794, gns * (2 * jUpper + 1), q, 0.997317, 296)
    const h = PLANCK_J_S * 1e7
    const expected =
      (64 * Math.PI ** 4 * nu ** 3 * mu * mu * 1e-36 * lambda) / (3 * h * (2 * jUpper + 1))
    expectRelativeClose(a, expected, 1e-12)
  })

  it('when the 1_10–1_01 water line at 556.936 GHz is evaluated, returns A ≈ 3.46e-3 s⁻¹', () => {
    // A(1_10–1_01) = 3.458e-3 s⁻¹ (astrophysical water data sets derived from the JPL/CDMS
    // catalogues; from memory). With λ = 1.5, μ = 1.8546 D: tolerance 2 %.
    const s = dipoleLineIntensityCmPerMolecule(18.5775, 23.794, 3, 1.5, 1.8546, 174.58, 1, 296)
    expectRelativeClose(
      einsteinAFromIntensityPerS(s, 18.5775, 23.794, 9, 174.58, 1, 296),
      3.458e-3,
      0.02,
    )
  })

  it('when ν → 0, keeps the stimulated-emission factor accurate (expm1, no cancellation)', () => {
    // S ∝ ν (1 − e^{−c₂ν/T}) with 1 − e^{−x} = x − x²/2 + x³/6 − … (Taylor series, analytic);
    // a naive 1 − exp(−x) would lose ~8 digits at x = 5e-9. Relative tolerance 1e-12.
    const nu = 1e-6
    const x = (C2_CM_K * nu) / 296
    const s = dipoleLineIntensityCmPerMolecule(nu, 0, 1, 1, 1, 1, 1, 296)
    const expected = RADIATIVE_PREFACTOR_CGS * nu * (x - (x * x) / 2 + (x * x * x) / 6) * 1e-36
    expectRelativeClose(s, expected, 1e-12)
  })

  it('when given a non-positive wavenumber or partition function, throws PhysicsError', () => {
    expect(() => dipoleLineIntensityCmPerMolecule(0, 0, 1, 1, 1, 1, 1, 296)).toThrow(PhysicsError)
    expect(() => dipoleLineIntensityCmPerMolecule(1, 0, 1, 1, 1, 0, 1, 296)).toThrow(PhysicsError)
  })
})

describe('isAllowedBySymmetry', () => {
  it('when given the parity classes, applies the a/b/c rules', () => {
    // Gordy & Cook 1984, ch. 7 (from memory): 22 GHz 6_16–5_23 and 557 GHz 1_10–1_01 are b-type.
    expect(isAllowedBySymmetry('c', 2, 3, 1, 6)).toBe(false)
    expect(isAllowedBySymmetry('b', 2, 3, 1, 6)).toBe(true)
    expect(isAllowedBySymmetry('b', 0, 1, 1, 0)).toBe(true)
    expect(isAllowedBySymmetry('a', 0, 2, 0, 3)).toBe(true)
    expect(isAllowedBySymmetry('a', 0, 2, 1, 1)).toBe(false)
    expect(isAllowedBySymmetry('c', 0, 2, 1, 2)).toBe(true)
  })
})
