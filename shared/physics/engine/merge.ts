/**
 * Assembles the chunk results of a run into its final numbers: band fluxes per level (summed in
 * chunk order, so the result does not depend on which worker finished first), heating rates, the
 * binned spectra, emission levels, and the local-thermodynamic-equilibrium check.
 */
import { lteCheck } from '../diagnostics/lte-check'
import { PhysicsError } from '../errors'
import { brightnessTemperatureK } from '../planck'
import { heatingRateKPerDay } from '../transfer/heating-rate'
import { ENGINE_VERSION } from '../../version'
import type { ChunkResult } from './compute-chunk'
import { detailBrightnessTemperatureK, joinDetailSpectra, type DetailSpectrum } from './detail-spectrum'
import type { PreparedComputation } from './prepare'
import type { ComputeSettings } from './settings'

export interface RadiationResult {
  engineVersion: string
  settings: ComputeSettings
  levelPressurePa: Float64Array
  levelHeightM: Float64Array
  levelTemperatureK: Float64Array
  /** Band-integrated fluxes at each level over [startCm, endCm], W m⁻². */
  fluxUpWPerM2: Float64Array
  fluxDownWPerM2: Float64Array
  fluxNetUpWPerM2: Float64Array
  /** Heating rate of each layer, K/day (positive = warming). */
  heatingRateKPerDay: Float64Array
  /** Outgoing longwave radiation (upward flux at the top level), W m⁻². */
  olrWPerM2: number
  /** Downward flux at the surface, W m⁻². */
  surfaceDownWPerM2: number
  tropopause: PreparedComputation['tropopause']
  /** Centres of the output bins, cm⁻¹. */
  wavenumberCm: Float64Array
  /** Bin-mean spectra. Flux spectra in W m⁻² (cm⁻¹)⁻¹, radiances in W m⁻² sr⁻¹ (cm⁻¹)⁻¹. */
  olrSpectral: Float64Array
  surfaceDownSpectral: Float64Array
  toaNadirRadiance: Float64Array
  /** Brightness temperature of the bin-mean nadir radiance, K. */
  toaBrightnessTemperatureK: Float64Array
  surfaceZenithRadiance: Float64Array
  /** Bin-mean vertical transmittance of the whole column. */
  columnTransmittance: Float64Array
  /**
   * Emission level per bin: where the bin-mean vertical transmittance to space falls to 1/e,
   * interpolated in ln p. NaN where the column is thinner than that (the surface shows through).
   */
  emissionPressurePa: Float64Array
  emissionHeightM: Float64Array
  /** Bin-mean spectral fluxes at every level, [bin·nLevels + level]. */
  fluxUpBinned: Float64Array
  fluxDownBinned: Float64Array
  /** Collision rate / Einstein A of the CO₂ bending mode per level, and the flag where it is small. */
  lteRatio: Float64Array
  lteRisk: Uint8Array
  gridPointCount: number
  /** Spectra at full resolution inside settings.detailWindow (null when no window was asked for). */
  detail: FullResolutionDetail | null
}

/** The detail window's spectra with the brightness temperature of the nadir radiance, K. */
export interface FullResolutionDetail extends DetailSpectrum {
  toaBrightnessTemperatureK: Float64Array
}

export function mergeChunkResults(prepared: PreparedComputation, results: ChunkResult[]): RadiationResult {
  const { settings, levelPressurePa, levelHeightM, levelTemperatureK } = prepared
  const nLevels = levelPressurePa.length
  const nBins = prepared.binCount
  const byIndex = new Map(results.map((r) => [r.chunkIndex, r]))
  const missing = prepared.chunks.filter((c) => !byIndex.has(c.index)).map((c) => c.index)
  if (missing.length > 0) {
    throw new PhysicsError('INVALID_ARGUMENT', `results of chunk(s) ${missing.join(', ')} are missing`)
  }

  const fluxUpWPerM2 = new Float64Array(nLevels)
  const fluxDownWPerM2 = new Float64Array(nLevels)
  const fluxUpBinned = new Float64Array(nBins * nLevels)
  const fluxDownBinned = new Float64Array(nBins * nLevels)
  const transmittance = new Float64Array(nBins * nLevels)
  const toaNadirRadiance = new Float64Array(nBins)
  const surfaceZenithRadiance = new Float64Array(nBins)
  let gridPointCount = 0
  for (const chunk of prepared.chunks) {
    const r = byIndex.get(chunk.index)!
    for (let l = 0; l < nLevels; l++) {
      fluxUpWPerM2[l] += r.fluxUpWPerM2[l]
      fluxDownWPerM2[l] += r.fluxDownWPerM2[l]
    }
    fluxUpBinned.set(r.fluxUpBinned, r.firstBin * nLevels)
    fluxDownBinned.set(r.fluxDownBinned, r.firstBin * nLevels)
    transmittance.set(r.transmittanceToSpaceBinned, r.firstBin * nLevels)
    toaNadirRadiance.set(r.toaNadirRadianceBinned, r.firstBin)
    surfaceZenithRadiance.set(r.surfaceZenithRadianceBinned, r.firstBin)
    gridPointCount += r.gridPointCount
  }

  const fluxNetUpWPerM2 = new Float64Array(nLevels)
  for (let l = 0; l < nLevels; l++) fluxNetUpWPerM2[l] = fluxUpWPerM2[l] - fluxDownWPerM2[l]
  const heatingRate = new Float64Array(nLevels - 1)
  heatingRateKPerDay(levelPressurePa, fluxNetUpWPerM2, heatingRate)

  const wavenumberCm = new Float64Array(nBins)
  const olrSpectral = new Float64Array(nBins)
  const surfaceDownSpectral = new Float64Array(nBins)
  const toaBrightnessTemperatureK = new Float64Array(nBins)
  const columnTransmittance = new Float64Array(nBins)
  const emissionPressurePa = new Float64Array(nBins)
  const emissionHeightM = new Float64Array(nBins)
  for (let b = 0; b < nBins; b++) {
    const centre = settings.startCm + (b + 0.5) * settings.outputResolutionCm
    wavenumberCm[b] = centre
    olrSpectral[b] = fluxUpBinned[b * nLevels + nLevels - 1]
    surfaceDownSpectral[b] = fluxDownBinned[b * nLevels]
    toaBrightnessTemperatureK[b] = toaNadirRadiance[b] > 0 ? brightnessTemperatureK(centre, toaNadirRadiance[b]) : NaN
    columnTransmittance[b] = transmittance[b * nLevels]
    const level = emissionLevel(transmittance, b * nLevels, nLevels, levelPressurePa, levelHeightM)
    emissionPressurePa[b] = level.pressurePa
    emissionHeightM[b] = level.heightM
  }

  let detail: FullResolutionDetail | null = null
  if (settings.detailWindow) {
    const joined = joinDetailSpectra(prepared.chunks.map((c) => byIndex.get(c.index)!.detail))
    detail = { ...joined, toaBrightnessTemperatureK: detailBrightnessTemperatureK(joined) }
  }

  const lte = lteCheck(levelPressurePa, levelTemperatureK)
  return {
    engineVersion: ENGINE_VERSION,
    settings,
    levelPressurePa,
    levelHeightM,
    levelTemperatureK,
    fluxUpWPerM2,
    fluxDownWPerM2,
    fluxNetUpWPerM2,
    heatingRateKPerDay: heatingRate,
    olrWPerM2: fluxUpWPerM2[nLevels - 1],
    surfaceDownWPerM2: fluxDownWPerM2[0],
    tropopause: prepared.tropopause,
    wavenumberCm,
    olrSpectral,
    surfaceDownSpectral,
    toaNadirRadiance,
    toaBrightnessTemperatureK,
    surfaceZenithRadiance,
    columnTransmittance,
    emissionPressurePa,
    emissionHeightM,
    fluxUpBinned,
    fluxDownBinned,
    lteRatio: lte.ratio,
    lteRisk: lte.nonLteRisk,
    gridPointCount,
    detail,
  }
}

const ONE_OVER_E = Math.exp(-1)

/** Top-down search for the level where transmittance to space falls to 1/e; τ linear in ln p between levels. */
function emissionLevel(
  transmittance: Float64Array,
  offset: number,
  nLevels: number,
  pressurePa: Float64Array,
  heightM: Float64Array,
): { pressurePa: number; heightM: number } {
  for (let l = nLevels - 2; l >= 0; l--) {
    const lower = transmittance[offset + l]
    if (lower > ONE_OVER_E) continue
    const upper = transmittance[offset + l + 1]
    const tauUpper = -Math.log(upper)
    const tauLower = -Math.log(Math.max(lower, 1e-300))
    const f = tauLower > tauUpper ? (1 - tauUpper) / (tauLower - tauUpper) : 0
    const lnP = Math.log(pressurePa[l + 1]) + f * (Math.log(pressurePa[l]) - Math.log(pressurePa[l + 1]))
    return { pressurePa: Math.exp(lnP), heightM: heightM[l + 1] + f * (heightM[l] - heightM[l + 1]) }
  }
  return { pressurePa: NaN, heightM: NaN }
}
