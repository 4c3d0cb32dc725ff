import { beforeAll, describe, expect, it } from 'vitest'
import {
  validateSpectralLine,
  type SpectralLine,
} from '../../../../shared/physics/spectroscopy/line'
import {
  createOzonePartitionFunction,
  generateOzoneLines,
} from '../../../../shared/catalogue/asymmetric/ozone'
import { OZONE_STATES } from '../../../../shared/catalogue/asymmetric/constants/ozone'
import { expectAbsoluteClose, expectRelativeClose } from '../../../support/expect-close'

let lines: SpectralLine[]
let nu3: SpectralLine[]
let nu1: SpectralLine[]

beforeAll(() => {
  lines = generateOzoneLines()
  nu3 = lines.filter((l) => l.upperGlobalQuanta === '001')
  nu1 = lines.filter((l) => l.upperGlobalQuanta === '100')
})

const sum = (set: SpectralLine[]): number => set.reduce((s, l) => s + l.intensityCmPerMolecule, 0)
const quanta = (label: string | undefined): number[] => (label ?? '').split(' ').map(Number)

describe('generateOzoneLines (ν₃)', () => {
  it('when the ν₃ intensities are summed, return the band intensity 1.4e-17 to 1e-12', () => {
    // Band intensity ≈1.4e-17 cm molecule⁻¹ (Smith et al. 2001, JGR 106, 9909; from
    // memory, low confidence); the normalisation is exact.
    expectRelativeClose(sum(nu3), 1.4e-17, 1e-12)
  })

  it('when the ν₃ lines are weighted by intensity, they cluster at the band origin with P and R branches', () => {
    // Origin 1042.084 cm⁻¹ (from memory). a-type band: ≥ 99 % of the intensity within
    // 990–1080 cm⁻¹ (measured 99.7 %); P (ν < ν₀) and R (ν > ν₀) branches each 40–60 % (measured
    // 52.8 / 47.2 %); intensity-weighted mean within 5 cm⁻¹ of ν₀ (measured 1039.96, shifted
    // by A′ − A″ < 0).
    const total = sum(nu3)
    const within = sum(nu3.filter((l) => l.wavenumberCm >= 990 && l.wavenumberCm < 1080))
    const p = sum(nu3.filter((l) => l.wavenumberCm < 1042.084))
    const mean = nu3.reduce((s, l) => s + l.intensityCmPerMolecule * l.wavenumberCm, 0) / total
    expect(within / total).toBeGreaterThan(0.99)
    expect(p / total).toBeGreaterThan(0.4)
    expect(p / total).toBeLessThan(0.6)
    expectAbsoluteClose(mean, 1042.084, 5)
  })

  it('when R(0) 1_01 ← 0_00 is generated, lies at ν₀ + B′ + C′ − 4Δ_J′', () => {
    // Diagonal element of the A-reduced Hamiltonian for J = 1, K = 0 (Watson 1977; computed here
    // from the (001) constants of the table). Tolerance 1e-9 cm⁻¹.
    const upper = OZONE_STATES[1]
    const line = nu3.find((l) => l.lowerLocalQuanta === '0 0 0' && l.upperLocalQuanta === '1 0 1')
    const expected =
      upper.vibrationalEnergyCm + upper.constants.B + upper.constants.C - 4 * upper.constants.DeltaJ
    expectAbsoluteClose(line?.wavenumberCm ?? 0, expected, 1e-9)
  })

  it('when any ν₃ line is generated, goes from a Ka + Kc even level of (000) to an odd level of (001)', () => {
    // ¹⁶O spin-0 statistics: only C2(b)-symmetric rovibrational levels exist (Herzberg 1945, ch. I.4;
    // from memory); a-type selection rules ΔKa even, ΔKc odd (Gordy & Cook 1984, ch. 7).
    for (const line of nu3) {
      const [, kaL, kcL] = quanta(line.lowerLocalQuanta)
      const [, kaU, kcU] = quanta(line.upperLocalQuanta)
      expect((kaL + kcL) % 2).toBe(0)
      expect((kaU + kcU) % 2).toBe(1)
      expect(Math.abs(kaU - kaL) % 2).toBe(0)
    }
  })
})

describe('generateOzoneLines (ν₁ and contract)', () => {
  it('when the ν₁ intensities are summed, return the band intensity 5e-19 to 1e-12', () => {
    // Smith, Malathy Devi, Benner & Rinsland 2001, JGR 106, 9909 (from memory, low confidence).
    expectRelativeClose(sum(nu1), 5e-19, 1e-12)
  })

  it('when all lines are checked, they are valid, above the floor, sorted and at most 40 000', () => {
    // Catalogue contract (common practice).
    lines.forEach((line, i) => validateSpectralLine(line, i))
    for (let i = 1; i < lines.length; i++) {
      expect(lines[i].wavenumberCm).toBeGreaterThanOrEqual(lines[i - 1].wavenumberCm)
    }
    expect(Math.min(...lines.map((l) => l.intensityCmPerMolecule))).toBeGreaterThanOrEqual(1e-27)
    expect(lines.length).toBeLessThanOrEqual(40000)
  })

  it('when run twice, returns identical lines', () => {
    // Determinism (common practice).
    expect(generateOzoneLines()).toEqual(lines)
  })
})

describe('createOzonePartitionFunction', () => {
  it('when evaluated at 296 K, returns the published Q(296) = 3483.71 within 2 %', () => {
    // Gordon et al. 2022, JQSRT 277, 107949 isotopologue table.
    // Measured −0.40 %.
    expectRelativeClose(createOzonePartitionFunction()(296), 3483.71, 0.02)
  })
})
