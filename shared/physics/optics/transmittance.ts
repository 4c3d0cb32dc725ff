/**
 * Beer–Lambert transmittance of homogeneous layers and column (summed) optical depths.
 *
 * Optical depths here are vertical (normal-incidence) and dimensionless; a slant path with
 * direction cosine μ = cos θ has optical depth τ/μ (plane-parallel atmosphere).
 */
import { PhysicsError, assertFiniteInRange } from '../errors'

function checkMu(mu: number): void {
  assertFiniteInRange('mu', mu, Number.MIN_VALUE, 1)
}

function checkSameLength(name: string, a: ArrayLike<number>, b: ArrayLike<number>): void {
  if (a.length !== b.length) {
    throw new PhysicsError('INVALID_ARGUMENT', `${name}: arrays differ in length`, {
      lengthA: a.length,
      lengthB: b.length,
    })
  }
}

/**
 * Beer–Lambert transmittance of a homogeneous layer along a slant path.
 *
 * Method: T = exp(−τ/μ).
 * Notes: exact for a homogeneous, non-scattering layer at one wavenumber; for τ/μ > 745 the result
 * underflows to 0 (correct to double precision). Units: τ dimensionless, μ = cos θ in (0, 1].
 * Source: Beer–Lambert–Bouguer law, e.g. Goody & Yung 1989, Atmospheric Radiation, 2nd ed., §1.2
 * (from memory).
 * @param opticalDepth vertical optical depth τ ≥ 0
 * @param mu direction cosine μ in (0, 1] (default 1, vertical)
 */
export function beerLambertTransmittance(opticalDepth: number, mu = 1): number {
  assertFiniteInRange('opticalDepth', opticalDepth, 0, Infinity)
  checkMu(mu)
  return Math.exp(-opticalDepth / mu)
}

/**
 * Beer–Lambert transmittance of a layer at every grid point, written into `out`.
 *
 * Method: out[i] = exp(−τ[i]/μ). Notes: no allocation; τ must be finite and ≥ 0 (checked, a
 * PhysicsError names the first bad point). Units as `beerLambertTransmittance`.
 * Source: Goody & Yung 1989, §1.2 (from memory).
 * @param opticalDepth vertical optical depth per grid point
 * @param mu direction cosine in (0, 1]
 * @param out output, same length as `opticalDepth` (may be the same array)
 */
export function layerTransmittance(
  opticalDepth: Float64Array,
  mu: number,
  out: Float64Array,
): void {
  checkMu(mu)
  checkSameLength('layerTransmittance', opticalDepth, out)
  const inverseMu = 1 / mu
  for (let i = 0; i < opticalDepth.length; i++) {
    const tau = opticalDepth[i]
    if (!(tau >= 0 && tau < Infinity)) {
      throw new PhysicsError('OUT_OF_RANGE', `optical depth ${tau} at point ${i} is not ≥ 0`, {
        index: i,
        value: tau,
      })
    }
    out[i] = Math.exp(-tau * inverseMu)
  }
}

/**
 * Absorptance 1 − exp(−τ/μ) of a layer at every grid point, written into `out`.
 *
 * Method: out[i] = −expm1(−τ[i]/μ), which keeps full relative precision for τ/μ ≪ 1 (where
 * 1 − exp(−x) would lose digits to cancellation). Units and checks as `layerTransmittance`.
 * Source: Goody & Yung 1989, §1.2 (from memory).
 */
export function layerAbsorptance(opticalDepth: Float64Array, mu: number, out: Float64Array): void {
  checkMu(mu)
  checkSameLength('layerAbsorptance', opticalDepth, out)
  const inverseMu = 1 / mu
  for (let i = 0; i < opticalDepth.length; i++) {
    const tau = opticalDepth[i]
    if (!(tau >= 0 && tau < Infinity)) {
      throw new PhysicsError('OUT_OF_RANGE', `optical depth ${tau} at point ${i} is not ≥ 0`, {
        index: i,
        value: tau,
      })
    }
    out[i] = -Math.expm1(-tau * inverseMu)
  }
}

/**
 * Optical depth of a stack of layers (sum over layers) at every grid point, written into `out`.
 *
 * Method: out[i] = Σ_{k = fromLayer}^{toLayer − 1} τ_k[i], summed in increasing layer order (a
 * fixed order keeps the result bit-reproducible). With the default range this is the total
 * column optical depth, and exp(−out/μ) the transmittance of the whole column (Beer–Lambert
 * transmittances of layers multiply).
 * Notes: no allocation. Units: dimensionless.
 * Source: Goody & Yung 1989, §1.2 (from memory).
 * @param opticalDepth layer optical depths [layer][point], all of the same length
 * @param out output, length = number of points
 * @param fromLayer first layer included (default 0, the surface layer)
 * @param toLayer one past the last layer included (default: all layers)
 */
export function columnOpticalDepth(
  opticalDepth: readonly Float64Array[],
  out: Float64Array,
  fromLayer = 0,
  toLayer = opticalDepth.length,
): void {
  if (
    !Number.isInteger(fromLayer) ||
    !Number.isInteger(toLayer) ||
    fromLayer < 0 ||
    toLayer > opticalDepth.length ||
    fromLayer > toLayer
  ) {
    throw new PhysicsError('INVALID_ARGUMENT', `invalid layer range [${fromLayer}, ${toLayer})`, {
      fromLayer,
      toLayer,
      layerCount: opticalDepth.length,
    })
  }
  for (let k = fromLayer; k < toLayer; k++)
    checkSameLength('columnOpticalDepth', opticalDepth[k], out)
  out.fill(0)
  for (let k = fromLayer; k < toLayer; k++) {
    const layer = opticalDepth[k]
    for (let i = 0; i < out.length; i++) out[i] += layer[i]
  }
}

/**
 * Optical depth measured from the top of the atmosphere down to every level, per grid point.
 *
 * Method: with layers indexed from the surface (0) to the top (n − 1) and levels 0 … n (level k
 * is the bottom of layer k, level n the top of the atmosphere):
 * out[n][i] = 0, out[k][i] = out[k + 1][i] + τ_k[i].
 * Notes: accumulated from the top down, so the value at each level does not depend on layers
 * below it. Units: dimensionless.
 * Source: Goody & Yung 1989, §1.2 (from memory).
 * @param opticalDepth layer optical depths [layer][point]
 * @param out n + 1 arrays (one per level), each of the number of points
 */
export function opticalDepthFromTop(
  opticalDepth: readonly Float64Array[],
  out: readonly Float64Array[],
): void {
  const n = opticalDepth.length
  if (out.length !== n + 1) {
    throw new PhysicsError('INVALID_ARGUMENT', 'need one output array per level (layers + 1)', {
      layerCount: n,
      outCount: out.length,
    })
  }
  if (n === 0) {
    out[0].fill(0)
    return
  }
  for (let k = 0; k < n; k++) checkSameLength('opticalDepthFromTop', opticalDepth[k], out[k])
  checkSameLength('opticalDepthFromTop', opticalDepth[0], out[n])
  out[n].fill(0)
  for (let k = n - 1; k >= 0; k--) {
    const above = out[k + 1]
    const layer = opticalDepth[k]
    const level = out[k]
    for (let i = 0; i < level.length; i++) level[i] = above[i] + layer[i]
  }
}
