import type { Transaction } from 'sequelize'
import { mergeChunkResults, type RadiationResult } from '../../shared/physics/engine/merge'
import { prepareComputation } from '../../shared/physics/engine/prepare'
import { toLineTable } from '../../shared/physics/spectroscopy/line'
import { Run, RunChunk, RunResult } from '../models/index'
import { decodeChunkResult, type StoredChunkResult } from './chunk-codec'

const arr = (a: ArrayLike<number>) => Array.from(a, (v) => (Number.isFinite(v) ? v : null))

/** The stored, client-facing form of a run's results: plain arrays, NaN as null. */
export function serialiseResult(r: RadiationResult): {
  summary: Record<string, unknown>
  data: Record<string, unknown>
  detail: Record<string, unknown> | null
} {
  const summary = {
    olrWPerM2: r.olrWPerM2,
    surfaceDownWPerM2: r.surfaceDownWPerM2,
    surfaceUpWPerM2: r.fluxUpWPerM2[0],
    toaNetUpWPerM2: r.fluxNetUpWPerM2[r.fluxNetUpWPerM2.length - 1],
    tropopause: { ...r.tropopause, netUpWPerM2: r.fluxNetUpWPerM2[r.tropopause.levelIndex] },
    gridPointCount: r.gridPointCount,
    lteRiskFromLevel: r.lteRisk.indexOf(1) >= 0 ? r.lteRisk.indexOf(1) : null,
    engineVersion: r.engineVersion,
  }
  const data = {
    levels: {
      pressurePa: arr(r.levelPressurePa),
      heightM: arr(r.levelHeightM),
      temperatureK: arr(r.levelTemperatureK),
      fluxUpWPerM2: arr(r.fluxUpWPerM2),
      fluxDownWPerM2: arr(r.fluxDownWPerM2),
      fluxNetUpWPerM2: arr(r.fluxNetUpWPerM2),
      lteRatio: arr(r.lteRatio),
    },
    layers: { heatingRateKPerDay: arr(r.heatingRateKPerDay) },
    spectrum: {
      wavenumberCm: arr(r.wavenumberCm),
      olrSpectral: arr(r.olrSpectral),
      surfaceDownSpectral: arr(r.surfaceDownSpectral),
      toaNadirRadiance: arr(r.toaNadirRadiance),
      toaBrightnessTemperatureK: arr(r.toaBrightnessTemperatureK),
      surfaceZenithRadiance: arr(r.surfaceZenithRadiance),
      columnTransmittance: arr(r.columnTransmittance),
      emissionPressurePa: arr(r.emissionPressurePa),
      emissionHeightM: arr(r.emissionHeightM),
    },
    spectralFluxes: { fluxUpBinned: arr(r.fluxUpBinned), fluxDownBinned: arr(r.fluxDownBinned) },
  }
  return { summary, data, detail: serialiseDetail(r) }
}

/** The full-resolution window in stored form, or null when the run asked for none. */
function serialiseDetail(r: RadiationResult): Record<string, unknown> | null {
  const d = r.detail
  const window = r.settings.detailWindow
  if (!d || !window) return null
  return {
    startCm: window.startCm,
    endCm: window.endCm,
    pointCount: d.wavenumberCm.length,
    wavenumberCm: arr(d.wavenumberCm),
    olrSpectral: arr(d.olrSpectral),
    surfaceDownSpectral: arr(d.surfaceDownSpectral),
    toaNadirRadiance: arr(d.toaNadirRadiance),
    toaBrightnessTemperatureK: arr(d.toaBrightnessTemperatureK),
    surfaceZenithRadiance: arr(d.surfaceZenithRadiance),
    columnTransmittance: arr(d.columnTransmittance),
  }
}

/** Merges every chunk of a finished run (in chunk order) and stores the results, inside `tx`. */
export async function finalizeRun(run: Run, inputs: Run['inputs'], tx: Transaction): Promise<void> {
  const chunks = await RunChunk.findAll({ where: { runId: run.id }, order: [['chunkIndex', 'ASC']], transaction: tx })
  // Merging needs the levels and the chunk plan, not the lines.
  const prepared = prepareComputation(inputs.profile.snapshot, toLineTable([]), inputs.settings)
  const merged = mergeChunkResults(prepared, chunks.map((c) => decodeChunkResult(c.result as StoredChunkResult)))
  const { summary, data, detail } = serialiseResult(merged)
  // No RETURNING: the database would send the megabytes of results straight back.
  await RunResult.create({ runId: run.id, summary, data, detail }, { transaction: tx, returning: false })
  // Chunk payloads are no longer needed once merged; keep the rows for timing and provenance.
  await RunChunk.update({ result: null }, { where: { runId: run.id }, transaction: tx })
  run.status = 'succeeded'
  run.finishedAt = new Date()
  await run.save({ transaction: tx })
}
