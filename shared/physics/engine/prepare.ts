/**
 * Everything a spectral chunk needs, computed once per run: layers with their column amounts,
 * the line table sorted by wavenumber, the angular quadrature, and the chunk plan.
 */
import { levelsToLayers, type AtmosphereLayerDetailed } from '../atmosphere/layers'
import { findTropopause, type TropopauseResult } from '../atmosphere/tropopause'
import { createBuiltInPartitionFunctionLookup } from '../../catalogue/partition-functions'
import { buildContinuumHooks } from '../continuum/continuum-hooks'
import { CO2_CHI_WING_WEIGHT } from '../continuum/co2-chi-factor'
import { PhysicsError } from '../errors'
import type { ContinuumHook } from '../optics/continuum'
import type { LineWingWeights } from '../optics/line-wing-weights'
import type { PartitionFunctionLookup } from '../spectroscopy/partition-function'
import type { LineTable } from '../spectroscopy/line'
import { angleQuadrature, type AngleQuadrature } from '../transfer/quadrature'
import type { AtmosphereProfile } from '../types'
import { resolveComputeSettings, type ComputeSettings } from './settings'

export interface ChunkBounds {
  index: number
  startCm: number
  endCm: number
  /** Index of this chunk's first output bin in the whole run. */
  firstBin: number
  binCount: number
}

export interface PreparedComputation {
  profile: AtmosphereProfile
  settings: ComputeSettings
  layers: AtmosphereLayerDetailed[]
  lines: LineTable
  quadrature: AngleQuadrature
  levelPressurePa: Float64Array
  levelTemperatureK: Float64Array
  levelHeightM: Float64Array
  tropopause: TropopauseResult
  chunks: ChunkBounds[]
  binCount: number
  /** Continuum terms added to every layer's optical depth (from the settings). */
  continuum: ContinuumHook[]
  /** Partition functions Q(T) per isotopologue: level sums of the built-in catalogue, else approximations. */
  partitionFunctionLookup: PartitionFunctionLookup
  /** Far-wing weights by molecule number (CO₂ χ-factor when `co2SubLorentzianWings`). */
  lineWingWeights: LineWingWeights
}

/** Splits [start, end] into chunks aligned to the output bins; the last chunk may be shorter. */
export function planChunks(settings: ComputeSettings): ChunkBounds[] {
  const totalBins = Math.round((settings.endCm - settings.startCm) / settings.outputResolutionCm)
  const binsPerChunk = Math.round(settings.chunkWidthCm / settings.outputResolutionCm)
  const chunks: ChunkBounds[] = []
  for (let firstBin = 0, index = 0; firstBin < totalBins; firstBin += binsPerChunk, index++) {
    const binCount = Math.min(binsPerChunk, totalBins - firstBin)
    // Bounds from integer bin counts, so chunk edges are bit-identical however the run is split.
    chunks.push({
      index,
      startCm: settings.startCm + firstBin * settings.outputResolutionCm,
      endCm: settings.startCm + (firstBin + binCount) * settings.outputResolutionCm,
      firstBin,
      binCount,
    })
  }
  return chunks
}

export function prepareComputation(
  profile: AtmosphereProfile,
  lines: LineTable,
  partialSettings: Partial<ComputeSettings> = {},
): PreparedComputation {
  const settings = resolveComputeSettings(partialSettings)
  if (!(profile.surfaceEmissivity >= 0 && profile.surfaceEmissivity <= 1)) {
    throw new PhysicsError('OUT_OF_RANGE', 'surfaceEmissivity must be in [0, 1]', { field: 'surfaceEmissivity' })
  }
  const layers = levelsToLayers(profile)
  const n = profile.levels.length
  const levelPressurePa = new Float64Array(n)
  const levelTemperatureK = new Float64Array(n)
  const levelHeightM = new Float64Array(n)
  profile.levels.forEach((l, i) => {
    levelPressurePa[i] = l.pressurePa
    levelTemperatureK[i] = l.temperatureK
    levelHeightM[i] = l.heightM
  })
  const chunks = planChunks(settings)
  return {
    profile,
    settings,
    layers,
    lines,
    quadrature: angleQuadrature(settings.quadrature),
    levelPressurePa,
    levelTemperatureK,
    levelHeightM,
    tropopause: findTropopause(profile),
    chunks,
    binCount: chunks.reduce((s, c) => s + c.binCount, 0),
    continuum: buildContinuumHooks({ waterVapour: settings.waterVapourContinuum }),
    partitionFunctionLookup: createBuiltInPartitionFunctionLookup(),
    lineWingWeights: settings.co2SubLorentzianWings ? { 2: CO2_CHI_WING_WEIGHT } : {},
  }
}
