/**
 * Planck function per wavenumber: spectral radiance, its inverse (brightness temperature), its
 * temperature derivative, band integrals and the Wien peak.
 *
 * Units: wavenumber cm⁻¹, temperature K, spectral radiance W m⁻² sr⁻¹ (cm⁻¹)⁻¹, band radiance
 * W m⁻² sr⁻¹. With x = c₂ν̃/T the Planck function is B(ν̃, T) = c₁L ν̃³ / (eˣ − 1)
 * (Planck 1901; e.g. Goody & Yung 1989, Atmospheric Radiation, eq. 1.1 in wavenumber form;
 * Liou 2002, An Introduction to Atmospheric Radiation, §1.2).
 */
import { C1L_W_PER_M2_SR_CM4, C2_CM_K } from './constants'
import { PhysicsError } from './errors'

/**
 * Root of 3(1 − e⁻ˣ) = x, i.e. x = 3 + W₀(−3e⁻³): the peak of B per unit frequency or wavenumber
 * lies at c₂ν̃/T = x. Value from mpmath 1.2.1 `3 + lambertw(-3*e**-3)` = 2.82143937212207889…
 */
export const WIEN_X_WAVENUMBER = 2.821439372122079

/** ∫₀^∞ x³/(eˣ − 1) dx = π⁴/15 (Riemann ζ(4)·Γ(4) = 6 · π⁴/90). */
const PLANCK_INTEGRAL_TOTAL = Math.PI ** 4 / 15

/** Largest temperature accepted, K (far above any atmospheric use; guards against garbage). */
const MAX_TEMPERATURE_K = 1e6
/** Largest wavenumber accepted, cm⁻¹ (100 nm; beyond any thermal-infrared use). */
const MAX_WAVENUMBER_CM = 1e5

/**
 * Below this dimensionless width x₂ − x₁ a band integral is done by 8-point Gauss–Legendre on the
 * interval instead of the difference of two tail series, to avoid cancellation for narrow bands.
 */
const NARROW_BAND_WIDTH_X = 0.5

/** Below this x the tail ∫ₓ^∞ is computed as π⁴/15 minus the small-x (Bernoulli) expansion. */
const SMALL_X_SWITCH = 1

/**
 * Bernoulli numbers divided by factorials, B_{2k}/(2k)! for k = 1…10, used in the series
 * t/(eᵗ − 1) = 1 − t/2 + Σ B_{2k} t^{2k}/(2k)! (|t| < 2π; Abramowitz & Stegun 1964, 23.1.1 and
 * Table 23.2 for B_{2k}).
 */
const BERNOULLI_OVER_FACTORIAL: readonly number[] = [
  1 / 6 / 2,
  -1 / 30 / 24,
  1 / 42 / 720,
  -1 / 30 / 40320,
  5 / 66 / 3628800,
  -691 / 2730 / 479001600,
  7 / 6 / 87178291200,
  -3617 / 510 / 20922789888000,
  43867 / 798 / 6402373705728000,
  -174611 / 330 / 2432902008176640000,
]

/** 8-point Gauss–Legendre nodes (positive half) and weights on [−1, 1] (numpy 1.24 leggauss). */
const GL8_NODES: readonly number[] = [
  0.18343464249564978, 0.525532409916329, 0.7966664774136267, 0.9602898564975362,
]
const GL8_WEIGHTS: readonly number[] = [
  0.36268378337836177, 0.31370664587788705, 0.22238103445337434, 0.10122853629037669,
]

function assertTemperature(temperatureK: number): void {
  if (!Number.isFinite(temperatureK) || temperatureK <= 0 || temperatureK > MAX_TEMPERATURE_K) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `temperatureK = ${temperatureK} must be finite, > 0 and ≤ ${MAX_TEMPERATURE_K}`,
      { name: 'temperatureK', value: temperatureK },
    )
  }
}

function assertWavenumber(name: string, wavenumberCm: number, allowInfinity = false): void {
  const ok =
    wavenumberCm >= 0 &&
    (wavenumberCm <= MAX_WAVENUMBER_CM || (allowInfinity && wavenumberCm === Infinity))
  if (!ok) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `${name} = ${wavenumberCm} must be within [0, ${MAX_WAVENUMBER_CM}] cm⁻¹`,
      { name, value: wavenumberCm },
    )
  }
}

/** Planck radiance kernel without validation; ν̃ ≥ 0, T > 0. */
function planckKernel(wavenumberCm: number, temperatureK: number): number {
  if (wavenumberCm === 0) return 0
  const x = (C2_CM_K * wavenumberCm) / temperatureK
  // expm1 keeps full precision as x → 0 (Rayleigh–Jeans side); for x > ~709.8 it returns
  // Infinity and the quotient underflows cleanly to 0 (no NaN).
  return (C1L_W_PER_M2_SR_CM4 * wavenumberCm ** 3) / Math.expm1(x)
}

/** dB/dT kernel without validation; ν̃ ≥ 0, T > 0. */
function planckDerivativeKernel(wavenumberCm: number, temperatureK: number): number {
  if (wavenumberCm === 0) return 0
  const x = (C2_CM_K * wavenumberCm) / temperatureK
  // dB/dT = (c₁L ν̃³/T) · x eˣ/(eˣ − 1)² written with e⁻ˣ so that large x underflows to 0
  // instead of Infinity/Infinity.
  const emx = Math.exp(-x)
  const oneMinusEmx = -Math.expm1(-x)
  return ((C1L_W_PER_M2_SR_CM4 * wavenumberCm ** 3) / temperatureK) * ((x * emx) / oneMinusEmx ** 2)
}

/**
 * Spectral radiance of a blackbody per unit wavenumber.
 *
 * Method: B(ν̃, T) = c₁L ν̃³ / expm1(c₂ν̃/T), c₁L = 2hc² (1.191 042 972 × 10⁻⁸ W m⁻² sr⁻¹ cm⁴),
 * c₂ = hc/k (1.438 776 877 cm K), CODATA 2018.
 * Notes: expm1 keeps full relative precision for c₂ν̃/T → 0; for c₂ν̃/T ≳ 710 the result
 * underflows to 0. B(0, T) = 0. Relative accuracy ≈ 1e-15.
 * Source: Planck 1901; Goody & Yung 1989, Atmospheric Radiation, eq. (1.1), wavenumber form.
 *
 * @param wavenumberCm wavenumber ν̃, cm⁻¹, in [0, 1e5]
 * @param temperatureK temperature, K, in (0, 1e6]
 * @returns spectral radiance, W m⁻² sr⁻¹ (cm⁻¹)⁻¹
 */
export function planckRadianceWavenumber(wavenumberCm: number, temperatureK: number): number {
  assertWavenumber('wavenumberCm', wavenumberCm)
  assertTemperature(temperatureK)
  return planckKernel(wavenumberCm, temperatureK)
}

/**
 * Planck spectral radiance on a wavenumber grid, written into a caller-supplied array.
 *
 * Method: as `planckRadianceWavenumber`, element by element, without allocation.
 * Notes: each wavenumber is checked (finite, within [0, 1e5] cm⁻¹); `out` may not alias a
 * different-length array. Source: Goody & Yung 1989, eq. (1.1).
 *
 * @param wavenumberCm grid, cm⁻¹
 * @param temperatureK temperature, K
 * @param out output, W m⁻² sr⁻¹ (cm⁻¹)⁻¹, same length as the grid
 * @returns `out`
 */
export function planckRadianceOnGrid(
  wavenumberCm: Float64Array,
  temperatureK: number,
  out: Float64Array,
): Float64Array {
  assertTemperature(temperatureK)
  if (out.length !== wavenumberCm.length) {
    throw new PhysicsError('INVALID_ARGUMENT', 'out must have the same length as wavenumberCm', {
      gridLength: wavenumberCm.length,
      outLength: out.length,
    })
  }
  for (let i = 0; i < wavenumberCm.length; i++) {
    const nu = wavenumberCm[i]
    if (!(nu >= 0 && nu <= MAX_WAVENUMBER_CM)) assertWavenumber(`wavenumberCm[${i}]`, nu)
    out[i] = planckKernel(nu, temperatureK)
  }
  return out
}

/**
 * Temperature derivative of the Planck spectral radiance, dB/dT (for Jacobians).
 *
 * Method: dB/dT = (c₁L ν̃³/T) · x eˣ/(eˣ − 1)², x = c₂ν̃/T, evaluated as x e⁻ˣ/(1 − e⁻ˣ)² with
 * expm1 so that neither small nor large x loses precision or overflows.
 * Notes: Rayleigh–Jeans limit dB/dT → c₁L ν̃²/c₂ as x → 0. Relative accuracy ≈ 1e-15.
 * Source: derivative of Goody & Yung 1989, eq. (1.1).
 *
 * @param wavenumberCm wavenumber, cm⁻¹
 * @param temperatureK temperature, K
 * @returns dB/dT, W m⁻² sr⁻¹ (cm⁻¹)⁻¹ K⁻¹
 */
export function planckRadianceDerivativeWrtTemperature(
  wavenumberCm: number,
  temperatureK: number,
): number {
  assertWavenumber('wavenumberCm', wavenumberCm)
  assertTemperature(temperatureK)
  return planckDerivativeKernel(wavenumberCm, temperatureK)
}

/**
 * Brightness temperature: the temperature of a blackbody with the given spectral radiance.
 *
 * Method: T_b = c₂ν̃ / ln(1 + c₁L ν̃³/I), with log1p for accuracy when I ≫ c₁L ν̃³ (small x); when
 * c₁L ν̃³/I exceeds 1e15 the logarithm is taken as ln c₁L + 3 ln ν̃ − ln I to avoid overflow.
 * Notes: exact inverse of `planckRadianceWavenumber` to ≈1e-15 relative. Radiance must be > 0.
 * Source: inversion of Goody & Yung 1989, eq. (1.1).
 *
 * @param wavenumberCm wavenumber, cm⁻¹, > 0
 * @param radiance spectral radiance, W m⁻² sr⁻¹ (cm⁻¹)⁻¹, > 0
 * @returns brightness temperature, K
 */
export function brightnessTemperatureK(wavenumberCm: number, radiance: number): number {
  assertWavenumber('wavenumberCm', wavenumberCm)
  if (wavenumberCm === 0) {
    throw new PhysicsError('OUT_OF_RANGE', 'brightness temperature is undefined at 0 cm⁻¹', {
      name: 'wavenumberCm',
      value: wavenumberCm,
    })
  }
  if (!Number.isFinite(radiance) || radiance <= 0) {
    throw new PhysicsError('OUT_OF_RANGE', `radiance = ${radiance} must be finite and > 0`, {
      name: 'radiance',
      value: radiance,
    })
  }
  const ratio = (C1L_W_PER_M2_SR_CM4 * wavenumberCm ** 3) / radiance
  const logTerm =
    ratio < 1e15
      ? Math.log1p(ratio)
      : Math.log(C1L_W_PER_M2_SR_CM4) + 3 * Math.log(wavenumberCm) - Math.log(radiance)
  return (C2_CM_K * wavenumberCm) / logTerm
}

/**
 * Wavenumber of the maximum of B(ν̃, T) per unit wavenumber (Wien's displacement law).
 *
 * Method: ν̃_max = x T / c₂ with x = 2.821 439 372… the root of 3(1 − e⁻ˣ) = x, so
 * ν̃_max / T = 1.960 998 55 cm⁻¹ K⁻¹.
 * Notes: this is the peak per unit wavenumber (equivalently frequency), not the wavelength peak.
 * Source: CODATA 2018 Wien frequency displacement constant b′ = 5.878 925 757 × 10¹⁰ Hz K⁻¹,
 * which equals x k/h; Liou 2002, §1.2.
 *
 * @param temperatureK temperature, K
 * @returns peak wavenumber, cm⁻¹
 */
export function wienPeakWavenumberCm(temperatureK: number): number {
  assertTemperature(temperatureK)
  return (WIEN_X_WAVENUMBER * temperatureK) / C2_CM_K
}

/** x³/(eˣ − 1), with the removable singularity at 0 handled. */
function planckIntegrand(x: number): number {
  if (x === 0) return 0
  return (x * x * x) / Math.expm1(x)
}

/**
 * ∫ₓ^∞ t³/(eᵗ − 1) dt for x ≥ 0.
 * x ≥ 1: the convergent series Σₙ e⁻ⁿˣ (x³/n + 3x²/n² + 6x/n³ + 6/n⁴) (Widger & Woodall 1976),
 * summed until a term no longer changes the sum.
 * x < 1: π⁴/15 − ∫₀ˣ, with ∫₀ˣ t³/(eᵗ − 1) dt = Σ_k B_k x^{k+3}/((k+3) k!) from the Bernoulli
 * expansion (terms to B₂₀; the next term is < 1e-17 of the result for x < 1).
 */
function planckTailIntegral(x: number): number {
  if (x === Infinity) return 0
  if (x < SMALL_X_SWITCH) {
    const x2 = x * x
    let power = x2 * x2 * x // x⁵, for k = 2
    let head = (x2 * x) / 3 - (x2 * x2) / 8
    for (let k = 0; k < BERNOULLI_OVER_FACTORIAL.length; k++) {
      const order = 2 * k + 2
      head += (BERNOULLI_OVER_FACTORIAL[k] * power) / (order + 3)
      power *= x2
    }
    return PLANCK_INTEGRAL_TOTAL - head
  }
  const x2 = x * x
  const x3 = x2 * x
  let sum = 0
  for (let n = 1; n < 200; n++) {
    const inv = 1 / n
    const term = Math.exp(-n * x) * inv * (x3 + inv * (3 * x2 + inv * (6 * x + inv * 6)))
    const next = sum + term
    if (next === sum) break
    sum = next
  }
  return sum
}

/**
 * 8-point Gauss–Legendre of the Planck integrand over [mid − half, mid + half]. The half-width is
 * passed separately (computed from ν̃₂ − ν̃₁, exact in floating point for close edges) so that a
 * narrow band does not lose digits in x₂ − x₁.
 */
function planckIntegralGauss(mid: number, half: number): number {
  let sum = 0
  for (let i = 0; i < GL8_NODES.length; i++) {
    const d = half * GL8_NODES[i]
    sum += GL8_WEIGHTS[i] * (planckIntegrand(mid - d) + planckIntegrand(mid + d))
  }
  return sum * half
}

/**
 * Planck radiance integrated over a wavenumber band [ν̃₁, ν̃₂].
 *
 * Method: ∫ B dν̃ = c₁L (T/c₂)⁴ [F(x₁) − F(x₂)], x = c₂ν̃/T, with the tail integral
 * F(x) = ∫ₓ^∞ t³/(eᵗ − 1) dt = Σₙ e⁻ⁿˣ (x³/n + 3x²/n² + 6x/n³ + 6/n⁴) (Widger & Woodall 1976,
 * Bull. Amer. Meteor. Soc. 57, 1217–1219). Because that series converges slowly as x → 0, for
 * x < 1 F is computed as π⁴/15 minus the Bernoulli-number expansion of ∫₀ˣ. Narrow bands
 * (x₂ − x₁ < 0.5) are integrated directly with 8-point Gauss–Legendre (error < 1e-20 relative
 * since the integrand's nearest complex singularities are at ±2πi), avoiding cancellation.
 * Notes: ν̃₂ may be Infinity; [0, ∞) gives σT⁴/π. Relative accuracy ≈ 1e-14.
 * Source: Widger & Woodall 1976; total integral π⁴/15 (Stefan–Boltzmann law).
 *
 * @param nu1Cm lower band edge, cm⁻¹, ≥ 0
 * @param nu2Cm upper band edge, cm⁻¹, ≥ nu1Cm (may be Infinity)
 * @param temperatureK temperature, K
 * @returns band radiance, W m⁻² sr⁻¹
 */
export function planckBandIntegral(nu1Cm: number, nu2Cm: number, temperatureK: number): number {
  assertWavenumber('nu1Cm', nu1Cm)
  assertWavenumber('nu2Cm', nu2Cm, true)
  assertTemperature(temperatureK)
  if (nu2Cm < nu1Cm) {
    throw new PhysicsError('INVALID_ARGUMENT', `nu2Cm = ${nu2Cm} must be ≥ nu1Cm = ${nu1Cm}`, {
      nu1Cm,
      nu2Cm,
    })
  }
  const x1 = (C2_CM_K * nu1Cm) / temperatureK
  const x2 = (C2_CM_K * nu2Cm) / temperatureK
  const integral =
    x2 - x1 < NARROW_BAND_WIDTH_X
      ? planckIntegralGauss(
          (C2_CM_K * 0.5 * (nu1Cm + nu2Cm)) / temperatureK,
          (C2_CM_K * 0.5 * (nu2Cm - nu1Cm)) / temperatureK,
        )
      : planckTailIntegral(x1) - planckTailIntegral(x2)
  const scale = temperatureK / C2_CM_K
  return C1L_W_PER_M2_SR_CM4 * scale ** 4 * integral
}
