import { beforeAll, describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { getIsotopologue } from '../../../../shared/physics/spectroscopy/isotopologue-lookup'
import type { SpectralLine } from '../../../../shared/physics/spectroscopy/line'
import { validateSpectralLine } from '../../../../shared/physics/spectroscopy/line'
import { vibrationalPartitionFunction } from '../../../../shared/physics/spectroscopy/partition-function'
import {
  createWaterPartitionFunction,
  generateWaterLines,
} from '../../../../shared/catalogue/asymmetric/water'
import { expectAbsoluteClose, expectRelativeClose } from '../../../support/expect-close'

/** GHz → cm⁻¹ (c = 29.9792458 GHz cm, exact). */
const GHZ_TO_CM = 1 / 29.9792458

let lines: SpectralLine[]
let rotation: SpectralLine[]
let nu2: SpectralLine[]

beforeAll(() => {
  lines = generateWaterLines()
  rotation = lines.filter((l) => l.upperGlobalQuanta === '000')
  nu2 = lines.filter((l) => l.upperGlobalQuanta === '010')
})

function findLine(set: SpectralLine[], upper: string, lower: string): SpectralLine {
  const line = set.find((l) => l.upperLocalQuanta === upper && l.lowerLocalQuanta === lower)
  if (!line) throw new Error(`line ${upper} ← ${lower} missing`)
  return line
}

describe('generateWaterLines (pure rotation positions)', () => {
  // Line frequencies: Recommendation ITU-R P.676 (Annex 1, Table 2, water-vapour lines; values
  // seen reproduced from the table, the standard itself not at hand); assignments J′_{Ka′Kc′} ←
  // J″_{Ka″Kc″} from memory (each consistent with the IUPAC levels of watson-hamiltonian.test.ts).
  // Tolerances are absolute in cm⁻¹ and set just above the measured error (in brackets), which
  // grows with Ka.
  const reference: Array<[string, string, number, number, number]> = [
    // upper, lower, frequency GHz, measured error cm⁻¹, tolerance cm⁻¹
    ['6 1 6', '5 2 3', 22.23508, 0.004, 0.006],
    ['3 1 3', '2 2 0', 183.310087, 0.0006, 0.002],
    ['10 2 9', '9 3 6', 321.22563, 0.0021, 0.005],
    ['5 1 5', '4 2 2', 325.152888, 0.0026, 0.005],
    ['4 1 4', '3 2 1', 380.197353, 0.0015, 0.005],
    ['7 5 3', '6 6 0', 437.346667, -0.514, 0.6],
    ['6 4 3', '5 5 0', 439.150807, -0.124, 0.15],
    ['7 5 2', '6 6 1', 443.018343, -0.514, 0.6],
    ['4 2 3', '3 3 0', 448.001085, -0.0009, 0.005],
    ['6 4 2', '5 5 1', 470.888999, -0.123, 0.15],
    ['5 3 3', '4 4 0', 474.689092, -0.019, 0.025],
    ['6 2 4', '7 1 7', 488.490108, -0.006, 0.01],
    ['1 1 0', '1 0 1', 556.935985, -0.0001, 0.001],
    ['5 3 2', '4 4 1', 620.700807, -0.019, 0.025],
    ['2 1 1', '2 0 2', 752.033113, -0.0004, 0.002],
    ['4 2 2', '3 3 1', 916.171582, -0.0019, 0.005],
    ['5 2 4', '4 3 1', 970.315022, -0.0003, 0.005],
    ['2 0 2', '1 1 1', 987.926764, 0.0001, 0.002],
  ]
  for (const [upper, lower, ghz, measured, tolerance] of reference) {
    it(`when the ${upper} ← ${lower} line (${ghz} GHz) is generated, lies within ${tolerance} cm⁻¹ (measured ${measured})`, () => {
      const line = findLine(rotation, upper, lower)
      expectAbsoluteClose(line.wavenumberCm, ghz * GHZ_TO_CM, tolerance, `${upper} ← ${lower}`)
    })
  }

  it('when the 22.235 GHz line is generated, its error is below 0.006 cm⁻¹ (≈180 MHz)', () => {
    // 22.23508 GHz (ITU-R P.676 Table 2; 0.741681 cm⁻¹ from memory). It is the
    // difference of two levels near 447 cm⁻¹ and thus very sensitive to centrifugal distortion;
    // measured error +0.0040 cm⁻¹ (+120 MHz, 0.5 % of the line frequency).
    const line = findLine(rotation, '6 1 6', '5 2 3')
    expectAbsoluteClose(line.wavenumberCm, 0.741681, 0.006)
  })

  it('when lines start on 1_01, 1_11, 1_10, the lower-state energies are 23.794, 37.137, 42.372 cm⁻¹', () => {
    // IUPAC empirical levels (Tennyson et al. 2013, JQSRT 117, 29; from memory); tolerance 0.002.
    expectAbsoluteClose(findLine(rotation, '1 1 0', '1 0 1').lowerStateEnergyCm, 23.794, 0.002)
    expectAbsoluteClose(findLine(rotation, '2 0 2', '1 1 1').lowerStateEnergyCm, 37.137, 0.002)
    const from110 = rotation.find((l) => l.lowerLocalQuanta === '1 1 0')
    expectAbsoluteClose(from110?.lowerStateEnergyCm ?? 0, 42.372, 0.002)
  })
})

describe('generateWaterLines (intensities)', () => {
  it('when the pure-rotation intensities are summed, return the rigid-rotor sum rule within 3 %', () => {
    // Σ S = I_a/Q_vib · (8π³/3hc) μ² (A + C) = 5.32e-17 cm molecule⁻¹ before the abundance and
    // Q_vib factors (computed here; μ = 1.8546 D, Clough et al. 1973, J. Chem. Phys. 59, 2254, from
    // memory). The generated sum lacks J > 20 and Ka > 8 and has
    // centrifugal distortion: measured −1.5 %. Tolerance 3 %.
    const record = getIsotopologue(1, 1)
    const qVib = vibrationalPartitionFunction(record.vibrationalLevels, 296)
    const total = rotation.reduce((sum, l) => sum + l.intensityCmPerMolecule, 0)
    expectRelativeClose((total * qVib) / record.abundance, 5.32e-17, 0.03)
  })

  it('when the ν₂ intensities are summed, return the band intensity 1.05e-17 to 1e-12', () => {
    // Band intensity of the constants table (from memory, low confidence); the normalisation is
    // exact.
    const total = nu2.reduce((sum, l) => sum + l.intensityCmPerMolecule, 0)
    expectRelativeClose(total, 1.05e-17, 1e-12)
  })

  it('when the 556.936 GHz and 183.31 GHz lines are generated, their Einstein A match the published values', () => {
    // A(1_10–1_01) = 3.458e-3 s⁻¹, A(3_13–2_20) = 3.63e-6 s⁻¹ (astrophysical water data sets
    // derived from the JPL/CDMS catalogues; from memory). Tolerances 2 % and 5 %.
    expectRelativeClose(findLine(rotation, '1 1 0', '1 0 1').einsteinAPerS, 3.458e-3, 0.02)
    expectRelativeClose(findLine(rotation, '3 1 3', '2 2 0').einsteinAPerS, 3.63e-6, 0.05)
  })

  it('when any line is generated, connects levels of the same spin species (no ortho–para lines)', () => {
    // H2O ortho (Ka + Kc odd) and para levels do not combine (Townes & Schawlow 1955, ch. 4).
    for (const line of lines) {
      const [, kaL, kcL] = (line.lowerLocalQuanta ?? '').split(' ').map(Number)
      const [, kaU, kcU] = (line.upperLocalQuanta ?? '').split(' ').map(Number)
      expect((kaL + kcL) % 2).toBe((kaU + kcU) % 2)
    }
  })

  it('when all lines are checked, they are valid records above the intensity floor, sorted, fewer than 20 000', () => {
    // Catalogue contract (common practice): valid SpectralLine, S ≥ 1e-27, ascending ν.
    lines.forEach((line, i) => validateSpectralLine(line, i))
    for (let i = 1; i < lines.length; i++) {
      expect(lines[i].wavenumberCm).toBeGreaterThanOrEqual(lines[i - 1].wavenumberCm)
    }
    expect(Math.min(...lines.map((l) => l.intensityCmPerMolecule))).toBeGreaterThanOrEqual(1e-27)
    expect(lines.length).toBeGreaterThan(1000)
    expect(lines.length).toBeLessThan(20000)
  })
})

describe('generateWaterLines (ν₂ positions)', () => {
  it('when the lowest ν₂ lines are generated, lie within 0.02 cm⁻¹ of the measured positions', () => {
    // Measured ν₂ lines (from memory): 1_11←0_00 1634.967, 0_00←1_11 1557.610,
    // 1_10←1_01 1616.711, 1_01←2_12 1539.061, 2_12←1_01 1653.267 cm⁻¹. Measured errors −0.003,
    // −0.001, −0.015, −0.009, −0.004 cm⁻¹ ((010) constants from memory, low confidence). Tolerance
    // 0.02 cm⁻¹.
    const reference: Array<[string, string, number]> = [
      ['1 1 1', '0 0 0', 1634.967],
      ['0 0 0', '1 1 1', 1557.61],
      ['1 1 0', '1 0 1', 1616.711],
      ['1 0 1', '2 1 2', 1539.061],
      ['2 1 2', '1 0 1', 1653.267],
    ]
    for (const [upper, lower, nu] of reference) {
      expectAbsoluteClose(findLine(nu2, upper, lower).wavenumberCm, nu, 0.02, `${upper} ← ${lower}`)
    }
  })
})

describe('generateWaterLines (determinism and options)', () => {
  it('when run twice, returns identical lines', () => {
    // Determinism (common practice).
    expect(generateWaterLines()).toEqual(lines)
  })

  it('when given jMax = 0 or an unknown band, throws PhysicsError', () => {
    expect(() => generateWaterLines({ jMax: 0 })).toThrow(PhysicsError)
    expect(() => generateWaterLines({ bandIds: ['h2o-161-nu3'] })).toThrow(PhysicsError)
  })
})

describe('createWaterPartitionFunction', () => {
  it('when evaluated at 296 K, returns the published Q(296) = 174.58 within 2 %', () => {
    // Gordon et al. 2022, JQSRT 277, 107949 isotopologue table.
    // Measured +0.002 %.
    expectRelativeClose(createWaterPartitionFunction()(296), 174.58, 0.02)
  })

  it('when evaluated outside 50–500 K, throws PhysicsError', () => {
    const q = createWaterPartitionFunction()
    expect(() => q(40)).toThrow(PhysicsError)
    expect(() => q(600)).toThrow(PhysicsError)
  })
})
