/**
 * Settings of one line-by-line calculation, with defaults and validation. These are the knobs an
 * analyst sets on a run; everything else follows from the profile and the line list.
 */
import { PhysicsError } from '../errors'
import type { AngleQuadratureSpec } from '../transfer/quadrature'
import type { LayerSourceMode } from '../transfer/schwarzschild'

export interface ComputeSettings {
  /** Spectral range, cm⁻¹. */
  startCm: number
  endCm: number
  /** Width of one spectral chunk (the unit of parallel work), cm⁻¹. Must be a multiple of the output resolution. */
  chunkWidthCm: number
  /** Width of the bins of stored spectral output, cm⁻¹ (e.g. 1 or 0.1). */
  outputResolutionCm: number
  /** Lines contribute up to this distance from their centre, cm⁻¹. */
  wingCutoffCm: number
  /** Fine-grid points per narrowest Voigt half width. */
  pointsPerHalfWidth: number
  /** Angular quadrature for fluxes. */
  quadrature: AngleQuadratureSpec
  /** Source function inside a layer. */
  layerSource: LayerSourceMode
  /** Water-vapour continuum on/off (applied when a continuum model is available). */
  waterVapourContinuum: boolean
  /** Sub-Lorentzian far wings of CO₂ lines on/off. */
  co2SubLorentzianWings: boolean
}

export const DEFAULT_COMPUTE_SETTINGS: ComputeSettings = {
  startCm: 10,
  endCm: 3000,
  chunkWidthCm: 10,
  outputResolutionCm: 1,
  wingCutoffCm: 25,
  pointsPerHalfWidth: 4,
  quadrature: { kind: 'gauss-legendre', nodes: 3 },
  layerSource: 'linear-in-tau',
  waterVapourContinuum: true,
  co2SubLorentzianWings: true,
}

/** Fills defaults and checks consistency; throws PhysicsError naming the bad setting. */
export function resolveComputeSettings(partial: Partial<ComputeSettings> = {}): ComputeSettings {
  const s: ComputeSettings = { ...DEFAULT_COMPUTE_SETTINGS, ...partial }
  const bad = (field: string, message: string) => {
    throw new PhysicsError('INVALID_ARGUMENT', `${field}: ${message}`, { field })
  }
  if (!(s.startCm >= 0.1 && s.startCm < s.endCm)) bad('startCm', 'must be ≥ 0.1 and below endCm')
  if (!(s.endCm <= 50_000)) bad('endCm', 'must be ≤ 50 000 cm⁻¹')
  if (!(s.outputResolutionCm >= 0.001 && s.outputResolutionCm <= 100)) {
    bad('outputResolutionCm', 'must be between 0.001 and 100 cm⁻¹')
  }
  if (!(s.chunkWidthCm >= s.outputResolutionCm && s.chunkWidthCm <= 500)) {
    bad('chunkWidthCm', 'must be at least the output resolution and at most 500 cm⁻¹')
  }
  const binsPerChunk = s.chunkWidthCm / s.outputResolutionCm
  if (Math.abs(binsPerChunk - Math.round(binsPerChunk)) > 1e-9) {
    bad('chunkWidthCm', 'must be a whole multiple of outputResolutionCm')
  }
  const bins = (s.endCm - s.startCm) / s.outputResolutionCm
  if (Math.abs(bins - Math.round(bins)) > 1e-6) {
    bad('endCm', 'the range must be a whole number of output bins')
  }
  if (!(s.wingCutoffCm > 0 && s.wingCutoffCm <= 500)) bad('wingCutoffCm', 'must be in (0, 500] cm⁻¹')
  if (!(s.pointsPerHalfWidth >= 1 && s.pointsPerHalfWidth <= 20)) {
    bad('pointsPerHalfWidth', 'must be between 1 and 20')
  }
  return s
}
