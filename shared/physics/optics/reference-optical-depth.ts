/**
 * Brute-force reference optical depth: every line evaluated directly at every grid point within
 * its cutoff with the accurate Voigt function. Slow by design; kept in the engine as the yardstick
 * for the fast path (`computeChunkOpticalDepth`) in tests and benchmarks.
 */
import { PhysicsError, assertFiniteInRange } from '../errors'
import {
  sliceLineTableByWavenumber,
  validateLineTable,
  voigtKAccurateUnchecked,
  type LineTable,
} from '../spectroscopy'
import type { AtmosphereLayer } from '../types'
import { applyContinuumHooks } from './continuum'
import {
  MAX_PRESSURE_SHIFT_CM,
  computeLayerLineState,
  createLayerLineState,
  validateLayerForOptics,
} from './layer-line-state'
import { layerWingWeights, wingWeightOf } from './line-wing-weights'
import { resolveOpticsOptions, type ReferenceOpticsOptions } from './optics-options'
import { gridIndexRange, gridWavenumbersCm } from './spectral-grid'

const SQRT_LN2 = Math.sqrt(Math.LN2)
const SQRT_LN2_OVER_PI = Math.sqrt(Math.LN2 / Math.PI)

/** Input of `computeReferenceOpticalDepth`. */
export interface ReferenceOpticalDepthInput {
  /** Line table sorted by wavenumber (e.g. from `toLineTable`). */
  lines: LineTable
  /** Homogeneous layers, index 0 at the surface. */
  layers: readonly AtmosphereLayer[]
  /** Lower end of the window, cm⁻¹ (> 0). */
  startCm: number
  /** Upper end of the window, cm⁻¹ (> startCm). */
  endCm: number
  /** Grid step h; the grid is n·h for integer n inside [startCm, endCm], cm⁻¹. */
  stepCm: number
  /** Cutoff, pedestal, continuum hooks, look-ups (grid options do not apply here). */
  options?: ReferenceOpticsOptions
}

/** Output of `computeReferenceOpticalDepth`. */
export interface ReferenceOpticalDepthResult {
  /** Grid wavenumbers n·h, cm⁻¹. */
  wavenumberCm: Float64Array
  /** Vertical optical depth [layer][point]. */
  opticalDepth: Float64Array[]
  /** Number of Voigt-function evaluations. */
  voigtEvaluations: number
}

/**
 * Layer optical depths on a uniform grid by direct summation over lines (reference path).
 *
 * Method: τ_k(νₙ) = Σ_i A_ik · √(ln2/π)/α_D,i · [K(xₙ, y_i) − K_c], for every line i with
 * |νₙ − ν*_i| ≤ cutoff, where A_ik = S_i(T_k)·u_k (see `computeLayerLineState`),
 * xₙ = √ln2 (νₙ − ν*_i)/α_D,i, y_i = √ln2 γ_i/α_D,i, K_c = K(√ln2·cutoff/α_D,i, y_i) with pedestal
 * subtraction and 0 without; for molecules with a far-wing weight χ (`lineWingWeights`) K is
 * multiplied by χ(νₙ − ν*_i, T_k) beyond the weight's onset and K_c by χ(cutoff, T_k); then the
 * continuum hooks are added.
 * Notes: K from the Weideman (1994) N = 40 series (`voigtKAccurateUnchecked`, arguments validated
 * through the line state; relative error ≤ 1e-8 for y ≥ 1e-6). No wing approximation, no
 * interpolation: the only errors are those of K and rounding. Cost ∝ lines × points, so use it on
 * narrow windows. Grid points are n·h as in `gridIndexRange`, so a fast-path result with the same
 * fixed step is comparable point by point. Lines whose shifted centre lies within the cutoff of
 * the window (whatever their position) contribute their wings. Units: cm⁻¹; τ dimensionless.
 * Source: Beer–Lambert optical depth of overlapping lines, Goody & Yung 1989, Atmospheric
 * Radiation, 2nd ed., ch. 3–4 (from memory); Voigt profile via K(x, y): Armstrong 1967, JQSRT 7,
 * 61 (from memory); Weideman 1994, SIAM J. Numer. Anal. 31, 1497.
 */
export function computeReferenceOpticalDepth(
  input: ReferenceOpticalDepthInput,
): ReferenceOpticalDepthResult {
  const { lines, layers, startCm, endCm, stepCm } = input
  const options = resolveOpticsOptions(input.options ?? {})
  assertFiniteInRange('startCm', startCm, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('endCm', endCm, startCm, Infinity)
  if (!(endCm > startCm)) {
    throw new PhysicsError('INVALID_ARGUMENT', 'endCm must be greater than startCm', {
      startCm,
      endCm,
    })
  }
  assertFiniteInRange('stepCm', stepCm, Number.MIN_VALUE, Infinity)
  if (!Array.isArray(layers)) {
    throw new PhysicsError('INVALID_ARGUMENT', 'layers must be an array')
  }
  layers.forEach((layer, index) => validateLayerForOptics(layer, index))

  const cutoff = options.wingCutoffCm
  const range = gridIndexRange(startCm, endCm, stepCm)
  const wavenumberCm = gridWavenumbersCm(range, stepCm)
  const pointCount = wavenumberCm.length
  const margin = cutoff + MAX_PRESSURE_SHIFT_CM + stepCm
  const slice = sliceLineTableByWavenumber(lines, startCm - margin, endCm + margin)
  validateLineTable(slice)
  const state = createLayerLineState(slice.length)
  const opticalDepth: Float64Array[] = []
  let voigtEvaluations = 0

  for (let k = 0; k < layers.length; k++) {
    const tau = new Float64Array(pointCount)
    opticalDepth.push(tau)
    computeLayerLineState(slice, layers[k], state, {
      partitionFunctionLookup: options.partitionFunctionLookup,
      molarMassLookup: options.molarMassLookup,
    })
    const weights = layerWingWeights(options.lineWingWeights, layers[k].meanTemperatureK)
    for (let i = 0; i < state.length; i++) {
      const strength = state.integratedOpticalDepthCm[i]
      if (!(strength > 0)) continue
      const weight = wingWeightOf(weights, slice.moleculeId[i])
      const centre = state.centreCm[i]
      const alphaD = state.dopplerHalfWidthCm[i]
      const scale = SQRT_LN2 / alphaD
      const y = state.lorentzHalfWidthCm[i] * scale
      const amplitude = (strength * SQRT_LN2_OVER_PI) / alphaD
      let pedestal = options.subtractPedestal ? voigtKAccurateUnchecked(cutoff * scale, y) : 0
      if (weight !== undefined && cutoff > weight.onsetCm) pedestal *= weight.chi(cutoff)
      const first = Math.max(range.first, Math.ceil((centre - cutoff) / stepCm) - 1)
      const last = Math.min(range.last, Math.floor((centre + cutoff) / stepCm) + 1)
      for (let n = first; n <= last; n++) {
        const offset = n * stepCm - centre
        if (Math.abs(offset) > cutoff) continue
        let k = voigtKAccurateUnchecked(offset * scale, y)
        if (weight !== undefined && Math.abs(offset) > weight.onsetCm) k *= weight.chi(offset)
        tau[n - range.first] += amplitude * (k - pedestal)
        voigtEvaluations++
      }
    }
    applyContinuumHooks(options.continuum, wavenumberCm, layers[k], k, tau)
  }
  return { wavenumberCm, opticalDepth, voigtEvaluations }
}
