import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { validateSpectralLine } from '../../../../shared/physics/spectroscopy/line'
import {
  createMethanePartitionFunction,
  generateMethaneLines,
  methaneSpinWeightedDegeneracy,
  sphericalTopBranchFraction,
} from '../../../../shared/catalogue/asymmetric/methane'
import { METHANE_NU4 } from '../../../../shared/catalogue/asymmetric/constants/methane'
import { expectAbsoluteClose, expectRelativeClose } from '../../../support/expect-close'

describe('methaneSpinWeightedDegeneracy', () => {
  it('when J = 0 … 6, returns 5, 3, 5, 11, 13, 11, 21', () => {
    // Td species of the J manifolds (J = 0: A1; 1: F1; 2: E + F2; 3: A2 + F1 + F2; 4: A1 + E + F1 +
    // F2; 5: E + 2F1 + F2; 6: A1 + A2 + E + F1 + 2F2) with spin weights A 5, E 2, F 3
    // (Herzberg 1945, ch. I.4; from memory).
    expect([0, 1, 2, 3, 4, 5, 6].map(methaneSpinWeightedDegeneracy)).toEqual([
      5, 3, 5, 11, 13, 11, 21,
    ])
  })

  it('when averaged over many J, tends to (4/3)(2J + 1)', () => {
    // 2⁴ spin states over the symmetry number 12 (Herzberg 1945, ch. I.4); tolerance 1 % over J ≤ 60.
    let weighted = 0
    let plain = 0
    for (let j = 0; j <= 60; j++) {
      weighted += methaneSpinWeightedDegeneracy(j)
      plain += 2 * j + 1
    }
    expectRelativeClose(weighted / plain, 4 / 3, 0.01)
  })
})

describe('sphericalTopBranchFraction', () => {
  it('when summed over P, Q, R, returns 1 (and 1 for R(0) alone)', () => {
    // (2J′+1)/(3(2J″+1)) recoupling weights sum to one (Herzberg 1945, ch. IV.2; analytic).
    for (const j of [1, 2, 10, 30]) {
      const total =
        sphericalTopBranchFraction(j, j - 1) +
        sphericalTopBranchFraction(j, j) +
        sphericalTopBranchFraction(j, j + 1)
      expectRelativeClose(total, 1, 1e-15)
    }
    expect(sphericalTopBranchFraction(0, 1)).toBe(1)
    expect(sphericalTopBranchFraction(0, 0)).toBe(0)
  })
})

describe('generateMethaneLines', () => {
  const lines = generateMethaneLines()

  it('when summed, returns the ν₄ band intensity 5.5e-18 to 1e-12', () => {
    // Table value (recalled range 5.3–5.7e-18, from memory, low confidence); normalisation exact.
    expectRelativeClose(
      lines.reduce((s, l) => s + l.intensityCmPerMolecule, 0),
      5.5e-18,
      1e-12,
    )
  })

  it('when the Q branch is generated, lies at ν₀ − 2Bζ ≈ 1305.94 cm⁻¹ (observed peak ≈1306)', () => {
    // ν₀ = 1310.761, B = 5.241, ζ₄ = 0.46 (constants table); observed Q-branch peak ≈1306
    // (from memory). Tolerance 1e-9 against the formula, 0.5 cm⁻¹ against the observed peak.
    const q = lines.filter((l) => (l.lowerLocalQuanta ?? '').startsWith('Q'))
    const expected = METHANE_NU4.bandOriginCm - 2 * METHANE_NU4.upperBCm * METHANE_NU4.coriolisZeta
    for (const line of q) expectAbsoluteClose(line.wavenumberCm, expected, 1e-9)
    expectAbsoluteClose(expected, 1306, 0.5)
  })

  it('when R(J) and P(J) are generated, follow ν₀ − 2Bζ ± 2B(1 − ζ)m with the D term', () => {
    // Herzberg 1945, ch. IV.2 (spherical-top F2 fundamental, from memory) for B′ = B″ = B,
    // D′ = D″ = D: R(J) = ν₀ − 2Bζ + 2B(1−ζ)(J+1) − D[(J+1)²(J+2)² − J²(J+1)²],
    // P(J) = ν₀ − 2Bζ − 2B(1−ζ)J − D[(J−1)²J² − J²(J+1)²]. Tolerance 1e-9 cm⁻¹.
    const { bandOriginCm: nu0, groundBCm: b, groundDCm: d, coriolisZeta: zeta } = METHANE_NU4
    const byLabel = new Map(lines.map((l) => [l.lowerLocalQuanta, l.wavenumberCm]))
    const x = (j: number): number => j * j * (j + 1) * (j + 1)
    for (let j = 0; j <= 10; j++) {
      const r = nu0 - 2 * b * zeta + 2 * b * (1 - zeta) * (j + 1) - d * (x(j + 1) - x(j))
      expectAbsoluteClose(byLabel.get(`R${j}`) ?? 0, r, 1e-9, `R${j}`)
      if (j >= 1) {
        const p = nu0 - 2 * b * zeta - 2 * b * (1 - zeta) * j - d * (x(j - 1) - x(j))
        expectAbsoluteClose(byLabel.get(`P${j}`) ?? 0, p, 1e-9, `P${j}`)
      }
    }
  })

  it('when all lines are checked, they are valid and deterministic', () => {
    // Catalogue contract and determinism (common practice).
    lines.forEach((line, i) => validateSpectralLine(line, i))
    expect(generateMethaneLines()).toEqual(lines)
  })

  it('when given jMax = 0, throws PhysicsError', () => {
    expect(() => generateMethaneLines({ jMax: 0 })).toThrow(PhysicsError)
  })
})

describe('createMethanePartitionFunction', () => {
  it('when evaluated at 296 K, returns the published Q(296) = 590.48 within 2 %', () => {
    // Gordon et al. 2022, JQSRT 277, 107949 isotopologue table.
    // Measured −0.002 %.
    expectRelativeClose(createMethanePartitionFunction()(296), 590.48, 0.02)
  })
})
