/**
 * Emission level: where the optical depth accumulated from the top of the atmosphere reaches a
 * threshold (1 by default), per wavenumber. It marks the effective height from which radiation
 * escapes to space (the peak region of the weighting function for an exponential atmosphere).
 * Source: e.g. Petty 2006, A First Course in Atmospheric Radiation, §7.4 (weighting functions,
 * from memory); Goody & Yung 1989, §2.
 */
import { PhysicsError } from '../errors'

/** Options of the emission-level search. */
export interface EmissionLevelOptions {
  /**
   * Cosine of the zenith angle of the line of sight, (0, 1]: 1 uses vertical optical depth;
   * μ < 1 uses the slant optical depth τ/μ (plane-parallel).
   */
  mu?: number
  /** Cumulative optical depth that defines the level, > 0 (default 1). */
  threshold?: number
}

/** Outputs of the emission-level search, one value per wavenumber. */
export interface EmissionLevelResult {
  /** Pressure where the cumulative optical depth reaches the threshold, Pa. */
  pressurePa: Float64Array
  /** Height where the cumulative optical depth reaches the threshold, m. */
  heightM: Float64Array
  /** 1 where the whole column is thinner than the threshold (level set to the surface). */
  reachesSurface: Uint8Array
}

/**
 * Allocates the outputs of `emissionLevel`.
 *
 * Method: allocation. Notes: reuse across chunks of equal length. Source: — (bookkeeping).
 *
 * @param nWavenumbers number of wavenumbers
 * @returns zeroed outputs
 */
export function createEmissionLevelResult(nWavenumbers: number): EmissionLevelResult {
  if (!Number.isInteger(nWavenumbers) || nWavenumbers < 1) {
    throw new PhysicsError('INVALID_ARGUMENT', 'nWavenumbers must be a positive integer')
  }
  return {
    pressurePa: new Float64Array(nWavenumbers),
    heightM: new Float64Array(nWavenumbers),
    reachesSurface: new Uint8Array(nWavenumbers),
  }
}

/**
 * Pressure and height at which the optical depth accumulated downward from the top reaches a
 * threshold (default 1), per wavenumber.
 *
 * Method: τ_cum(level) = Σ_{layers above} Δτ/μ. In the layer where τ_cum crosses the threshold
 * τ_th, between its top level (p_t, τ_t) and bottom level (p_b, τ_b):
 * - if τ_t > 0: ln τ_cum is taken linear in ln p (a power law τ ∝ pⁿ inside the layer):
 *   ln p_e = ln p_t + ln(τ_th/τ_t)/ln(τ_b/τ_t) · ln(p_b/p_t);
 * - if τ_t = 0 (nothing above absorbs): τ_cum linear in p (uniformly mixed absorber):
 *   p_e = p_t + (τ_th/τ_b)(p_b − p_t).
 * The height is interpolated linearly in ln p between the levels (hydrostatic, isothermal layer),
 * or linearly in p when p_t = 0.
 * Notes: when the whole column is thinner than τ_th, the surface level is returned and the flag
 * `reachesSurface` is set. Levels: index 0 at the surface, pressures strictly decreasing and
 * heights strictly increasing upward.
 * Source: definition of the τ = 1 emission level, e.g. Petty 2006 §7.4 (from memory).
 *
 * @param layerOpticalDepth vertical optical depth per layer ([layer][ν]), dimensionless, ≥ 0
 * @param levelPressurePa pressure at the nLayers + 1 levels, Pa
 * @param levelHeightM height at the levels, m
 * @param out preallocated outputs (Pa, m, flags)
 * @param options slant μ and threshold
 * @returns `out`
 */
export function emissionLevel(
  layerOpticalDepth: readonly Float64Array[],
  levelPressurePa: ArrayLike<number>,
  levelHeightM: ArrayLike<number>,
  out: EmissionLevelResult,
  options: EmissionLevelOptions = {},
): EmissionLevelResult {
  const mu = options.mu ?? 1
  const threshold = options.threshold ?? 1
  if (!(mu > 0 && mu <= 1)) throw new PhysicsError('OUT_OF_RANGE', `mu = ${mu} must be in (0, 1]`)
  if (!(threshold > 0 && threshold < Infinity)) {
    throw new PhysicsError('OUT_OF_RANGE', `threshold = ${threshold} must be finite and > 0`)
  }
  const nLayers = layerOpticalDepth.length
  if (
    nLayers < 1 ||
    levelPressurePa.length !== nLayers + 1 ||
    levelHeightM.length !== nLayers + 1
  ) {
    throw new PhysicsError('INVALID_ARGUMENT', 'need nLayers ≥ 1 and nLayers + 1 levels', {
      nLayers,
      nPressures: levelPressurePa.length,
      nHeights: levelHeightM.length,
    })
  }
  for (let l = 0; l <= nLayers; l++) {
    const p = levelPressurePa[l]
    const z = levelHeightM[l]
    if (!(p >= 0 && p < Infinity) || !Number.isFinite(z)) {
      throw new PhysicsError('OUT_OF_RANGE', 'level pressure and height must be finite, p ≥ 0', {
        level: l,
      })
    }
    if (l > 0 && !(p < levelPressurePa[l - 1] && z > levelHeightM[l - 1])) {
      throw new PhysicsError('NOT_MONOTONIC', 'pressure must decrease and height increase upward', {
        level: l,
      })
    }
  }
  const n = out.pressurePa.length
  if (out.heightM.length !== n || out.reachesSurface.length !== n) {
    throw new PhysicsError('INVALID_ARGUMENT', 'output arrays must have equal lengths')
  }
  for (let l = 0; l < nLayers; l++) {
    const row = layerOpticalDepth[l]
    if (row.length !== n) {
      throw new PhysicsError('INVALID_ARGUMENT', `layerOpticalDepth[${l}] must have length ${n}`)
    }
    for (let j = 0; j < n; j++) {
      if (!(row[j] >= 0 && row[j] < Infinity)) {
        throw new PhysicsError('OUT_OF_RANGE', 'optical depth must be finite and ≥ 0', {
          layer: l,
          index: j,
        })
      }
    }
  }
  const secant = 1 / mu
  for (let j = 0; j < n; j++) {
    let cumTop = 0
    let found = false
    for (let l = nLayers - 1; l >= 0; l--) {
      const cumBottom = cumTop + layerOpticalDepth[l][j] * secant
      if (cumBottom >= threshold) {
        const pTop = levelPressurePa[l + 1]
        const pBottom = levelPressurePa[l]
        const zTop = levelHeightM[l + 1]
        const zBottom = levelHeightM[l]
        let p: number
        if (cumTop > 0 && pTop > 0) {
          const f = Math.log(threshold / cumTop) / Math.log(cumBottom / cumTop)
          p = pTop * Math.exp(f * Math.log(pBottom / pTop))
        } else {
          p = pTop + (threshold / cumBottom) * (pBottom - pTop)
        }
        const g =
          pTop > 0 ? Math.log(p / pTop) / Math.log(pBottom / pTop) : (p - pTop) / (pBottom - pTop)
        out.pressurePa[j] = p
        out.heightM[j] = zTop + g * (zBottom - zTop)
        out.reachesSurface[j] = 0
        found = true
        break
      }
      cumTop = cumBottom
    }
    if (!found) {
      out.pressurePa[j] = levelPressurePa[0]
      out.heightM[j] = levelHeightM[0]
      out.reachesSurface[j] = 1
    }
  }
  return out
}
