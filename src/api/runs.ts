import type { Page } from '@shared/schemas/paging'
import type { RunDetail, RunSettingsInput, RunStatus, RunSummary } from '@shared/schemas/runs'
import { http, queryString } from './http'

export interface RunResults {
  runId: number
  inputHash: string
  engineVersion: string
  summary: {
    olrWPerM2: number
    surfaceDownWPerM2: number
    surfaceUpWPerM2: number
    toaNetUpWPerM2: number
    tropopause: { levelIndex: number; pressurePa: number; heightM: number; method: string; netUpWPerM2: number }
    gridPointCount: number
    lteRiskFromLevel: number | null
  }
  levels: Record<'pressurePa' | 'heightM' | 'temperatureK' | 'fluxUpWPerM2' | 'fluxDownWPerM2' | 'fluxNetUpWPerM2' | 'lteRatio', (number | null)[]>
  layers: { heatingRateKPerDay: (number | null)[] }
  spectrum: Record<
    | 'wavenumberCm'
    | 'olrSpectral'
    | 'surfaceDownSpectral'
    | 'toaNadirRadiance'
    | 'toaBrightnessTemperatureK'
    | 'surfaceZenithRadiance'
    | 'columnTransmittance'
    | 'emissionPressurePa'
    | 'emissionHeightM',
    (number | null)[]
  >
}

export interface RunProgress {
  id: number
  status: RunStatus
  chunksDone: number
  chunkCount: number
  startedAt: string | null
  finishedAt: string | null
  etaSeconds: number | null
  error: string | null
}

/** A page of runs, newest first. */
export function fetchRuns(params: { page?: number; pageSize?: number; status?: RunStatus; mine?: boolean; search?: string } = {}) {
  return http.get<Page<RunSummary>>(`/runs?${queryString(params)}`)
}

export async function fetchRun(id: number): Promise<RunDetail> {
  return (await http.get<{ run: RunDetail }>(`/runs/${id}`)).run
}

export async function createRun(input: { name?: string; profileId: number; mixtureId: number | null; catalogueId?: 'builtin' | number; settings: RunSettingsInput }): Promise<RunDetail> {
  return (await http.post<{ run: RunDetail }>('/runs', input)).run
}

export async function cancelRun(id: number): Promise<RunDetail> {
  return (await http.post<{ run: RunDetail }>(`/runs/${id}/cancel`)).run
}

export async function deleteRun(id: number): Promise<void> {
  await http.delete(`/runs/${id}`)
}

export function fetchRunResults(id: number): Promise<RunResults> {
  return http.get<RunResults>(`/runs/${id}/results`)
}

/**
 * The full-resolution window of a run: every point of the calculation's own grid between startCm
 * and endCm (ascending, not uniform: fine near line centres, coarse between lines).
 */
export interface RunResultsDetail {
  runId: number
  inputHash: string
  engineVersion: string
  startCm: number
  endCm: number
  pointCount: number
  wavenumberCm: number[]
  olrSpectral: (number | null)[]
  surfaceDownSpectral: (number | null)[]
  toaNadirRadiance: (number | null)[]
  toaBrightnessTemperatureK: (number | null)[]
  surfaceZenithRadiance: (number | null)[]
  columnTransmittance: (number | null)[]
}

/** The full-resolution window of a run that asked for one (ApiError 404 otherwise). */
export function fetchRunResultsDetail(id: number): Promise<RunResultsDetail> {
  return http.get<RunResultsDetail>(`/runs/${id}/results/detail`)
}

/** Link of a server-side CSV table of a run's results. */
export function runCsvUrl(id: number, table: 'spectrum' | 'levels' | 'layers' | 'detail'): string {
  return `/api/runs/${id}/results.csv?table=${table}`
}

/** Progress pushed by the server every second until the run ends; returns a function that stops listening. */
export function watchRunProgress(id: number, onProgress: (p: RunProgress) => void, onEnd: () => void): () => void {
  const source = new EventSource(`/api/runs/${id}/events`)
  source.addEventListener('progress', (e) => onProgress(JSON.parse((e as MessageEvent).data) as RunProgress))
  source.addEventListener('end', () => {
    source.close()
    onEnd()
  })
  source.onerror = () => {
    // The browser reconnects by itself; after the run ends the server closes the stream for good.
  }
  return () => source.close()
}
