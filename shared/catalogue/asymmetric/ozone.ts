/**
 * The synthesised O3 (666) line list: the ν₃ (a-type) and ν₁ (b-type) fundamentals of the 9.6 µm
 * region, normalised to their band intensities, plus the level-sum partition function.
 */
import { LINE_REFERENCE_TEMPERATURE_K } from '../../physics/constants'
import { PhysicsError } from '../../physics/errors'
import { getIsotopologue } from '../../physics/spectroscopy/isotopologue-lookup'
import type { SpectralLine } from '../../physics/spectroscopy/line'
import type { PartitionFunction } from '../../physics/spectroscopy/partition-function'
import {
  generateAsymmetricTopBands,
  stateLevelSumInput,
  type AsymmetricTopBandOptions,
} from './asymmetric-top-bands'
import { OZONE_BANDS, OZONE_STATES } from './constants/ozone'
import { createLevelSumPartitionFunction } from './level-sum-partition-function'

/** Options of `generateOzoneLines`. */
export interface OzoneLineOptions {
  /** Largest J of both levels (default 60). */
  jMax?: number
  /** Levels with Ka above this are left out (default 30). */
  maxKa?: number
  /** Intensity floor at 296 K, cm⁻¹/(molecule cm⁻²) (default 1e-27). */
  intensityFloorCmPerMolecule?: number
  /** Band ids to generate (default: all of OZONE_BANDS). */
  bandIds?: readonly string[]
}

/** Defaults of `generateOzoneLines`. */
export const OZONE_DEFAULT_OPTIONS: Readonly<AsymmetricTopBandOptions> = {
  jMax: 60,
  maxKa: 30,
  intensityFloorCmPerMolecule: 1e-27,
}

/** J up to which the partition-function level sum runs (E > 5000 cm⁻¹ beyond). */
export const OZONE_PARTITION_J_MAX = 110

/**
 * Level-sum partition function of O3 666.
 *
 * Method: Q(T) = Σ_{J ≤ 110} g_ns (2J+1) e^{−c₂E/T} · Q_vib(T) over the (000) Watson levels with
 * g_ns = 1 for Ka + Kc even and 0 for odd (spin-0 ¹⁶O nuclei), Q_vib from the isotopologue table
 * (`createLevelSumPartitionFunction`).
 * Notes: Q(296) compared with the published 3483.71 in the test (within 2 %). Accepted range
 * 50–500 K (at 500 K the J ≤ 110 sum misses < 0.1 %). Builds in ~1 s; build once and reuse.
 * Dimensionless.
 * Source: Gordon et al. 2022, JQSRT 277, 107949 (published Q(296), for comparison); Herzberg 1945,
 * ch. V (from memory).
 */
export function createOzonePartitionFunction(): PartitionFunction {
  const state = OZONE_STATES.find((candidate) => candidate.id === '000')
  if (!state) throw new PhysicsError('INVALID_ARGUMENT', 'O3 (000) state missing')
  const { energiesCm, weights } = stateLevelSumInput(state, OZONE_PARTITION_J_MAX)
  return createLevelSumPartitionFunction(
    energiesCm,
    weights,
    getIsotopologue(3, 1).vibrationalLevels,
  )
}

/**
 * Synthesised O3 666 lines of the 9.6 µm bands (ν₃ and ν₁).
 *
 * Method: Watson A-reduced levels of (000), (001), (100) up to jMax; ν₃ a-type from the even
 * (Ka + Kc) levels of (000) to the odd levels of (001); ν₁ b-type between even levels; line
 * intensities at 296 K normalised to the band intensities (`generateAsymmetricTopBands`).
 * Notes: positions inherit MEMORY-low upper-state constants and no ν₁/ν₃ Coriolis coupling:
 * expect errors growing from ~0.01 cm⁻¹ at low J, Ka to ~1 cm⁻¹ at J ≈ 60 or Ka ≈ 15; intensities
 * with a constant transition moment. Units as `SpectralLine`; sorted by wavenumber.
 * Source: constants/ozone.ts; methods as `generateAsymmetricTopBandLines`.
 */
export function generateOzoneLines(options: OzoneLineOptions = {}): SpectralLine[] {
  const settings: AsymmetricTopBandOptions = {
    jMax: options.jMax ?? OZONE_DEFAULT_OPTIONS.jMax,
    maxKa: options.maxKa ?? OZONE_DEFAULT_OPTIONS.maxKa,
    intensityFloorCmPerMolecule:
      options.intensityFloorCmPerMolecule ?? OZONE_DEFAULT_OPTIONS.intensityFloorCmPerMolecule,
  }
  const q296 = createOzonePartitionFunction()(LINE_REFERENCE_TEMPERATURE_K)
  return generateAsymmetricTopBands(
    OZONE_STATES,
    OZONE_BANDS,
    options.bandIds ?? OZONE_BANDS.map((band) => band.id),
    settings,
    q296,
    getIsotopologue(3, 1).abundance,
  )
}
