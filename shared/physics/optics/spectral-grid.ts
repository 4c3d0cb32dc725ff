/**
 * Spectral grids of the optics and the split of a spectrum into chunks.
 *
 * Every grid is anchored at 0 cm⁻¹: its points are νₙ = n·h for integer n, and a chunk [a, b]
 * holds the points with a ≤ n·h ≤ b. Anchoring makes the grids of different chunks (and of
 * different runs, machines or workers) coincide point for point, which is what allows chunks to be
 * computed independently and compared bit for bit.
 */
import { PhysicsError, assertFiniteInRange } from '../errors'

/** Inclusive range of integer grid indices, n·h in [startCm, endCm]; empty when first > last. */
export interface GridIndexRange {
  first: number
  last: number
}

/** Bounds of one spectral chunk, cm⁻¹ (both ends included). */
export interface SpectralChunk {
  startCm: number
  endCm: number
}

/** Largest grid index magnitude accepted (n·h stays exact in double precision). */
const MAX_GRID_INDEX = 2 ** 50

/**
 * Indices of the anchored grid points inside [startCm, endCm].
 *
 * Method: first = ⌈a/h⌉, last = ⌊b/h⌋, then corrected by one step where rounding of a/h or b/h
 * would put n·h (computed as the product, exactly as the kernels compute it) outside [a, b].
 * Notes: the range is empty (first > last) when no point falls inside. Units: cm⁻¹.
 * Source: common practice.
 * @param startCm a, cm⁻¹ (finite)
 * @param endCm b ≥ a, cm⁻¹
 * @param stepCm h > 0, cm⁻¹
 */
export function gridIndexRange(startCm: number, endCm: number, stepCm: number): GridIndexRange {
  assertFiniteInRange('startCm', startCm, -Infinity, Infinity)
  assertFiniteInRange('endCm', endCm, startCm, Infinity)
  assertFiniteInRange('stepCm', stepCm, Number.MIN_VALUE, Infinity)
  let first = Math.ceil(startCm / stepCm)
  let last = Math.floor(endCm / stepCm)
  if (Math.abs(first) > MAX_GRID_INDEX || Math.abs(last) > MAX_GRID_INDEX) {
    throw new PhysicsError('OUT_OF_RANGE', 'grid step too small for the wavenumber range', {
      startCm,
      endCm,
      stepCm,
    })
  }
  while (first * stepCm < startCm) first++
  while ((first - 1) * stepCm >= startCm) first--
  while (last * stepCm > endCm) last--
  while ((last + 1) * stepCm <= endCm) last++
  return { first, last }
}

/**
 * The wavenumbers n·h of an index range, cm⁻¹.
 * Method: νₙ = n·h (one rounding, the same product the kernels use). Source: common practice.
 */
export function gridWavenumbersCm(range: GridIndexRange, stepCm: number): Float64Array {
  assertFiniteInRange('stepCm', stepCm, Number.MIN_VALUE, Infinity)
  const count = Math.max(0, range.last - range.first + 1)
  const out = new Float64Array(count)
  for (let i = 0; i < count; i++) out[i] = (range.first + i) * stepCm
  return out
}

/**
 * Splits [startCm, endCm] into contiguous chunks of at most `chunkWidthCm`.
 *
 * Method: boundaries a + k·w for k = 0 … m − 1 and b, m = ⌈(b − a)/w⌉ (a last piece shorter than
 * 1e-9·w is merged into its neighbour). Consecutive chunks share their boundary; when the boundary
 * lies on the grid, both chunks contain that point (with identical values), so a consumer that
 * concatenates chunks drops the first point of every chunk after the first when it repeats.
 * Notes: choose a and w as multiples of the grid step (integers are multiples of every
 * power-of-two step) so that every chunk boundary is a grid point. Units: cm⁻¹.
 * Source: common practice.
 * @param startCm a, cm⁻¹ (finite)
 * @param endCm b > a, cm⁻¹
 * @param chunkWidthCm w > 0, cm⁻¹
 */
export function planChunks(startCm: number, endCm: number, chunkWidthCm: number): SpectralChunk[] {
  assertFiniteInRange('startCm', startCm, -Infinity, Infinity)
  assertFiniteInRange('endCm', endCm, -Infinity, Infinity)
  assertFiniteInRange('chunkWidthCm', chunkWidthCm, Number.MIN_VALUE, Infinity)
  if (!(endCm > startCm)) {
    throw new PhysicsError('INVALID_ARGUMENT', 'endCm must be greater than startCm', {
      startCm,
      endCm,
    })
  }
  const span = endCm - startCm
  let count = Math.ceil(span / chunkWidthCm)
  if (count > 1 && span - (count - 1) * chunkWidthCm < 1e-9 * chunkWidthCm) count--
  if (count > 1e7) {
    throw new PhysicsError('OUT_OF_RANGE', 'too many chunks', { count })
  }
  const chunks: SpectralChunk[] = []
  for (let k = 0; k < count; k++) {
    chunks.push({
      startCm: startCm + k * chunkWidthCm,
      endCm: k === count - 1 ? endCm : startCm + (k + 1) * chunkWidthCm,
    })
  }
  return chunks
}
