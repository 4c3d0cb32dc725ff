/**
 * The full-resolution output of a run: spectra at every point of the calculation's own grid inside
 * the analyst's detail window, without bin averaging. Each chunk keeps its share of the window;
 * the merge joins the shares in chunk order.
 *
 * Which chunk owns a point: a chunk keeps the points in [max(window start, chunk start),
 * min(window end, chunk end)), and the chunk that holds the window's end also keeps a point lying
 * exactly on it. Chunk edges are grid points of both neighbours, so the half-open rule keeps each
 * wavenumber once.
 */
import { brightnessTemperatureK } from '../planck'
import type { ChunkBounds } from './prepare'
import type { DetailWindow } from './settings'

/** Spectra at the grid points of the detail window. */
export interface DetailSpectrum {
  /** Grid wavenumbers, cm⁻¹ (ascending; the adaptive grid is not uniform). */
  wavenumberCm: Float64Array
  /** Upward spectral flux at the top of the atmosphere, W m⁻² (cm⁻¹)⁻¹. */
  olrSpectral: Float64Array
  /** Downward spectral flux at the surface, W m⁻² (cm⁻¹)⁻¹. */
  surfaceDownSpectral: Float64Array
  /** Nadir radiance at the top, W m⁻² sr⁻¹ (cm⁻¹)⁻¹. */
  toaNadirRadiance: Float64Array
  /** Zenith radiance at the surface, W m⁻² sr⁻¹ (cm⁻¹)⁻¹. */
  surfaceZenithRadiance: Float64Array
  /** Vertical transmittance of the whole column. */
  columnTransmittance: Float64Array
}

export const DETAIL_FIELDS = [
  'wavenumberCm',
  'olrSpectral',
  'surfaceDownSpectral',
  'toaNadirRadiance',
  'surfaceZenithRadiance',
  'columnTransmittance',
] as const satisfies readonly (keyof DetailSpectrum)[]

/** First index of an ascending array whose value is ≥ x (or, with `strict`, > x). */
function lowerBound(values: Float64Array, x: number, strict: boolean): number {
  let lo = 0
  let hi = values.length
  while (lo < hi) {
    const mid = (lo + hi) >>> 1
    if (strict ? values[mid] <= x : values[mid] < x) lo = mid + 1
    else hi = mid
  }
  return lo
}

/**
 * Index range [first, end) of the grid points of `chunk` that belong to the detail window; an
 * empty range when the window misses the chunk.
 */
export function detailPointRange(
  gridCm: Float64Array,
  chunk: ChunkBounds,
  window: DetailWindow | null | undefined,
): { first: number; end: number } {
  if (!window || window.endCm <= chunk.startCm || window.startCm >= chunk.endCm) {
    return { first: 0, end: 0 }
  }
  const from = Math.max(window.startCm, chunk.startCm)
  const ownsWindowEnd = window.endCm <= chunk.endCm
  const to = Math.min(window.endCm, chunk.endCm)
  const first = lowerBound(gridCm, from, false)
  const end = lowerBound(gridCm, to, ownsWindowEnd)
  return { first, end: Math.max(first, end) }
}

/** An empty detail spectrum of `count` points, filled by the chunk solver. */
export function createDetailSpectrum(count: number): DetailSpectrum {
  return {
    wavenumberCm: new Float64Array(count),
    olrSpectral: new Float64Array(count),
    surfaceDownSpectral: new Float64Array(count),
    toaNadirRadiance: new Float64Array(count),
    surfaceZenithRadiance: new Float64Array(count),
    columnTransmittance: new Float64Array(count),
  }
}

/** Joins the chunk shares (given in chunk order; missing shares are skipped). */
export function joinDetailSpectra(parts: readonly (DetailSpectrum | undefined)[]): DetailSpectrum {
  const present = parts.filter((p): p is DetailSpectrum => p !== undefined)
  const total = present.reduce((n, p) => n + p.wavenumberCm.length, 0)
  const joined = createDetailSpectrum(total)
  let offset = 0
  for (const part of present) {
    for (const field of DETAIL_FIELDS) joined[field].set(part[field], offset)
    offset += part.wavenumberCm.length
  }
  return joined
}

/** Brightness temperature of each nadir radiance, K (NaN where the radiance is not positive). */
export function detailBrightnessTemperatureK(detail: DetailSpectrum): Float64Array {
  const out = new Float64Array(detail.wavenumberCm.length)
  for (let i = 0; i < out.length; i++) {
    const radiance = detail.toaNadirRadiance[i]
    out[i] = radiance > 0 ? brightnessTemperatureK(detail.wavenumberCm[i], radiance) : NaN
  }
  return out
}
