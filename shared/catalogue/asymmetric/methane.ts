/**
 * The synthesised CH4 (211) ν₄ line list in a spherical-top approximation (one line per P, Q, R
 * transition of each J″, no tetrahedral splitting), plus the level-sum partition function.
 */
import { C2_CM_K, LINE_REFERENCE_TEMPERATURE_K } from '../../physics/constants'
import { PhysicsError, assertFiniteInRange } from '../../physics/errors'
import { getIsotopologue } from '../../physics/spectroscopy/isotopologue-lookup'
import type { SpectralLine } from '../../physics/spectroscopy/line'
import type { PartitionFunction } from '../../physics/spectroscopy/partition-function'
import { lineBroadening } from './broadening-model'
import { METHANE_NU4, type SphericalTopBand } from './constants/methane'
import { createLevelSumPartitionFunction } from './level-sum-partition-function'
import { einsteinAFromIntensityPerS } from './line-strengths'

/** Options of `generateMethaneLines`. */
export interface MethaneLineOptions {
  /** Largest lower-state J (default 30). */
  jMax?: number
  /** Intensity floor at 296 K, cm⁻¹/(molecule cm⁻²) (default 1e-27). */
  intensityFloorCmPerMolecule?: number
}

/** Defaults of `generateMethaneLines`. */
export const METHANE_DEFAULT_OPTIONS = { jMax: 30, intensityFloorCmPerMolecule: 1e-27 } as const

/** J up to which the partition-function level sum runs (E > 9000 cm⁻¹ beyond). */
export const METHANE_PARTITION_J_MAX = 40

/**
 * Nuclear-spin weighted rotational degeneracy W(J) of a ¹²CH₄ ground-state J manifold
 * (without the 2J + 1 of M).
 *
 * Method: the 2J + 1 rotational functions of a J manifold span D^J restricted to the rotation
 * group T of the molecule; the spin weights are 5 per A state, 1 per state of E (2 per E pair)
 * and 1 per state of F (3 per F triple), i.e. W = (2J+1) + 4 n_A(J), with the number of A
 * species from the character formula
 * n_A = [χ(E) + 3χ(C₂) + 8χ(C₃)]/12 = [(2J+1) + 3(−1)^J + 8c(J)]/12,
 * c(J) = 1, 0, −1 for J mod 3 = 0, 1, 2 (χ_J(α) = sin((2J+1)α/2)/sin(α/2)).
 * Notes: exact for the spin statistics (A : E : F = 5 : 2 : 3 per level); the average over J is
 * (4/3)(2J+1) (16 spin states / symmetry number 12). W(0) = 5, W(1) = 3, W(2) = 5, W(3) = 11.
 * Dimensionless.
 * Source: Herzberg 1945, Infrared and Raman Spectra, ch. I.4 (spherical-top statistical weights);
 * Hougen 1976, in MTP Int. Rev. Sci. Phys. Chem. Ser. 2 vol. 3 (from memory).
 * @param j J ≥ 0 (integer)
 */
export function methaneSpinWeightedDegeneracy(j: number): number {
  if (!Number.isInteger(j) || j < 0) {
    throw new PhysicsError('INVALID_ARGUMENT', `J must be a non-negative integer (got ${j})`, { j })
  }
  const c3 = j % 3 === 0 ? 1 : j % 3 === 1 ? 0 : -1
  const nA = (2 * j + 1 + 3 * (j % 2 === 0 ? 1 : -1) + 8 * c3) / 12
  return 2 * j + 1 + 4 * nA
}

/**
 * Ground-state rotational term of a spherical top, cm⁻¹: F(J) = B J(J+1) − D J²(J+1)².
 * Source: Herzberg 1945, ch. I.3 (from memory).
 */
export function sphericalTopTermCm(bCm: number, dCm: number, j: number): number {
  const x = j * (j + 1)
  return bCm * x - dCm * x * x
}

/**
 * Upper-state term of the F2 fundamental with rotational quantum number R and total J, cm⁻¹.
 *
 * Method: E′ = ν₀ + B′J(J+1) − D′J²(J+1)² − 2B′ζ⟨l·J⟩ with l = 1 and
 * ⟨l·J⟩ = [J(J+1) + 2 − R(R+1)]/2, i.e. −2B′ζ(J+1) for the F⁺ level (R = J − 1), −2B′ζ for F⁰
 * (R = J) and +2B′ζJ for F⁻ (R = J + 1) (first-order Coriolis splitting).
 * Notes: no tetrahedral (fourth-rank) splitting. Then from a ground level J″ (R = J″):
 * R(J″): ν = ν₀ − 2B′ζ + 2B(1 − ζ)(J″+1), Q(J″): ν = ν₀ − 2B′ζ, P(J″): ν = ν₀ − 2B′ζ − 2B(1 − ζ)J″
 * for B′ = B″ = B and D = 0 (Herzberg's band formulas with his origin at ν₀ − 2B′ζ).
 * Source: Herzberg 1945, Infrared and Raman Spectra, ch. IV.2 (F2 fundamentals of spherical tops;
 * from memory); Jahn 1938 (Coriolis splitting).
 */
export function sphericalTopUpperTermCm(band: SphericalTopBand, j: number, r: number): number {
  const x = j * (j + 1)
  const lDotJ = (x + 2 - r * (r + 1)) / 2
  return (
    band.bandOriginCm +
    band.upperBCm * x -
    band.upperDCm * x * x -
    2 * band.upperBCm * band.coriolisZeta * lDotJ
  )
}

/**
 * Fraction of the J″ manifold's ν₄ strength that goes to J′ = J″ − 1, J″, J″ + 1.
 *
 * Method: the F2 vibrational transition leaves R = J″; recoupling l = 1 with R gives the three J′
 * with weights (2J′ + 1)/[3(2J″ + 1)] (P: (2J″ − 1), Q: (2J″ + 1), R: (2J″ + 3), all over
 * 3(2J″ + 1)); they sum to 1. For J″ = 0 only J′ = 1 exists (fraction 1).
 * Source: Herzberg 1945, ch. IV.2 (intensity distribution in spherical-top fundamentals; from
 * memory); equivalent to the 6j recoupling weights of l = 1 and R = J″.
 */
export function sphericalTopBranchFraction(jLower: number, jUpper: number): number {
  if (!Number.isInteger(jLower) || !Number.isInteger(jUpper) || jLower < 0 || jUpper < 0) {
    throw new PhysicsError('INVALID_ARGUMENT', 'J must be non-negative integers', {
      jLower,
      jUpper,
    })
  }
  if (Math.abs(jUpper - jLower) > 1) return 0
  if (jLower === 0) return jUpper === 1 ? 1 : 0
  return (2 * jUpper + 1) / (3 * (2 * jLower + 1))
}

/**
 * Level-sum partition function of CH4 211.
 *
 * Method: Q(T) = Σ_{J ≤ 40} (2J+1) W(J) e^{−c₂F(J)/T} · Q_vib(T), W from
 * `methaneSpinWeightedDegeneracy`, F(J) the ground-state term, Q_vib from the isotopologue table.
 * Notes: Q(296) compared with the published 590.48 in the test (within 2 %); no tetrahedral
 * splitting or centrifugal terms beyond D. Accepted range 50–500 K. Dimensionless.
 * Source: Gordon et al. 2022, JQSRT 277, 107949 (published Q(296), for comparison).
 */
export function createMethanePartitionFunction(): PartitionFunction {
  const band = METHANE_NU4
  const energies: number[] = []
  const weights: number[] = []
  for (let j = 0; j <= METHANE_PARTITION_J_MAX; j++) {
    energies.push(sphericalTopTermCm(band.groundBCm, band.groundDCm, j))
    weights.push((2 * j + 1) * methaneSpinWeightedDegeneracy(j))
  }
  return createLevelSumPartitionFunction(energies, weights, getIsotopologue(6, 1).vibrationalLevels)
}

const BRANCHES = [
  { name: 'P', dj: -1, sublevel: 'F-' },
  { name: 'Q', dj: 0, sublevel: 'F0' },
  { name: 'R', dj: 1, sublevel: 'F+' },
] as const

/**
 * Synthesised CH4 211 ν₄ lines (spherical-top approximation).
 *
 * Method: for J″ = 0 … jMax and the P, Q, R branches: ν = E′(J′, R = J″) − F(J″)
 * (`sphericalTopUpperTermCm`), weight w = ν (2J″+1) W(J″) e^{−c₂F(J″)/T}(1 − e^{−c₂ν/T}) · f(J″→J′)
 * (`sphericalTopBranchFraction`), S = S_band w/Σw at 296 K, rescaled after the intensity floor so
 * that the band sum equals S_band. Einstein A from S with g′ = (4/3)(2J′+1)², the average
 * spin-weighted degeneracy (exact spin statistics of the upper sublevels are not resolved here);
 * g″ = (2J″+1) W(J″).
 * Notes: each line stands for a whole tetrahedrally split J manifold (in reality spread over up to
 * ~1 cm⁻¹ into A, E, F components), so lines are too few and too strong for optically thick paths;
 * the band total and the P/Q/R envelope are right. Q branch at ν₀ − 2B′ζ ≈ 1305.9 cm⁻¹ (all Q lines
 * coincide when B′ = B″, D′ = D″). Units as `SpectralLine`; sorted by wavenumber.
 * Source: constants/methane.ts; Herzberg 1945, ch. IV.2 (from memory).
 */
export function generateMethaneLines(options: MethaneLineOptions = {}): SpectralLine[] {
  const band = METHANE_NU4
  const jMax = options.jMax ?? METHANE_DEFAULT_OPTIONS.jMax
  const floor =
    options.intensityFloorCmPerMolecule ?? METHANE_DEFAULT_OPTIONS.intensityFloorCmPerMolecule
  if (!Number.isInteger(jMax) || jMax < 1 || jMax > 60) {
    throw new PhysicsError('OUT_OF_RANGE', 'jMax must be an integer in [1, 60]', { jMax })
  }
  assertFiniteInRange('intensityFloorCmPerMolecule', floor, 0, 1e-15)
  const temperatureK = LINE_REFERENCE_TEMPERATURE_K
  const q296 = createMethanePartitionFunction()(temperatureK)
  const abundance = getIsotopologue(6, 1).abundance
  const raw: Array<{
    jLower: number
    jUpper: number
    branch: (typeof BRANCHES)[number]
    nu: number
    lowerEnergyCm: number
    weight: number
  }> = []
  for (let jLower = 0; jLower <= jMax; jLower++) {
    const lowerEnergyCm = sphericalTopTermCm(band.groundBCm, band.groundDCm, jLower)
    const population =
      (2 * jLower + 1) *
      methaneSpinWeightedDegeneracy(jLower) *
      Math.exp((-C2_CM_K * lowerEnergyCm) / temperatureK)
    for (const branch of BRANCHES) {
      const jUpper = jLower + branch.dj
      const fraction = jUpper < 0 ? 0 : sphericalTopBranchFraction(jLower, jUpper)
      if (fraction === 0) continue
      const nu = sphericalTopUpperTermCm(band, jUpper, jLower) - lowerEnergyCm
      const weight = nu * population * fraction * -Math.expm1((-C2_CM_K * nu) / temperatureK)
      raw.push({ jLower, jUpper, branch, nu, lowerEnergyCm, weight })
    }
  }
  const total = raw.reduce((sum, line) => sum + line.weight, 0)
  const scaled = raw.map((line) => (band.bandIntensityCmPerMolecule * line.weight) / total)
  const keptTotal = scaled.filter((s) => s >= floor).reduce((sum, s) => sum + s, 0)
  const lines: SpectralLine[] = []
  raw.forEach((line, i) => {
    if (scaled[i] < floor) return
    const intensity = (scaled[i] * band.bandIntensityCmPerMolecule) / keptTotal
    const widths = lineBroadening(band.broadening, line.jLower)
    const upperWeight = (4 / 3) * (2 * line.jUpper + 1) ** 2
    lines.push({
      moleculeId: band.moleculeId,
      isotopologueId: band.isotopologueId,
      wavenumberCm: line.nu,
      intensityCmPerMolecule: intensity,
      einsteinAPerS: einsteinAFromIntensityPerS(
        intensity,
        line.nu,
        line.lowerEnergyCm,
        upperWeight,
        q296,
        abundance,
        temperatureK,
      ),
      airHalfWidthCmPerAtm: widths.airHalfWidthCmPerAtm,
      selfHalfWidthCmPerAtm: widths.selfHalfWidthCmPerAtm,
      lowerStateEnergyCm: line.lowerEnergyCm,
      temperatureExponentAir: widths.temperatureExponentAir,
      pressureShiftCmPerAtm: widths.pressureShiftCmPerAtm,
      upperGlobalQuanta: '0001',
      lowerGlobalQuanta: '0000',
      upperLocalQuanta: `${line.jUpper} ${line.branch.sublevel}`,
      lowerLocalQuanta: `${line.branch.name}${line.jLower}`,
      upperStatisticalWeight: upperWeight,
      lowerStatisticalWeight: (2 * line.jLower + 1) * methaneSpinWeightedDegeneracy(line.jLower),
    })
  })
  lines.sort((x, y) => x.wavenumberCm - y.wavenumberCm)
  return lines
}
