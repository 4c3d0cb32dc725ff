/**
 * The water-vapour continuum as a continuum hook of the optics.
 */
import type { ContinuumHook } from '../optics/continuum'
import { addWaterContinuumOpticalDepth, type WaterContinuumParts } from './water-vapour-continuum'

/**
 * Creates a continuum hook that adds the water-vapour continuum of each layer.
 *
 * Method: hook(ν, layer, k, out) adds τ(ν) = w(ν) C_s(ν, T) N_w [e + γ(P − e)] of the layer
 * (`addWaterContinuumOpticalDepth`), self and/or foreign part as chosen.
 * Notes: pure (reads only its arguments), deterministic, no allocation per call. Non-zero only on
 * 650–1300 cm⁻¹ (full strength on 700–1250 cm⁻¹, tapered at the edges). Units: τ dimensionless.
 * Source: Roberts, Selby & Biberman 1976, Appl. Opt. 15, 2085 (coefficients from memory).
 * @param parts self and/or foreign (default both)
 */
export function createWaterVapourContinuumHook(parts: WaterContinuumParts = {}): ContinuumHook {
  const chosen: WaterContinuumParts = { self: parts.self ?? true, foreign: parts.foreign ?? true }
  const hook: ContinuumHook = (wavenumberCm, layer, _layerIndex, out) =>
    addWaterContinuumOpticalDepth(wavenumberCm, layer, out, chosen)
  // It reads the water-vapour amount only, so a sweep of another gas applies it once.
  return Object.assign(hook, { gases: ['H2O'] as const })
}
