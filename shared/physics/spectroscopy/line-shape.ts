/**
 * Area-normalised line profiles per cm⁻¹ (∫ f dν = 1) and line-wing cutoff.
 *
 * Wing cutoff: beyond |ν − ν₀| > cutoff the profile is set to zero (the far wing is left to a
 * continuum term). Two variants, both common practice:
 * - plain truncation: f(Δν) for |Δν| ≤ cutoff, 0 beyond (a step of height f(cutoff) at the cutoff);
 * - pedestal subtraction: f(Δν) − f(cutoff) for |Δν| ≤ cutoff, 0 beyond (continuous at the
 *   cutoff; the removed "pedestal" f(cutoff) under the whole line is usually part of a continuum
 *   model built with the same convention).
 * Neither variant renormalises the area; `truncatedLorentzArea` gives the area that remains.
 */
import { assertFiniteInRange } from '../errors'
import { voigtKAccurateUnchecked, voigtKUnchecked } from './faddeeva'

const SQRT_LN2 = Math.sqrt(Math.LN2)
/** √(ln2/π) */
const SQRT_LN2_OVER_PI = Math.sqrt(Math.LN2 / Math.PI)

/** Line-wing cutoff settings. */
export interface LineWingCutoff {
  /** Distance from the line centre beyond which the profile is zero, cm⁻¹ (> 0). */
  cutoffCm: number
  /** Subtract the profile value at the cutoff inside the cutoff (continuous at the edge). */
  subtractPedestal: boolean
}

function checkWidth(name: string, value: number, allowZero: boolean): void {
  assertFiniteInRange(name, value, allowZero ? 0 : Number.MIN_VALUE, Infinity)
}

function checkCutoff(wing: LineWingCutoff): void {
  assertFiniteInRange('cutoffCm', wing.cutoffCm, Number.MIN_VALUE, Infinity)
}

/**
 * Lorentz profile.
 *
 * Method: f_L(Δν) = (γ/π) / (Δν² + γ²).
 * Notes: collisional (impact) line shape; ∫ f_L dΔν = 1 over the whole real line.
 * Units: Δν, γ cm⁻¹; result cm (per cm⁻¹).
 * Source: Goody & Yung 1989, Atmospheric Radiation, 2nd ed., ch. 3, Lorentz profile (from memory).
 * @param offsetCm Δν = ν − ν₀, cm⁻¹
 * @param lorentzHalfWidthCm γ (HWHM), cm⁻¹ (> 0)
 */
export function lorentzProfile(offsetCm: number, lorentzHalfWidthCm: number): number {
  assertFiniteInRange('offsetCm', offsetCm, -Infinity, Infinity)
  checkWidth('lorentzHalfWidthCm', lorentzHalfWidthCm, false)
  return (
    lorentzHalfWidthCm / Math.PI / (offsetCm * offsetCm + lorentzHalfWidthCm * lorentzHalfWidthCm)
  )
}

/**
 * Doppler (Gaussian) profile.
 *
 * Method: f_D(Δν) = √(ln2/π)/α_D · exp(−ln2 Δν²/α_D²).
 * Notes: Maxwellian velocity distribution; ∫ f_D dΔν = 1. Units: Δν, α_D cm⁻¹; result cm.
 * Source: Goody & Yung 1989, Atmospheric Radiation, 2nd ed., ch. 3, Doppler profile (from memory).
 * @param offsetCm Δν = ν − ν₀, cm⁻¹
 * @param dopplerHalfWidthCm α_D (HWHM), cm⁻¹ (> 0)
 */
export function dopplerProfile(offsetCm: number, dopplerHalfWidthCm: number): number {
  assertFiniteInRange('offsetCm', offsetCm, -Infinity, Infinity)
  checkWidth('dopplerHalfWidthCm', dopplerHalfWidthCm, false)
  const x = offsetCm / dopplerHalfWidthCm
  return (SQRT_LN2_OVER_PI / dopplerHalfWidthCm) * Math.exp(-Math.LN2 * x * x)
}

/**
 * Voigt profile (convolution of the Lorentz and Doppler profiles), fast version.
 *
 * Method: f_V(Δν) = K(x, y) √(ln2/π)/α_D with x = √ln2 Δν/α_D, y = √ln2 γ/α_D and K = Re w from
 * the Humlíček 1982 approximation (`voigtK`).
 * Notes: relative error ≤ HUMLICEK_MAX_RELATIVE_ERROR_K (1e-4) for y ≥ 1e-6 (see faddeeva.ts).
 * γ = 0 gives the Doppler profile; for α_D → 0 it tends to the Lorentz profile (α_D must be > 0;
 * use `lorentzProfile` when there is no Doppler broadening). Units: cm⁻¹ in, cm out.
 * Source: Armstrong 1967, JQSRT 7, 61 (Voigt profile via K(x, y), from memory); Humlíček 1982,
 * JQSRT 27, 437.
 * @param offsetCm Δν = ν − ν₀, cm⁻¹
 * @param dopplerHalfWidthCm α_D, cm⁻¹ (> 0)
 * @param lorentzHalfWidthCm γ, cm⁻¹ (≥ 0)
 */
export function voigtProfile(
  offsetCm: number,
  dopplerHalfWidthCm: number,
  lorentzHalfWidthCm: number,
): number {
  assertFiniteInRange('offsetCm', offsetCm, -Infinity, Infinity)
  checkWidth('dopplerHalfWidthCm', dopplerHalfWidthCm, false)
  checkWidth('lorentzHalfWidthCm', lorentzHalfWidthCm, true)
  const scale = SQRT_LN2 / dopplerHalfWidthCm
  return (
    voigtKUnchecked(offsetCm * scale, lorentzHalfWidthCm * scale) *
    (SQRT_LN2_OVER_PI / dopplerHalfWidthCm)
  )
}

/**
 * Voigt profile, accurate version (Weideman 1994 K, relative error ≤ 1e-8 for y ≥ 1e-6).
 *
 * Method, notes and units as `voigtProfile`; K from `voigtKAccurate`.
 * Source: Weideman 1994, SIAM J. Numer. Anal. 31, 1497.
 */
export function voigtProfileAccurate(
  offsetCm: number,
  dopplerHalfWidthCm: number,
  lorentzHalfWidthCm: number,
): number {
  assertFiniteInRange('offsetCm', offsetCm, -Infinity, Infinity)
  checkWidth('dopplerHalfWidthCm', dopplerHalfWidthCm, false)
  checkWidth('lorentzHalfWidthCm', lorentzHalfWidthCm, true)
  const scale = SQRT_LN2 / dopplerHalfWidthCm
  return (
    voigtKAccurateUnchecked(offsetCm * scale, lorentzHalfWidthCm * scale) *
    (SQRT_LN2_OVER_PI / dopplerHalfWidthCm)
  )
}

/**
 * Lorentz profile with a line-wing cutoff (see the module comment for the two variants).
 *
 * Method: f(Δν) = f_L(Δν) − [pedestal ? f_L(c) : 0] for |Δν| ≤ c, 0 for |Δν| > c.
 * Notes: area = `truncatedLorentzArea(γ, wing)` < 1. Units: cm⁻¹ in, cm out.
 * Source: common practice.
 */
export function truncatedLorentzProfile(
  offsetCm: number,
  lorentzHalfWidthCm: number,
  wing: LineWingCutoff,
): number {
  checkCutoff(wing)
  const value = lorentzProfile(offsetCm, lorentzHalfWidthCm)
  if (Math.abs(offsetCm) > wing.cutoffCm) return 0
  return wing.subtractPedestal ? value - lorentzProfile(wing.cutoffCm, lorentzHalfWidthCm) : value
}

/**
 * Voigt profile (fast version) with a line-wing cutoff (see the module comment).
 *
 * Method: f(Δν) = f_V(Δν) − [pedestal ? f_V(c) : 0] for |Δν| ≤ c, 0 for |Δν| > c.
 * Notes: the area lost is, for c ≫ α_D, close to that of the Lorentz profile
 * (`truncatedLorentzArea`). Units: cm⁻¹ in, cm out. Source: common practice.
 */
export function truncatedVoigtProfile(
  offsetCm: number,
  dopplerHalfWidthCm: number,
  lorentzHalfWidthCm: number,
  wing: LineWingCutoff,
): number {
  checkCutoff(wing)
  const value = voigtProfile(offsetCm, dopplerHalfWidthCm, lorentzHalfWidthCm)
  if (Math.abs(offsetCm) > wing.cutoffCm) return 0
  return wing.subtractPedestal
    ? value - voigtProfile(wing.cutoffCm, dopplerHalfWidthCm, lorentzHalfWidthCm)
    : value
}

/**
 * Area of the truncated Lorentz profile.
 *
 * Method: ∫_{−c}^{c} f_L = (2/π) atan(c/γ); with pedestal subtraction minus 2c f_L(c).
 * Notes: the lost area of plain truncation is ≈ 2γ/(πc) for c ≫ γ; with the pedestal removed
 * it is ≈ 4γ/(πc). Dimensionless. Source: elementary integral (common practice).
 */
export function truncatedLorentzArea(lorentzHalfWidthCm: number, wing: LineWingCutoff): number {
  checkWidth('lorentzHalfWidthCm', lorentzHalfWidthCm, false)
  checkCutoff(wing)
  const c = wing.cutoffCm
  const inner = (2 / Math.PI) * Math.atan(c / lorentzHalfWidthCm)
  return wing.subtractPedestal ? inner - 2 * c * lorentzProfile(c, lorentzHalfWidthCm) : inner
}

/**
 * Adds one line, `areaScale` × truncated Voigt profile (fast version), onto a uniform grid.
 *
 * Method: out[i] += areaScale · f(ν_i − ν₀), ν_i = gridStartCm + i·gridStepCm, for the grid
 * points with |ν_i − ν₀| ≤ cutoff (f as `truncatedVoigtProfile`).
 * Notes: arguments validated once; no allocation. With areaScale = S·u (intensity × column) the
 * added quantity is the optical depth. Units: grid cm⁻¹; out in areaScale × cm.
 * Source: common practice.
 * @param out grid values to add to
 * @param gridStartCm wavenumber of out[0], cm⁻¹
 * @param gridStepCm grid spacing, cm⁻¹ (> 0)
 * @param centreCm line centre ν₀, cm⁻¹
 * @param areaScale factor applied to the unit-area profile (finite)
 * @param dopplerHalfWidthCm α_D, cm⁻¹ (> 0)
 * @param lorentzHalfWidthCm γ, cm⁻¹ (≥ 0)
 * @param wing cutoff settings
 */
export function addVoigtLineToGrid(
  out: Float64Array,
  gridStartCm: number,
  gridStepCm: number,
  centreCm: number,
  areaScale: number,
  dopplerHalfWidthCm: number,
  lorentzHalfWidthCm: number,
  wing: LineWingCutoff,
): void {
  assertFiniteInRange('gridStartCm', gridStartCm, -Infinity, Infinity)
  assertFiniteInRange('gridStepCm', gridStepCm, Number.MIN_VALUE, Infinity)
  assertFiniteInRange('centreCm', centreCm, -Infinity, Infinity)
  assertFiniteInRange('areaScale', areaScale, -Infinity, Infinity)
  checkWidth('dopplerHalfWidthCm', dopplerHalfWidthCm, false)
  checkWidth('lorentzHalfWidthCm', lorentzHalfWidthCm, true)
  checkCutoff(wing)
  const cutoff = wing.cutoffCm
  const first = Math.max(0, Math.ceil((centreCm - cutoff - gridStartCm) / gridStepCm))
  const last = Math.min(out.length - 1, Math.floor((centreCm + cutoff - gridStartCm) / gridStepCm))
  if (first > last) return
  const scale = SQRT_LN2 / dopplerHalfWidthCm
  const y = lorentzHalfWidthCm * scale
  const amplitude = (areaScale * SQRT_LN2_OVER_PI) / dopplerHalfWidthCm
  const pedestal = wing.subtractPedestal ? voigtKUnchecked(cutoff * scale, y) : 0
  for (let i = first; i <= last; i++) {
    const offset = gridStartCm + i * gridStepCm - centreCm
    // Rounding can put an end point a hair beyond the cutoff; keep the strict definition.
    if (Math.abs(offset) > cutoff) continue
    out[i] += amplitude * (voigtKUnchecked(offset * scale, y) - pedestal)
  }
}
