/**
 * The synthesised H2O (161) line list: pure rotation (absolute, from the dipole moment) and the ν₂
 * fundamental (normalised to the band intensity), plus the level-sum partition function.
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
import { WATER_BANDS, WATER_STATES } from './constants/water'
import { createLevelSumPartitionFunction } from './level-sum-partition-function'

/** Options of `generateWaterLines`. */
export interface WaterLineOptions {
  /** Largest J of both levels (default 20). */
  jMax?: number
  /** Levels with Ka above this are left out (default 8; see the water constants table). */
  maxKa?: number
  /** Intensity floor at 296 K, cm⁻¹/(molecule cm⁻²) (default 1e-27). */
  intensityFloorCmPerMolecule?: number
  /** Band ids to generate (default: all of WATER_BANDS). */
  bandIds?: readonly string[]
}

/** Defaults of `generateWaterLines`. */
export const WATER_DEFAULT_OPTIONS: Readonly<AsymmetricTopBandOptions> = {
  jMax: 20,
  maxKa: 8,
  intensityFloorCmPerMolecule: 1e-27,
}

/** J up to which the partition-function level sum runs (e^{−c₂E/T} < 1e-12 beyond, at 500 K). */
export const WATER_PARTITION_J_MAX = 35

/**
 * Level-sum partition function of H2O 161.
 *
 * Method: Q(T) = Σ_{J ≤ 35, all Ka} g_ns (2J+1) e^{−c₂E/T} · Q_vib(T), with the (000) Watson levels
 * (g_ns 3 ortho, 1 para) and Q_vib from the vibrational levels of the isotopologue table
 * (`createLevelSumPartitionFunction`).
 * Notes: measured Q(296) = 174.583 against the published 174.58 (test: within 2 %). The Watson
 * levels are too high at large Ka (the sextic term dominates), which only removes weight far up
 * the level ladder. Accepted range 50–500 K. Builds in ~0.1 s; build once and reuse.
 * Dimensionless.
 * Source: Gordon et al. 2022, JQSRT 277, 107949 (published Q(296), for comparison); level sums as
 * in Herzberg 1945, ch. V (from memory).
 */
export function createWaterPartitionFunction(): PartitionFunction {
  const state = WATER_STATES.find((candidate) => candidate.id === '000')
  if (!state) throw new PhysicsError('INVALID_ARGUMENT', 'H2O (000) state missing')
  const { energiesCm, weights } = stateLevelSumInput(state, WATER_PARTITION_J_MAX)
  return createLevelSumPartitionFunction(
    energiesCm,
    weights,
    getIsotopologue(1, 1).vibrationalLevels,
  )
}

/**
 * Synthesised H2O 161 lines: pure rotation and ν₂.
 *
 * Method: Watson A-reduced levels of (000) and (010) up to jMax, b-type line strengths, spin
 * weights 3 (ortho) / 1 (para), intensities at 296 K: pure rotation absolute from μ = 1.8546 D,
 * ν₂ normalised to its band intensity (`generateAsymmetricTopBands`); Q(296) from
 * `createWaterPartitionFunction`.
 * Notes: positions: ≤ 0.005 cm⁻¹ for the low-J test lines (22.235, 183.31, 556.94 GHz), growing
 * with Ka (≈0.02 cm⁻¹ at Ka = 4, ≈0.1 at Ka = 5, ≈0.5 at Ka = 6, estimated several cm⁻¹ at
 * Ka = 8). Intensities: pure rotation from the rigid-dipole formula (no dipole-moment expansion, so
 * high-J lines can differ from measured ones by tens of %); ν₂ with a constant transition moment
 * (real ν₂ lines have a strong J and Ka dependence of it). Units as `SpectralLine`; sorted by
 * wavenumber.
 * Source: constants/water.ts; methods as `generateAsymmetricTopBandLines`.
 */
export function generateWaterLines(options: WaterLineOptions = {}): SpectralLine[] {
  const settings: AsymmetricTopBandOptions = {
    jMax: options.jMax ?? WATER_DEFAULT_OPTIONS.jMax,
    maxKa: options.maxKa ?? WATER_DEFAULT_OPTIONS.maxKa,
    intensityFloorCmPerMolecule:
      options.intensityFloorCmPerMolecule ?? WATER_DEFAULT_OPTIONS.intensityFloorCmPerMolecule,
  }
  const q296 = createWaterPartitionFunction()(LINE_REFERENCE_TEMPERATURE_K)
  return generateAsymmetricTopBands(
    WATER_STATES,
    WATER_BANDS,
    options.bandIds ?? WATER_BANDS.map((band) => band.id),
    settings,
    q296,
    getIsotopologue(1, 1).abundance,
  )
}
