/**
 * Continuum hooks: the interface through which smooth absorption that is not made of lines
 * (water-vapour self/foreign continuum, carbon-dioxide far-wing corrections, collision-induced
 * absorption) is added to a layer's optical depth. The continuum models themselves live elsewhere;
 * this file only fixes the hook shape and applies a list of hooks.
 */
import { PhysicsError } from '../errors'
import type { AtmosphereLayer, GasId } from '../types'

/**
 * A continuum term. It must ADD its vertical optical depth (dimensionless) of `layer` at every
 * wavenumber of `wavenumberCm` (cm⁻¹) to `out` (same length), in place, without reading anything
 * but its arguments (so that chunks stay independent and deterministic). `layerIndex` is the index
 * of the layer in the list given to the optics (0 = surface layer).
 */
export type ContinuumHook = ((
  wavenumberCm: Float64Array,
  layer: AtmosphereLayer,
  layerIndex: number,
  out: Float64Array,
) => void) & {
  /**
   * The gases whose amounts the hook reads (besides the layer's pressure, temperature and air
   * column). Undeclared means "any": a concentration sweep then applies the hook per member
   * instead of once.
   */
  readonly gases?: readonly GasId[]
}

/** True unless the hook declares the gases it reads and `gas` is not one of them. */
export function continuumHookReadsGas(hook: ContinuumHook, gas: GasId): boolean {
  return hook.gases === undefined || hook.gases.includes(gas)
}

/** Throws INVALID_ARGUMENT unless `hooks` is an array of functions. */
export function validateContinuumHooks(hooks: readonly ContinuumHook[]): void {
  if (!Array.isArray(hooks)) {
    throw new PhysicsError('INVALID_ARGUMENT', 'continuum hooks must be an array of functions')
  }
  hooks.forEach((hook, index) => {
    if (typeof hook !== 'function') {
      throw new PhysicsError('INVALID_ARGUMENT', `continuum hook ${index} is not a function`, {
        index,
      })
    }
  })
}

/**
 * Applies continuum hooks in order, each adding its optical depth to `out`.
 *
 * Method: out(ν) ← out(ν) + Σₖ τₖ(ν), hooks called in list order (a fixed order keeps the
 * floating-point sum deterministic).
 * Notes: after the hooks, every value of `out` must be finite and ≥ 0; otherwise a PhysicsError
 * (OUT_OF_RANGE) names the first offending point, so a faulty continuum model cannot silently
 * produce NaN or negative optical depth. Units: ν in cm⁻¹, τ dimensionless.
 * Source: additivity of absorption coefficients (Beer–Lambert law), e.g. Goody & Yung 1989,
 * Atmospheric Radiation, 2nd ed., §1.2 (from memory).
 * @param hooks continuum terms (may be empty)
 * @param wavenumberCm grid, cm⁻¹
 * @param layer the layer the optical depth belongs to
 * @param layerIndex index of the layer (0 = surface layer)
 * @param out optical depth to add to, same length as `wavenumberCm`
 */
export function applyContinuumHooks(
  hooks: readonly ContinuumHook[],
  wavenumberCm: Float64Array,
  layer: AtmosphereLayer,
  layerIndex: number,
  out: Float64Array,
): void {
  if (out.length !== wavenumberCm.length) {
    throw new PhysicsError('INVALID_ARGUMENT', 'output and wavenumber grid differ in length', {
      outLength: out.length,
      gridLength: wavenumberCm.length,
    })
  }
  if (hooks.length === 0) return
  for (const hook of hooks) hook(wavenumberCm, layer, layerIndex, out)
  for (let i = 0; i < out.length; i++) {
    const value = out[i]
    if (!(value >= 0 && value < Infinity)) {
      throw new PhysicsError(
        'OUT_OF_RANGE',
        `optical depth after the continuum hooks is ${value} at ${wavenumberCm[i]} cm⁻¹ (layer ${layerIndex})`,
        { layerIndex, wavenumberCm: wavenumberCm[i], value },
      )
    }
  }
}
