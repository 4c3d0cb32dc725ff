/**
 * Per-molecule far-wing weights of the optics (sub-Lorentzian wings): validation of the option and
 * the per-layer evaluators the optical-depth kernels call per line and grid point.
 *
 * With a weight χ for a molecule, each of its lines contributes
 *   f(ν) = A·[F(ν − ν*)·χ(ν − ν*, T) − F(cutoff)·χ(cutoff, T)·p],  |ν − ν*| ≤ cutoff,
 * (F the area-normalised Voigt profile, p = 1 with pedestal subtraction, else 0), with χ = 1 up
 * to the weight's onset. The wing cutoff is the same for every molecule: with the default 25 cm⁻¹
 * cutoff the CO2 χ-factor acts between its onset (3 cm⁻¹) and 25 cm⁻¹.
 */
import { PhysicsError } from '../errors'
import type { LineWingWeight } from '../continuum/line-wing-weight'

/** Far-wing weights by database molecule number (2 = CO2); molecules without one keep χ = 1. */
export type LineWingWeights = Partial<Record<number, LineWingWeight>>

/** A wing weight specialised to one layer temperature. */
export interface LayerWingWeight {
  /** χ = 1 for |Δν| ≤ onsetCm, cm⁻¹. */
  onsetCm: number
  /** Slope discontinuities of χ, ascending, cm⁻¹ (evaluated exactly by the multi-level paths). */
  kinksCm: readonly number[]
  /** χ(Δν) at the layer temperature, Δν = ν − ν* in cm⁻¹. */
  chi: (detuningCm: number) => number
}

/** Throws PhysicsError unless every entry is a usable weight keyed by a positive integer. */
export function validateLineWingWeights(weights: LineWingWeights | undefined): LineWingWeights {
  if (weights === undefined) return {}
  if (weights === null || typeof weights !== 'object') {
    throw new PhysicsError('INVALID_ARGUMENT', 'lineWingWeights must be an object')
  }
  for (const [key, weight] of Object.entries(weights)) {
    const moleculeId = Number(key)
    if (!Number.isInteger(moleculeId) || moleculeId < 1 || moleculeId > 1000) {
      throw new PhysicsError('INVALID_ARGUMENT', 'lineWingWeights keys must be molecule numbers', {
        key,
      })
    }
    if (weight === undefined) continue
    const onset = weight.onsetCm
    if (!(Number.isFinite(onset) && onset >= 0) || typeof weight.atTemperature !== 'function') {
      throw new PhysicsError('INVALID_ARGUMENT', `wing weight of molecule ${key} is invalid`, {
        moleculeId,
      })
    }
    let previous = -Infinity
    for (const kink of weight.kinksCm) {
      if (!(Number.isFinite(kink) && kink >= 0 && kink > previous)) {
        throw new PhysicsError(
          'INVALID_ARGUMENT',
          `wing weight of molecule ${key}: kinks must be finite, ≥ 0 and ascending`,
          { moleculeId },
        )
      }
      previous = kink
    }
  }
  return weights
}

/**
 * The weights of one layer as an array indexed by molecule number (undefined = no weight).
 * Calls `atTemperature` once per weighted molecule, which validates the temperature (the CO2
 * χ-factor accepts 150–800 K and throws PhysicsError outside).
 */
export function layerWingWeights(
  weights: LineWingWeights,
  temperatureK: number,
): (LayerWingWeight | undefined)[] {
  const out: (LayerWingWeight | undefined)[] = []
  for (const [key, weight] of Object.entries(weights)) {
    if (weight === undefined) continue
    out[Number(key)] = {
      onsetCm: weight.onsetCm,
      kinksCm: weight.kinksCm,
      chi: weight.atTemperature(temperatureK),
    }
  }
  return out
}

/** The weight of a line's molecule in a layer, or undefined. */
export function wingWeightOf(
  layerWeights: readonly (LayerWingWeight | undefined)[],
  moleculeId: number,
): LayerWingWeight | undefined {
  return moleculeId < layerWeights.length ? layerWeights[moleculeId] : undefined
}
