/**
 * Brightness-temperature spectra: the temperature of the blackbody that would emit the observed
 * radiance at each wavenumber.
 */
import { PhysicsError } from '../errors'
import { brightnessTemperatureK } from '../planck'

/**
 * Brightness temperature of a radiance spectrum, written into `out`.
 *
 * Method: T_b(ν̃) = c₂ν̃ / ln(1 + c₁L ν̃³/I(ν̃)) (inverse Planck, `brightnessTemperatureK`).
 * Notes: a radiance of exactly 0 maps to 0 K (the limit of the formula); negative or non-finite
 * radiance throws. Wavenumbers must be > 0. Relative accuracy ≈ 1e-15 (inverse of B).
 * Source: inversion of the Planck function, Goody & Yung 1989, Atmospheric Radiation, eq. (1.1).
 *
 * @param wavenumberCm wavenumbers, cm⁻¹
 * @param radiance spectral radiance, W m⁻² sr⁻¹ (cm⁻¹)⁻¹
 * @param out brightness temperature, K
 * @returns `out`
 */
export function brightnessTemperatureSpectrumK(
  wavenumberCm: Float64Array,
  radiance: Float64Array,
  out: Float64Array,
): Float64Array {
  if (radiance.length !== wavenumberCm.length || out.length !== wavenumberCm.length) {
    throw new PhysicsError('INVALID_ARGUMENT', 'wavenumber, radiance and out lengths differ', {
      wavenumbers: wavenumberCm.length,
      radiances: radiance.length,
      outLength: out.length,
    })
  }
  for (let i = 0; i < wavenumberCm.length; i++) {
    const r = radiance[i]
    if (r === 0 && wavenumberCm[i] > 0) {
      out[i] = 0
      continue
    }
    out[i] = brightnessTemperatureK(wavenumberCm[i], r)
  }
  return out
}
