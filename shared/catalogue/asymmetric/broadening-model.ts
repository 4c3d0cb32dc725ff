/**
 * Evaluation of the simple J-dependent broadening models of the constants tables.
 */
import { assertFiniteInRange } from '../../physics/errors'
import type { BroadeningModel } from './constants/types'

/** Broadening parameters of one line at 296 K. */
export interface LineBroadening {
  /** γ_air, cm⁻¹ atm⁻¹. */
  airHalfWidthCmPerAtm: number
  /** γ_self, cm⁻¹ atm⁻¹. */
  selfHalfWidthCmPerAtm: number
  /** n_air (dimensionless). */
  temperatureExponentAir: number
  /** δ_air, cm⁻¹ atm⁻¹. */
  pressureShiftCmPerAtm: number
}

/**
 * Broadening parameters for a line with lower-state J″.
 *
 * Method: γ_air = max(γ_min, γ₀ exp(−a J″)), γ_self = r γ_air, n_air = max(n_min, n₀ − s J″),
 * δ_air constant (the fields of `BroadeningModel`).
 * Notes: a smooth representative model, not a line-by-line fit; real H2O widths scatter by a
 * factor ~2 around it at fixed J″. Units cm⁻¹ atm⁻¹ at 296 K.
 * Source: the per-table sources in constants/*.ts (from memory, low confidence).
 * @param jLower J″ ≥ 0
 */
export function lineBroadening(model: BroadeningModel, jLower: number): LineBroadening {
  assertFiniteInRange('jLower', jLower, 0, Infinity)
  const air = Math.max(
    model.airMinCmPerAtm,
    model.airAtJ0CmPerAtm * Math.exp(-model.airDecayPerJ * jLower),
  )
  return {
    airHalfWidthCmPerAtm: air,
    selfHalfWidthCmPerAtm: model.selfToAirRatio * air,
    temperatureExponentAir: Math.max(model.nAirMin, model.nAirAtJ0 - model.nAirSlopePerJ * jLower),
    pressureShiftCmPerAtm: model.pressureShiftCmPerAtm,
  }
}
