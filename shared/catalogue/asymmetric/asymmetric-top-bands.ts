/**
 * Line lists of asymmetric-top bands (pure rotation or rovibrational fundamentals) from the
 * Watson-Hamiltonian levels of two vibrational states and the direction-cosine line strengths.
 */
import { LINE_REFERENCE_TEMPERATURE_K } from '../../physics/constants'
import { PhysicsError, assertFiniteInRange } from '../../physics/errors'
import type { SpectralLine } from '../../physics/spectroscopy/line'
import { lineBroadening } from './broadening-model'
import type { AsymmetricTopBand, AsymmetricTopState } from './constants/types'
import {
  createDirectionCosineKernel,
  dipoleLineIntensityCmPerMolecule,
  einsteinAFromIntensityPerS,
  isAllowedBySymmetry,
  relativeLineWeight,
  rotationalLineStrength,
  spinWeight,
} from './line-strengths'
import { asymmetricTopLevelsUpTo, type RotationalLevel } from './watson-hamiltonian'
import { logFactorialTable } from './wigner-3j'

/** Options of the asymmetric-top band generator. */
export interface AsymmetricTopBandOptions {
  /** Largest J of both levels. */
  jMax: number
  /** Levels with Ka above this are left out (the Watson series is unreliable there). */
  maxKa: number
  /** Lines weaker than this at 296 K are dropped, cm⁻¹/(molecule cm⁻²). */
  intensityFloorCmPerMolecule: number
}

/** Inputs that describe one band. */
export interface AsymmetricTopBandInput {
  band: AsymmetricTopBand
  lowerState: AsymmetricTopState
  upperState: AsymmetricTopState
  /** Rotational levels of the lower state by J (index J), at least up to jMax. */
  lowerLevels: readonly RotationalLevel[][]
  /** Rotational levels of the upper state by J (index J), at least up to jMax. */
  upperLevels: readonly RotationalLevel[][]
  /** Total internal partition function at 296 K (same spin-weight convention). */
  partitionFunction296: number
  /** Isotopic abundance I_a. */
  abundance: number
}

/** Smallest line strength λ kept (removes rounding-level values of forbidden-looking pairs). */
const MIN_LINE_STRENGTH = 1e-12
/** Smallest transition wavenumber kept, cm⁻¹. */
const MIN_WAVENUMBER_CM = 1e-6

interface RawLine {
  lower: RotationalLevel
  upper: RotationalLevel
  wavenumberCm: number
  lowerEnergyCm: number
  lowerWeight: number
  upperWeight: number
  value: number
}

/** Code-unit string order (locale independent, so the sort is reproducible everywhere). */
export function compareText(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0
}

function label(level: RotationalLevel): string {
  return `${level.j} ${level.ka} ${level.kc}`
}

/** Checks options shared by the asymmetric-top generators. */
export function checkAsymmetricTopOptions(options: AsymmetricTopBandOptions): void {
  if (!Number.isInteger(options.jMax) || options.jMax < 1 || options.jMax > 120) {
    throw new PhysicsError('OUT_OF_RANGE', 'jMax must be an integer in [1, 120]', {
      jMax: options.jMax,
    })
  }
  if (!Number.isInteger(options.maxKa) || options.maxKa < 0) {
    throw new PhysicsError('OUT_OF_RANGE', 'maxKa must be a non-negative integer', {
      maxKa: options.maxKa,
    })
  }
  assertFiniteInRange('intensityFloorCmPerMolecule', options.intensityFloorCmPerMolecule, 0, 1e-15)
}

/** Levels of a state by J, for J = 0 … jMax. */
export function stateLevels(state: AsymmetricTopState, jMax: number): RotationalLevel[][] {
  return asymmetricTopLevelsUpTo(state.constants, jMax)
}

/**
 * The line list of one asymmetric-top band at 296 K.
 *
 * Method: for every pair of levels J″_{Ka″Kc″} (lower state) and J′_{Ka′Kc′} (upper state) with
 * |J′ − J″| ≤ 1, both spin weights > 0, Ka ≤ maxKa and the symmetry selection rule of the band
 * type, the line strength λ (`rotationalLineStrength`) and ν = (G′ + E′) − (G″ + E″) give
 * - pure rotation (band.dipoleMomentDebye set): the absolute intensity
 *   S = (8π³/3hc) I_a ν g_ns e^{−c₂E″/T}(1 − e^{−c₂ν/T}) μ² λ / Q (`dipoleLineIntensityCmPerMolecule`);
 * - a vibrational band (band.bandIntensityCmPerMolecule set): S_i = S_band w_i / Σ w with
 *   w = ν g_ns e^{−c₂E″/T}(1 − e^{−c₂ν/T}) λ (`relativeLineWeight`), i.e. a constant vibrational
 *   transition moment; after the intensity floor the remaining lines are rescaled so that their
 *   sum equals S_band exactly.
 * Einstein A from S (`einsteinAFromIntensityPerS`), widths from the band's broadening model at J″.
 * Lines are sorted by wavenumber (ties by labels), so the output is deterministic.
 * Notes: for a pure-rotation band each pair is taken once and the lower level is the one with the
 * lower energy. Line positions inherit the accuracy of the levels (see the constants tables);
 * vibrational-band intensities neglect Herman–Wallis and Coriolis intensity borrowing, so single
 * lines can be off by tens of percent while the band sum is exact. Units as `SpectralLine`.
 * Source: Gordy & Cook (1984) ch. 3 and 7; Rothman et al. 1998, JQSRT 60, 665, Appendix (from memory).
 */
export function generateAsymmetricTopBandLines(
  input: AsymmetricTopBandInput,
  options: AsymmetricTopBandOptions,
): SpectralLine[] {
  checkAsymmetricTopOptions(options)
  const { band, lowerState, upperState, lowerLevels, upperLevels } = input
  assertFiniteInRange(
    'partitionFunction296',
    input.partitionFunction296,
    Number.MIN_VALUE,
    Infinity,
  )
  assertFiniteInRange('abundance', input.abundance, Number.MIN_VALUE, 1)
  const jMax = options.jMax
  if (lowerLevels.length <= jMax || upperLevels.length <= jMax) {
    throw new PhysicsError('INVALID_ARGUMENT', 'level lists do not reach jMax', { jMax })
  }
  const absolute = band.dipoleMomentDebye !== null
  if (absolute === (band.bandIntensityCmPerMolecule !== null)) {
    throw new PhysicsError(
      'INVALID_ARGUMENT',
      `band ${band.id} needs exactly one of dipoleMomentDebye and bandIntensityCmPerMolecule`,
    )
  }
  const pureRotation = lowerState.id === upperState.id
  const temperatureK = LINE_REFERENCE_TEMPERATURE_K
  const logFactorial = logFactorialTable(2 * jMax + 8)
  const deltaG = upperState.vibrationalEnergyCm - lowerState.vibrationalEnergyCm
  const raw: RawLine[] = []

  for (let jLow = 0; jLow <= jMax; jLow++) {
    const jUpFirst = pureRotation ? jLow : Math.max(0, jLow - 1)
    for (let jUp = jUpFirst; jUp <= Math.min(jMax, jLow + 1); jUp++) {
      if (jUp + jLow < 1) continue
      const kernel = createDirectionCosineKernel(jLow, jUp, band.transitionType, logFactorial)
      const lows = lowerLevels[jLow]
      const ups = upperLevels[jUp]
      for (let a = 0; a < lows.length; a++) {
        const lo = lows[a]
        const gLo = spinWeight(lowerState.spinWeights, lo.ka, lo.kc)
        if (gLo === 0 || lo.ka > options.maxKa) continue
        for (let b = pureRotation && jUp === jLow ? a + 1 : 0; b < ups.length; b++) {
          const up = ups[b]
          const gUp = spinWeight(upperState.spinWeights, up.ka, up.kc)
          if (gUp === 0 || up.ka > options.maxKa) continue
          if (!isAllowedBySymmetry(band.transitionType, lo.ka, lo.kc, up.ka, up.kc)) continue
          const strength = rotationalLineStrength(kernel, lo.vector, up.vector)
          if (strength < MIN_LINE_STRENGTH) continue
          let lower = lo
          let upper = up
          let gLower = gLo
          let gUpper = gUp
          let nu = deltaG + up.energyCm - lo.energyCm
          if (pureRotation && nu < 0) {
            lower = up
            upper = lo
            gLower = gUp
            gUpper = gLo
            nu = -nu
          }
          if (nu < MIN_WAVENUMBER_CM) continue
          const lowerEnergyCm = lower.energyCm + lowerState.vibrationalEnergyCm
          const value = absolute
            ? dipoleLineIntensityCmPerMolecule(
                nu,
                lowerEnergyCm,
                gLower,
                strength,
                band.dipoleMomentDebye as number,
                input.partitionFunction296,
                input.abundance,
                temperatureK,
              )
            : relativeLineWeight(nu, lowerEnergyCm, gLower, strength, temperatureK)
          raw.push({
            lower,
            upper,
            wavenumberCm: nu,
            lowerEnergyCm,
            lowerWeight: gLower * (2 * lower.j + 1),
            upperWeight: gUpper * (2 * upper.j + 1),
            value,
          })
        }
      }
    }
  }

  let intensities = raw.map((line) => line.value)
  if (!absolute) {
    const bandIntensity = band.bandIntensityCmPerMolecule as number
    const total = intensities.reduce((sum, value) => sum + value, 0)
    if (!(total > 0)) {
      throw new PhysicsError('OUT_OF_RANGE', `band ${band.id} has no allowed lines`, {
        band: band.id,
      })
    }
    intensities = intensities.map((value) => (bandIntensity * value) / total)
    const kept = intensities.filter((value) => value >= options.intensityFloorCmPerMolecule)
    const keptTotal = kept.reduce((sum, value) => sum + value, 0)
    if (keptTotal > 0) intensities = intensities.map((value) => (value * bandIntensity) / keptTotal)
  }

  const lines: SpectralLine[] = []
  raw.forEach((line, i) => {
    const intensity = intensities[i]
    if (!(intensity >= options.intensityFloorCmPerMolecule) || intensity <= 0) return
    const widths = lineBroadening(band.broadening, line.lower.j)
    lines.push({
      moleculeId: band.moleculeId,
      isotopologueId: band.isotopologueId,
      wavenumberCm: line.wavenumberCm,
      intensityCmPerMolecule: intensity,
      einsteinAPerS: einsteinAFromIntensityPerS(
        intensity,
        line.wavenumberCm,
        line.lowerEnergyCm,
        line.upperWeight,
        input.partitionFunction296,
        input.abundance,
        temperatureK,
      ),
      airHalfWidthCmPerAtm: widths.airHalfWidthCmPerAtm,
      selfHalfWidthCmPerAtm: widths.selfHalfWidthCmPerAtm,
      lowerStateEnergyCm: line.lowerEnergyCm,
      temperatureExponentAir: widths.temperatureExponentAir,
      pressureShiftCmPerAtm: widths.pressureShiftCmPerAtm,
      upperGlobalQuanta: upperState.id,
      lowerGlobalQuanta: lowerState.id,
      upperLocalQuanta: label(line.upper),
      lowerLocalQuanta: label(line.lower),
      upperStatisticalWeight: line.upperWeight,
      lowerStatisticalWeight: line.lowerWeight,
    })
  })
  lines.sort(
    (x, y) =>
      x.wavenumberCm - y.wavenumberCm ||
      compareText(x.lowerLocalQuanta ?? '', y.lowerLocalQuanta ?? '') ||
      compareText(x.upperLocalQuanta ?? '', y.upperLocalQuanta ?? ''),
  )
  return lines
}

/**
 * Lines of several bands of one isotopologue that share a set of vibrational states.
 *
 * Method: levels of each state computed once (`stateLevels`), then
 * `generateAsymmetricTopBandLines` per selected band; the merged list is sorted by wavenumber
 * (stable, so ties keep the band order). Units as `SpectralLine`.
 * Source: as `generateAsymmetricTopBandLines`.
 * @param bandIds ids of the bands to generate (each must be in `bands`)
 */
export function generateAsymmetricTopBands(
  states: readonly AsymmetricTopState[],
  bands: readonly AsymmetricTopBand[],
  bandIds: readonly string[],
  options: AsymmetricTopBandOptions,
  partitionFunction296: number,
  abundance: number,
): SpectralLine[] {
  checkAsymmetricTopOptions(options)
  for (const id of bandIds) {
    if (!bands.some((band) => band.id === id)) {
      throw new PhysicsError('INVALID_ARGUMENT', `unknown band ${id}`, { id })
    }
  }
  const findState = (id: string): AsymmetricTopState => {
    const state = states.find((candidate) => candidate.id === id)
    if (!state)
      throw new PhysicsError('INVALID_ARGUMENT', `unknown vibrational state ${id}`, { id })
    return state
  }
  const levelCache = new Map<string, RotationalLevel[][]>()
  const levelsOf = (state: AsymmetricTopState): RotationalLevel[][] => {
    let levels = levelCache.get(state.id)
    if (!levels) {
      levels = stateLevels(state, options.jMax)
      levelCache.set(state.id, levels)
    }
    return levels
  }
  const lines: SpectralLine[] = []
  for (const band of bands) {
    if (!bandIds.includes(band.id)) continue
    const lowerState = findState(band.lowerStateId)
    const upperState = findState(band.upperStateId)
    const bandLines = generateAsymmetricTopBandLines(
      {
        band,
        lowerState,
        upperState,
        lowerLevels: levelsOf(lowerState),
        upperLevels: levelsOf(upperState),
        partitionFunction296,
        abundance,
      },
      options,
    )
    for (const line of bandLines) lines.push(line)
  }
  lines.sort((x, y) => x.wavenumberCm - y.wavenumberCm)
  return lines
}

/**
 * Energies and full statistical weights g_ns(2J+1) of all rotational levels of a state with
 * J ≤ jMax (for level-sum partition functions). Levels with zero spin weight are included with
 * weight 0. Units cm⁻¹.
 */
export function stateLevelSumInput(
  state: AsymmetricTopState,
  jMax: number,
): { energiesCm: Float64Array; weights: Float64Array } {
  const levels = stateLevels(state, jMax)
  const count = (jMax + 1) * (jMax + 1)
  const energiesCm = new Float64Array(count)
  const weights = new Float64Array(count)
  let i = 0
  for (const levelsOfJ of levels) {
    for (const level of levelsOfJ) {
      energiesCm[i] = Math.max(0, level.energyCm)
      weights[i] = spinWeight(state.spinWeights, level.ka, level.kc) * (2 * level.j + 1)
      i++
    }
  }
  return { energiesCm, weights }
}
