/**
 * Instantaneous radiative forcing between two flux profiles ("before" and "after" a change of
 * composition, temperatures fixed).
 *
 * Sign convention: forcing = reduction of the NET UPWARD flux, F_net,before − F_net,after with
 * F_net = F↑ − F↓, at a level. Positive forcing means the system below that level gains energy
 * (warming): at the top of the atmosphere it is the decrease of outgoing longwave radiation; at
 * the surface it is the increase of downward longwave flux (minus any change of upward flux).
 * Source: IPCC AR6 WG1 ch. 7, §7.3.1 (definition of instantaneous radiative forcing, from
 * memory); Collins et al. 2006, JGR 111, D14317 (TOA, 200 hPa and surface forcing).
 */
import { PhysicsError } from '../errors'

/** Forcing at the three reference levels and at every level. */
export interface ForcingResult {
  /** At the top level (last index), W m⁻². */
  toaWPerM2: number
  /** At the given tropopause level, W m⁻². */
  tropopauseWPerM2: number
  /** At the surface level (index 0), W m⁻². */
  surfaceWPerM2: number
  /** At every level, W m⁻². */
  profileWPerM2: Float64Array
}

function assertSameLength(a: ArrayLike<number>, b: ArrayLike<number>): void {
  if (a.length !== b.length || a.length < 1) {
    throw new PhysicsError(
      'INVALID_ARGUMENT',
      'before and after must have the same, non-zero length',
      {
        before: a.length,
        after: b.length,
      },
    )
  }
}

/**
 * Instantaneous radiative forcing at the top, the tropopause and the surface.
 *
 * Method: ΔF(level) = F_net,before(level) − F_net,after(level), F_net = F↑ − F↓ (net upward).
 * Notes: positive = warming of everything below the level. Level 0 is the surface, the last
 * level the top. Values must be finite.
 * Source: IPCC AR6 WG1 §7.3.1 (from memory); Collins et al. 2006, JGR 111, D14317.
 *
 * @param netFluxUpBeforeWPerM2 net upward flux per level before the change, W m⁻²
 * @param netFluxUpAfterWPerM2 net upward flux per level after the change, W m⁻²
 * @param tropopauseLevelIndex index of the tropopause level
 * @returns forcing at TOA, tropopause and surface and per level, W m⁻²
 */
export function radiativeForcing(
  netFluxUpBeforeWPerM2: ArrayLike<number>,
  netFluxUpAfterWPerM2: ArrayLike<number>,
  tropopauseLevelIndex: number,
): ForcingResult {
  assertSameLength(netFluxUpBeforeWPerM2, netFluxUpAfterWPerM2)
  const n = netFluxUpBeforeWPerM2.length
  if (
    !Number.isInteger(tropopauseLevelIndex) ||
    tropopauseLevelIndex < 0 ||
    tropopauseLevelIndex >= n
  ) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `tropopause level ${tropopauseLevelIndex} not in [0, ${n - 1}]`,
    )
  }
  const profile = new Float64Array(n)
  for (let l = 0; l < n; l++) {
    const d = netFluxUpBeforeWPerM2[l] - netFluxUpAfterWPerM2[l]
    if (!Number.isFinite(d))
      throw new PhysicsError('OUT_OF_RANGE', 'fluxes must be finite', { level: l })
    profile[l] = d
  }
  return {
    toaWPerM2: profile[n - 1],
    tropopauseWPerM2: profile[tropopauseLevelIndex],
    surfaceWPerM2: profile[0],
    profileWPerM2: profile,
  }
}

/**
 * Spectral forcing at one level: which wavenumbers contribute to the forcing.
 *
 * Method: ΔF(ν) = F_net,before(ν) − F_net,after(ν) per wavenumber at the chosen level.
 * Notes: positive = warming; integrate with the same spectral weights as the fluxes to get
 * the band forcing.
 * Source: as `radiativeForcing`.
 *
 * @param netFluxUpBefore spectral net upward flux before, W m⁻² (cm⁻¹)⁻¹
 * @param netFluxUpAfter spectral net upward flux after, W m⁻² (cm⁻¹)⁻¹
 * @param out spectral forcing, W m⁻² (cm⁻¹)⁻¹
 * @returns `out`
 */
export function spectralForcing(
  netFluxUpBefore: Float64Array,
  netFluxUpAfter: Float64Array,
  out: Float64Array,
): Float64Array {
  assertSameLength(netFluxUpBefore, netFluxUpAfter)
  if (out.length !== netFluxUpBefore.length) {
    throw new PhysicsError('INVALID_ARGUMENT', 'out must have the length of the spectra')
  }
  for (let i = 0; i < out.length; i++) {
    const d = netFluxUpBefore[i] - netFluxUpAfter[i]
    if (!Number.isFinite(d))
      throw new PhysicsError('OUT_OF_RANGE', 'fluxes must be finite', { index: i })
    out[i] = d
  }
  return out
}
