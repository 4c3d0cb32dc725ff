/**
 * Radiative heating rate of each layer from the net flux at its bounding levels.
 *
 * Sign convention: net flux is UPWARD positive, F_net = F↑ − F↓; a positive heating rate is a
 * warming. A layer gains the energy F_net(bottom) − F_net(top) per unit area and holds the mass
 * (p_bottom − p_top)/g per unit area, so
 *   dT/dt = (g/c_p) · [F_net(bottom) − F_net(top)] / (p_bottom − p_top),
 * i.e. dT/dt = (g/c_p) ∂F_net/∂p with p increasing downward (equivalently −(g/c_p) ∂F↓net/∂p for
 * a downward-positive net flux). Source: Petty 2006, A First Course in Atmospheric Radiation,
 * §10.4 (from memory); Liou 2002, An Introduction to Atmospheric Radiation, §4.7.
 */
import { DRY_AIR_CP_J_PER_KG_K, SECONDS_PER_DAY, STANDARD_GRAVITY_M_PER_S2 } from '../constants'
import { PhysicsError } from '../errors'

/** Physical parameters of the heating-rate conversion. */
export interface HeatingRateOptions {
  /** Gravitational acceleration, m s⁻² (default standard gravity 9.80665). */
  gravityMPerS2?: number
  /** Specific heat of air at constant pressure, J kg⁻¹ K⁻¹ (default 1004, dry air). */
  specificHeatJPerKgK?: number
}

/**
 * Heating rate of each layer, K/day, from the net upward flux at the levels.
 *
 * Method: H_l = 86400 · (g/c_p) · (F_net,l − F_net,l+1)/(p_l − p_{l+1}), levels ordered from the
 * surface (index 0, highest pressure) upward, F_net = F↑ − F↓.
 * Notes: positive = warming. Pressures must strictly decrease upward. Works equally for band or
 * spectral (per cm⁻¹) fluxes, giving K/day or K/day per cm⁻¹.
 * Source: first law for a hydrostatic layer, Petty 2006 §10.4 (from memory); Liou 2002 §4.7.
 *
 * @param levelPressurePa pressure at the nLayers + 1 levels, Pa, decreasing with index
 * @param netFluxUpWPerM2 F↑ − F↓ at the levels, W m⁻²
 * @param out heating rate of the nLayers layers, K day⁻¹
 * @param options gravity (m s⁻²) and specific heat (J kg⁻¹ K⁻¹)
 * @returns `out`
 */
export function heatingRateKPerDay(
  levelPressurePa: ArrayLike<number>,
  netFluxUpWPerM2: ArrayLike<number>,
  out: Float64Array,
  options: HeatingRateOptions = {},
): Float64Array {
  const g = options.gravityMPerS2 ?? STANDARD_GRAVITY_M_PER_S2
  const cp = options.specificHeatJPerKgK ?? DRY_AIR_CP_J_PER_KG_K
  if (!(g > 0 && g < 100)) throw new PhysicsError('OUT_OF_RANGE', `gravity = ${g} m s⁻² is invalid`)
  if (!(cp > 0 && cp < 1e5)) {
    throw new PhysicsError('OUT_OF_RANGE', `specific heat = ${cp} J kg⁻¹ K⁻¹ is invalid`)
  }
  const nLevels = levelPressurePa.length
  if (nLevels < 2 || netFluxUpWPerM2.length !== nLevels || out.length !== nLevels - 1) {
    throw new PhysicsError('INVALID_ARGUMENT', 'need nLevels ≥ 2 fluxes and nLevels − 1 outputs', {
      nLevels,
      nFluxes: netFluxUpWPerM2.length,
      outLength: out.length,
    })
  }
  for (let l = 0; l < nLevels; l++) {
    if (!Number.isFinite(netFluxUpWPerM2[l]) || !(levelPressurePa[l] >= 0)) {
      throw new PhysicsError('OUT_OF_RANGE', 'pressures must be ≥ 0 and fluxes finite', {
        level: l,
      })
    }
  }
  const factor = (g / cp) * SECONDS_PER_DAY
  for (let l = 0; l < nLevels - 1; l++) {
    const dp = levelPressurePa[l] - levelPressurePa[l + 1]
    if (!(dp > 0) || !Number.isFinite(dp)) {
      throw new PhysicsError('NOT_MONOTONIC', 'level pressures must strictly decrease upward', {
        layer: l,
      })
    }
    out[l] = (factor * (netFluxUpWPerM2[l] - netFluxUpWPerM2[l + 1])) / dp
  }
  return out
}

/**
 * Heating rate of each layer, K/day, from separate upward and downward fluxes at the levels.
 *
 * Method: F_net = F↑ − F↓ at each level, then `heatingRateKPerDay`.
 * Notes: positive = warming. Allocates one small array of nLevels.
 * Source: as `heatingRateKPerDay`.
 *
 * @param levelPressurePa level pressures, Pa, decreasing with index
 * @param fluxUpWPerM2 upward flux at the levels, W m⁻²
 * @param fluxDownWPerM2 downward flux at the levels, W m⁻²
 * @param out heating rate of the layers, K day⁻¹
 * @param options gravity and specific heat
 * @returns `out`
 */
export function heatingRateFromUpDownKPerDay(
  levelPressurePa: ArrayLike<number>,
  fluxUpWPerM2: ArrayLike<number>,
  fluxDownWPerM2: ArrayLike<number>,
  out: Float64Array,
  options: HeatingRateOptions = {},
): Float64Array {
  if (fluxUpWPerM2.length !== fluxDownWPerM2.length) {
    throw new PhysicsError('INVALID_ARGUMENT', 'up and down fluxes must have the same length')
  }
  const net = new Float64Array(fluxUpWPerM2.length)
  for (let l = 0; l < net.length; l++) net[l] = fluxUpWPerM2[l] - fluxDownWPerM2[l]
  return heatingRateKPerDay(levelPressurePa, net, out, options)
}
