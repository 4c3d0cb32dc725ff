/**
 * The Faddeeva (complex error) function w(z) = exp(−z²) erfc(−iz) in the closed upper half plane,
 * z = x + iy with y ≥ 0, and its real part K(x, y) (the Voigt function).
 *
 * Two published algorithms:
 * - Humlíček 1982 four-region rational approximation ("W4"), fast, used in the hot loop.
 * - Weideman 1994 rational series in Z = (L + iz)/(L − iz) with N = 40 terms, plus a five-term
 *   asymptotic series for |x| + y ≥ 50; the accurate version.
 * Both are evaluated in real arithmetic (no complex objects inside the kernels).
 *
 * Accuracy, measured against scipy.special.wofz (1.10.1) on the 1332-point grid of
 * tests/unit/physics/fixtures/faddeeva.json (x from −20 to 1e4, y = 0 and 1e-8 … 1e4; generator
 * scripts/fixtures/faddeeva.py), asserted by tests/unit/physics/spectroscopy/faddeeva.test.ts:
 *
 * | quantity                         | Humlíček (fast) | Weideman N = 40 (accurate) |
 * |----------------------------------|-----------------|----------------------------|
 * | max |w − w_ref|/|w_ref|, all      | 4.3e-5          | 1.4e-14                    |
 * | max |K − K_ref|/K_ref, y ≥ 1e-6   | 7.7e-5          | 4.6e-9                     |
 * | max |K − K_ref|/K_ref, y ≥ 1e-4   | 7.7e-5          | 4.9e-11                    |
 * | max |K − K_ref|/K_ref, y ≥ 1e-2   | 7.7e-5          | 6.4e-13                    |
 *
 * Near the real axis (y ≪ 1, |x| ≳ 3) K is many orders smaller than |w|, so its relative error
 * grows like (error of w)·|w|/K; the absolute error stays below the |w| figures above.
 */
import { PhysicsError } from '../errors'

/** A complex number as a plain object. */
export interface Complex {
  re: number
  im: number
}

/** 1/√π. */
const INV_SQRT_PI = 0.5641895835477563

/** Bound on |w_Humlíček − w_ref|/|w_ref| over the fixture grid (measured 4.3e-5). */
export const HUMLICEK_MAX_RELATIVE_ERROR = 5e-5
/**
 * Bound on |K_Humlíček − K_ref|/K_ref over the fixture points with y ≥ 1e-6 (measured 7.7e-5).
 * For y < 1e-6 and |x| ≥ 5.5 the approximation drops the exp(−x²) core, which is below 1e-13.
 */
export const HUMLICEK_MAX_RELATIVE_ERROR_K = 1e-4
/** Bound on |w_Weideman − w_ref|/|w_ref| over the fixture grid (measured 1.4e-14). */
export const WEIDEMAN_MAX_RELATIVE_ERROR = 3e-14
/** Bound on |K_Weideman − K_ref|/K_ref over the fixture points with y ≥ 1e-6 (measured 4.6e-9). */
export const WEIDEMAN_MAX_RELATIVE_ERROR_K = 1e-8

/** Number of terms of the Weideman series. */
export const WEIDEMAN_TERMS = 40

/** Beyond this |x| + y the Humlíček path uses the asymptotic series (avoids overflow of t²). */
const HUMLICEK_ASYMPTOTIC_THRESHOLD = 1e6
/**
 * Beyond this |x| + y (so |z| ≥ 35) the accurate path uses the asymptotic series (relative error
 * about 1e-14); its real part has no cancellation, which keeps K accurate in the far wings.
 */
const WEIDEMAN_ASYMPTOTIC_THRESHOLD = 50

function checkArguments(x: number, y: number): void {
  if (!Number.isFinite(x) || !Number.isFinite(y) || y < 0) {
    throw new PhysicsError(
      'OUT_OF_RANGE',
      `Faddeeva function needs finite x and finite y ≥ 0 (got x = ${x}, y = ${y})`,
      { x, y },
    )
  }
}

/**
 * Real (imaginary = false) or imaginary part of the asymptotic series
 * w(z) ≈ (1/√π)(1/t)(1 − 1/(2t²) + 3/(4t⁴) − 15/(8t⁶) + 105/(16t⁸)), t = −iz = y − ix, i.e.
 * i/(√π z) Σ (2k−1)!!/(2z²)^k for k = 0…4 (Abramowitz & Stegun 7.1.23, from memory).
 * The relative truncation error is about 945/(32|z|¹⁰) (1e-14 at |z| = 35). Uses Smith's division so that nothing
 * overflows for |z| up to the largest double.
 */
function asymptoticPart(x: number, y: number, imaginary: boolean): number {
  // a = 1/t with t = y − ix, by Smith's algorithm.
  let ar: number
  let ai: number
  if (Math.abs(y) >= Math.abs(x)) {
    const r = -x / y
    const d = y - x * r
    ar = 1 / d
    ai = -r / d
  } else {
    const r = y / -x
    const d = y * r - x
    ar = r / d
    ai = -1 / d
  }
  // s = a², series factor f = 1 + s(−1/2 + s(3/4 + s(−15/8 + 105/16 s))) by Horner's rule.
  const sr = ar * ar - ai * ai
  const si = 2 * ar * ai
  let fr = 6.5625 * sr - 1.875
  let fi = 6.5625 * si
  let tmp = sr * fr - si * fi + 0.75
  fi = sr * fi + si * fr
  fr = tmp
  tmp = sr * fr - si * fi - 0.5
  fi = sr * fi + si * fr
  fr = tmp
  tmp = sr * fr - si * fi + 1
  fi = sr * fi + si * fr
  fr = tmp
  return imaginary ? INV_SQRT_PI * (ar * fi + ai * fr) : INV_SQRT_PI * (ar * fr - ai * fi)
}

/**
 * One part of the Humlíček 1982 W4 approximation. Arguments are not checked (x finite, y ≥ 0).
 */
function humlicekPart(x: number, y: number, imaginary: boolean): number {
  const ax = Math.abs(x)
  const s = ax + y
  if (s >= HUMLICEK_ASYMPTOTIC_THRESHOLD) return asymptoticPart(x, y, imaginary)
  // t = y − ix
  const tr = y
  const ti = -x
  let nr: number
  let ni: number
  let dr: number
  let di: number
  if (s >= 15) {
    // Region I: w = t/√π / (1/2 + t²)
    nr = 0.5641896 * tr
    ni = 0.5641896 * ti
    dr = 0.5 + tr * tr - ti * ti
    di = 2 * tr * ti
  } else if (s >= 5.5) {
    // Region II: w = t (1.410474 + 0.5641896 u) / (0.75 + u (3 + u)), u = t²
    const ur = tr * tr - ti * ti
    const ui = 2 * tr * ti
    const pr = 1.410474 + 0.5641896 * ur
    const pi = 0.5641896 * ui
    nr = tr * pr - ti * pi
    ni = tr * pi + ti * pr
    const qr = 3 + ur
    const qi = ui
    dr = 0.75 + ur * qr - ui * qi
    di = ur * qi + ui * qr
  } else if (y >= 0.195 * ax - 0.176) {
    // Region III: ratio of a quartic and a quintic in t.
    let ar = 0.5642236
    let ai = 0
    let tmp: number
    tmp = 3.778987 + tr * ar - ti * ai
    ai = tr * ai + ti * ar
    ar = tmp
    tmp = 11.96482 + tr * ar - ti * ai
    ai = tr * ai + ti * ar
    ar = tmp
    tmp = 20.20933 + tr * ar - ti * ai
    ai = tr * ai + ti * ar
    ar = tmp
    tmp = 16.4955 + tr * ar - ti * ai
    ai = tr * ai + ti * ar
    ar = tmp
    nr = ar
    ni = ai
    let br = 1
    let bi = 0
    tmp = 6.699398 + tr * br - ti * bi
    bi = tr * bi + ti * br
    br = tmp
    tmp = 21.69274 + tr * br - ti * bi
    bi = tr * bi + ti * br
    br = tmp
    tmp = 39.27121 + tr * br - ti * bi
    bi = tr * bi + ti * br
    br = tmp
    tmp = 38.82363 + tr * br - ti * bi
    bi = tr * bi + ti * br
    br = tmp
    tmp = 16.4955 + tr * br - ti * bi
    bi = tr * bi + ti * br
    br = tmp
    dr = br
    di = bi
  } else {
    // Region IV: w = exp(u) − t P(u)/Q(u), u = t², polynomials of degree 6 and 7.
    const ur = tr * tr - ti * ti
    const ui = 2 * tr * ti
    let ar = 0.56419
    let ai = 0
    let tmp: number
    tmp = 1.320522 - (ur * ar - ui * ai)
    ai = -(ur * ai + ui * ar)
    ar = tmp
    tmp = 35.76683 - (ur * ar - ui * ai)
    ai = -(ur * ai + ui * ar)
    ar = tmp
    tmp = 219.0313 - (ur * ar - ui * ai)
    ai = -(ur * ai + ui * ar)
    ar = tmp
    tmp = 1540.787 - (ur * ar - ui * ai)
    ai = -(ur * ai + ui * ar)
    ar = tmp
    tmp = 3321.9905 - (ur * ar - ui * ai)
    ai = -(ur * ai + ui * ar)
    ar = tmp
    tmp = 36183.31 - (ur * ar - ui * ai)
    ai = -(ur * ai + ui * ar)
    ar = tmp
    // numerator t·P(u)
    const pr = tr * ar - ti * ai
    const pi = tr * ai + ti * ar
    let br = 1
    let bi = 0
    tmp = 1.841439 - (ur * br - ui * bi)
    bi = -(ur * bi + ui * br)
    br = tmp
    tmp = 61.57037 - (ur * br - ui * bi)
    bi = -(ur * bi + ui * br)
    br = tmp
    tmp = 364.2191 - (ur * br - ui * bi)
    bi = -(ur * bi + ui * br)
    br = tmp
    tmp = 2186.181 - (ur * br - ui * bi)
    bi = -(ur * bi + ui * br)
    br = tmp
    tmp = 9022.228 - (ur * br - ui * bi)
    bi = -(ur * bi + ui * br)
    br = tmp
    tmp = 24322.84 - (ur * br - ui * bi)
    bi = -(ur * bi + ui * br)
    br = tmp
    tmp = 32066.6 - (ur * br - ui * bi)
    bi = -(ur * bi + ui * br)
    br = tmp
    const den = br * br + bi * bi
    const eu = Math.exp(ur)
    if (imaginary) {
      return eu * Math.sin(ui) - (pi * br - pr * bi) / den
    }
    return eu * Math.cos(ui) - (pr * br + pi * bi) / den
  }
  const den = dr * dr + di * di
  return imaginary ? (ni * dr - nr * di) / den : (nr * dr + ni * di) / den
}

/**
 * Coefficients a_0 … a_{N−1} of the Weideman 1994 series for a given N, with L = √(N/√2),
 * M = 2N: a_n = (1/2M) Σ_{k=−M+1}^{M−1} f(t_k) cos(π k n/M), f(t) = exp(−t²)(L² + t²),
 * t_k = L tan(kπ/2M) (the discrete cosine transform of Weideman 1994, written out; from memory).
 */
function weidemanCoefficients(n: number): { coefficients: Float64Array; l: number } {
  const m = 2 * n
  const l = Math.sqrt(n / Math.SQRT2)
  const f = new Float64Array(2 * m)
  for (let k = -m + 1; k <= m - 1; k++) {
    const t = l * Math.tan((k * Math.PI) / (2 * m))
    f[k + m] = Math.exp(-t * t) * (l * l + t * t)
  }
  const coefficients = new Float64Array(n)
  for (let j = 1; j <= n; j++) {
    let sum = 0
    for (let k = -m + 1; k <= m - 1; k++) sum += f[k + m] * Math.cos((Math.PI * k * j) / m)
    coefficients[j - 1] = sum / (2 * m)
  }
  return { coefficients, l }
}

const WEIDEMAN = weidemanCoefficients(WEIDEMAN_TERMS)

/**
 * One part of the Weideman 1994 approximation. Arguments are not checked (x finite, y ≥ 0).
 */
function weidemanPart(x: number, y: number, imaginary: boolean): number {
  if (Math.abs(x) + y >= WEIDEMAN_ASYMPTOTIC_THRESHOLD) return asymptoticPart(x, y, imaginary)
  const a = WEIDEMAN.coefficients
  const l = WEIDEMAN.l
  // q = 1/(L − iz) = 1/((L + y) − ix), Smith's division (L + y > 0).
  const cr = l + y
  const ci = -x
  let qr: number
  let qi: number
  if (Math.abs(cr) >= Math.abs(ci)) {
    const r = ci / cr
    const d = cr + ci * r
    qr = 1 / d
    qi = -r / d
  } else {
    const r = cr / ci
    const d = cr * r + ci
    qr = r / d
    qi = -1 / d
  }
  // Z = (L + iz)/(L − iz) = 2Lq − 1
  const zr = 2 * l * qr - 1
  const zi = 2 * l * qi
  // p(Z) = Σ a_n Z^n by Horner's rule
  let pr = a[a.length - 1]
  let pi = 0
  for (let n = a.length - 2; n >= 0; n--) {
    const tmp = pr * zr - pi * zi + a[n]
    pi = pr * zi + pi * zr
    pr = tmp
  }
  // w = q (2 p q + 1/√π)
  const sr = 2 * (pr * qr - pi * qi) + INV_SQRT_PI
  const si = 2 * (pr * qi + pi * qr)
  return imaginary ? qr * si + qi * sr : qr * sr - qi * si
}

/**
 * Voigt function K(x, y) = Re w(x + iy), fast version for hot loops; arguments NOT checked.
 *
 * Method: Humlíček 1982 W4 four-region rational approximation (see `faddeevaHumlicek`).
 * Notes: the caller guarantees finite x and finite y ≥ 0 (validate once at the loop boundary).
 * Relative error ≤ HUMLICEK_MAX_RELATIVE_ERROR_K for y ≥ 1e-6 (measured against scipy).
 * Units: dimensionless.
 * Source: J. Humlíček, JQSRT 27, 437–444 (1982), regions I–IV.
 */
export function voigtKUnchecked(x: number, y: number): number {
  return humlicekPart(x, y, false)
}

/**
 * Voigt function K(x, y) = Re w(x + iy), fast version.
 *
 * Method: Humlíček 1982 W4 rational approximation in t = y − ix: region I (|x| + y ≥ 15) one-pole
 * continued fraction, region II (|x| + y ≥ 5.5) two-pole, region III (y ≥ 0.195|x| − 0.176)
 * quartic/quintic in t, region IV exp(t²) − t·P(t²)/Q(t²); |x| + y ≥ 1e6 asymptotic series.
 * Notes: relative error ≤ HUMLICEK_MAX_RELATIVE_ERROR_K (≈1e-4) for y ≥ 1e-6, measured against
 * scipy.special.wofz; K(−x, y) = K(x, y). For y → 0 and |x| ≥ 5.5 the exp(−x²) Gauss core is
 * dropped (absolute error < 1e-13). Units: dimensionless.
 * Source: J. Humlíček, JQSRT 27, 437–444 (1982).
 * @param x dimensionless distance from line centre, √ln2 (ν − ν₀)/α_D
 * @param y dimensionless Lorentz-to-Doppler ratio, √ln2 α_L/α_D, ≥ 0
 */
export function voigtK(x: number, y: number): number {
  checkArguments(x, y)
  return humlicekPart(x, y, false)
}

/**
 * Voigt function K(x, y) = Re w(x + iy), accurate version.
 *
 * Method: Weideman 1994 rational series, N = 40 (see `faddeeva`).
 * Notes: relative error ≤ WEIDEMAN_MAX_RELATIVE_ERROR_K for y ≥ 1e-6, measured against
 * scipy.special.wofz. About 3–4× the cost of `voigtK` (informal timing). Units: dimensionless.
 * Source: J.A.C. Weideman, SIAM J. Numer. Anal. 31, 1497–1518 (1994), the rational series
 * with N terms (from memory).
 */
export function voigtKAccurate(x: number, y: number): number {
  checkArguments(x, y)
  return weidemanPart(x, y, false)
}

/** Unchecked accurate K(x, y); the caller guarantees finite x and finite y ≥ 0. */
export function voigtKAccurateUnchecked(x: number, y: number): number {
  return weidemanPart(x, y, false)
}

/**
 * Faddeeva function w(x + iy) = exp(−z²) erfc(−iz), fast approximation.
 *
 * Method: Humlíček 1982 W4 (see `voigtK`); Im w is L(x, y), odd in x.
 * Notes: |w − w_ref|/|w_ref| ≤ HUMLICEK_MAX_RELATIVE_ERROR over the fixture grid.
 * Units: dimensionless. Source: J. Humlíček, JQSRT 27, 437–444 (1982).
 * @param x real part of z, finite
 * @param y imaginary part of z, finite and ≥ 0
 */
export function faddeevaHumlicek(x: number, y: number): Complex {
  checkArguments(x, y)
  return { re: humlicekPart(x, y, false), im: humlicekPart(x, y, true) }
}

/**
 * Faddeeva function w(x + iy) = exp(−z²) erfc(−iz), accurate version.
 *
 * Method: Weideman 1994: with L = √(N/√2), Z = (L + iz)/(L − iz),
 * w(z) ≈ 2 Σ_{n<N} a_n Zⁿ / (L − iz)² + (1/√π)/(L − iz), N = 40, where a_n are the cosine
 * coefficients of f(t) = exp(−t²)(L² + t²), t = L tan(θ/2), computed once at module load.
 * For |x| + y ≥ 50: the asymptotic series i/(√π z) Σ_{k≤4} (2k−1)!!/(2z²)^k.
 * Notes: |w − w_ref|/|w_ref| ≤ WEIDEMAN_MAX_RELATIVE_ERROR over the fixture grid
 * (w_ref = scipy.special.wofz). Valid for y ≥ 0 only. Units: dimensionless.
 * Source: J.A.C. Weideman, "Computation of the complex error function",
 * SIAM J. Numer. Anal. 31, 1497–1518 (1994), the rational series in Z (from memory).
 * @param x real part of z, finite
 * @param y imaginary part of z, finite and ≥ 0
 */
export function faddeeva(x: number, y: number): Complex {
  checkArguments(x, y)
  return { re: weidemanPart(x, y, false), im: weidemanPart(x, y, true) }
}
