/**
 * Instrument line shapes (ILS) and the convolution of a high-resolution spectrum with them, for
 * comparison with measured spectra: boxcar and triangle slit functions (grating
 * spectrometers) and the line shape of a Fourier-transform spectrometer (FTS) with maximum
 * optical path difference L and an apodization function A(x), |x| ≤ L:
 *   ILS(ν) = ∫_{−L}^{L} A(x) cos(2πνx) dx, with A(0) = 1 so that ∫ ILS dν = 1.
 * Sources: Griffiths & de Haseth 2007, Fourier Transform Infrared Spectrometry, 2nd ed., ch. 2
 * (apodization, FWHM 1.207/(2L) of the unapodized sinc — from memory); Norton & Beer 1976,
 * J. Opt. Soc. Am. 66, 259 (erratum 1977, 67, 419) for the weak/medium/strong functions (from
 * memory); Happ & Genzel 1961, Infrared Phys. 1, 39 (from memory).
 */
import { PhysicsError } from '../errors'
import { gaussLegendreUnitInterval } from '../transfer/quadrature'

/** Apodization functions of an FTS. */
export type Apodization =
  | 'none'
  | 'triangle'
  | 'hamming'
  | 'happ-genzel'
  | 'norton-beer-weak'
  | 'norton-beer-medium'
  | 'norton-beer-strong'

/** An instrument line shape. */
export type InstrumentLineShape =
  | { kind: 'boxcar'; fullWidthCm: number }
  | { kind: 'triangle'; fwhmCm: number }
  | {
      kind: 'sinc'
      /** Maximum optical path difference L, cm (unapodized resolution 1/(2L) cm⁻¹). */
      maxPathDifferenceCm: number
      apodization?: Apodization
      /**
       * Half width of the truncated kernel, cm⁻¹ (default 64 × 1/(2L)); except for the triangle
       * apodization it is rounded to the nearest (2m + 1)/(4L) (see `instrumentLineShapeKernel`).
       */
      kernelHalfWidthCm?: number
    }

/** Default truncation of FTS kernels, in units of 1/(2L). */
const DEFAULT_SINC_HALF_WIDTH_RESOLUTIONS = 64

/**
 * Norton–Beer coefficients Cᵢ of A(u) = Σ Cᵢ (1 − u²)^i, u = x/L (Norton & Beer 1976 with the
 * 1977 erratum; from memory). Each set sums to 1 so that A(0) = 1.
 */
const NORTON_BEER: Readonly<Record<string, readonly number[]>> = {
  'norton-beer-weak': [0.384093, -0.087577, 0.703484],
  'norton-beer-medium': [0.152442, -0.136176, 0.983734],
  'norton-beer-strong': [0.045335, 0, 0.554883, 0, 0.399782],
}

/** Cosine-bell apodizations A = a + (1 − a) cos(πx/L). */
const COSINE_BELL_CONSTANT: Readonly<Record<string, number>> = {
  // Hamming: 0.54 + 0.46 cos(πx/L) (Hamming window, Blackman & Tukey 1958; from memory).
  hamming: 0.54,
  // Happ–Genzel: 0.552 + 0.448 cos(πx/L) as usually quoted (from memory; some texts use the
  // Hamming coefficients 0.54/0.46 under this name).
  'happ-genzel': 0.552,
}

const APODIZATIONS: readonly Apodization[] = [
  'none',
  'triangle',
  'hamming',
  'happ-genzel',
  'norton-beer-weak',
  'norton-beer-medium',
  'norton-beer-strong',
]

function assertApodization(apodization: string): asserts apodization is Apodization {
  if (!APODIZATIONS.includes(apodization as Apodization)) {
    throw new PhysicsError('INVALID_ARGUMENT', `unknown apodization ${apodization}`)
  }
}

function assertPositive(name: string, value: number): void {
  if (!(value > 0 && value < Infinity)) {
    throw new PhysicsError('OUT_OF_RANGE', `${name} = ${value} must be finite and > 0`, {
      name,
      value,
    })
  }
}

/** sin z / z with its limit 1 at z = 0 (series below |z| < 1e-4). */
function sinc(z: number): number {
  const a = Math.abs(z)
  if (a < 1e-4) return 1 - (z * z) / 6
  return Math.sin(z) / z
}

/**
 * Apodization function A(u) of an FTS at relative path difference u = x/L.
 *
 * Method: none: 1; triangle: 1 − |u|; Hamming: 0.54 + 0.46 cos(πu); Happ–Genzel:
 * 0.552 + 0.448 cos(πu); Norton–Beer: Σ Cᵢ (1 − u²)^i with the weak/medium/strong coefficients.
 * Notes: A(0) = 1; A = 0 for |u| > 1. Coefficients from memory (see module note).
 * Source: Norton & Beer 1976, J. Opt. Soc. Am. 66, 259; Griffiths & de Haseth 2007, ch. 2.
 *
 * @param apodization name of the function
 * @param relativePathDifference u = x/L, dimensionless
 * @returns A(u), dimensionless
 */
export function apodizationFunction(
  apodization: Apodization,
  relativePathDifference: number,
): number {
  assertApodization(apodization)
  const u = Math.abs(relativePathDifference)
  if (!Number.isFinite(u)) throw new PhysicsError('OUT_OF_RANGE', 'u must be finite')
  if (u > 1) return 0
  if (apodization === 'none') return 1
  if (apodization === 'triangle') return 1 - u
  const a = COSINE_BELL_CONSTANT[apodization]
  if (a !== undefined) return a + (1 - a) * Math.cos(Math.PI * u)
  const c = NORTON_BEER[apodization]
  const v = 1 - u * u
  let sum = 0
  let power = 1
  for (let i = 0; i < c.length; i++) {
    sum += c[i] * power
    power *= v
  }
  return sum
}

/**
 * FTS line shape by numerical cosine transform of the apodization function (any apodization).
 *
 * Method: ILS(ν) = 2L ∫₀¹ A(u) cos(2πνL u) du by composite 8-point Gauss–Legendre with panels of
 * width ≤ 2/(2πνL) rad⁻¹ (≥ 2 panels), i.e. ≤ 2 rad of phase per panel.
 * Notes: A is smooth on [0, 1] for every supported apodization, so the error is at rounding
 * level (≈1e-14 relative to the peak). Unit area over ν.
 * Source: Griffiths & de Haseth 2007, ch. 2 (ILS as the Fourier transform of A).
 *
 * @param offsetCm ν − ν₀, cm⁻¹
 * @param maxPathDifferenceCm L, cm
 * @param apodization apodization name
 * @returns ILS, cm (i.e. per cm⁻¹)
 */
export function ftsLineShapeByQuadrature(
  offsetCm: number,
  maxPathDifferenceCm: number,
  apodization: Apodization,
): number {
  assertPositive('maxPathDifferenceCm', maxPathDifferenceCm)
  assertApodization(apodization)
  if (!Number.isFinite(offsetCm)) throw new PhysicsError('OUT_OF_RANGE', 'offset must be finite')
  const gl = gaussLegendreUnitInterval(8)
  return ftsQuadrature(offsetCm, maxPathDifferenceCm, apodization, gl.nodes, gl.weights)
}

function ftsQuadrature(
  offsetCm: number,
  l: number,
  apodization: Apodization,
  nodes: Float64Array,
  weights: Float64Array,
): number {
  const k = 2 * Math.PI * Math.abs(offsetCm) * l
  const panels = Math.max(2, Math.ceil(k / 2))
  const h = 1 / panels
  let sum = 0
  for (let p = 0; p < panels; p++) {
    const u0 = p * h
    for (let i = 0; i < nodes.length; i++) {
      const u = u0 + h * nodes[i]
      sum += weights[i] * apodizationFunction(apodization, u) * Math.cos(k * u)
    }
  }
  return 2 * l * h * sum
}

/**
 * FTS instrument line shape at an offset from the line centre, closed form where one exists.
 *
 * Method (z = 2πνL): none: 2L sinc(z); triangle: L sinc²(z/2); cosine bell a + b cos(πx/L):
 * 2aL sinc(z) + bL[sinc(z + π) + sinc(z − π)]; Norton–Beer: numerical cosine transform
 * (`ftsLineShapeByQuadrature`).
 * Notes: unit area; FWHM 1.207/(2L) (none), 1.772/(2L) (triangle) — from memory, checked in
 * tests by root finding. sinc(z) = sin z / z.
 * Source: Griffiths & de Haseth 2007, Fourier Transform Infrared Spectrometry, ch. 2.
 *
 * @param offsetCm ν − ν₀, cm⁻¹
 * @param maxPathDifferenceCm L, cm
 * @param apodization apodization name (default 'none')
 * @returns ILS, cm (per cm⁻¹)
 */
export function ftsLineShape(
  offsetCm: number,
  maxPathDifferenceCm: number,
  apodization: Apodization = 'none',
): number {
  assertPositive('maxPathDifferenceCm', maxPathDifferenceCm)
  assertApodization(apodization)
  if (!Number.isFinite(offsetCm)) throw new PhysicsError('OUT_OF_RANGE', 'offset must be finite')
  const l = maxPathDifferenceCm
  const z = 2 * Math.PI * offsetCm * l
  if (apodization === 'none') return 2 * l * sinc(z)
  if (apodization === 'triangle') {
    const s = sinc(0.5 * z)
    return l * s * s
  }
  const a = COSINE_BELL_CONSTANT[apodization]
  if (a !== undefined) {
    return 2 * a * l * sinc(z) + (1 - a) * l * (sinc(z + Math.PI) + sinc(z - Math.PI))
  }
  return ftsLineShapeByQuadrature(offsetCm, l, apodization)
}

/** Half width of the support of a line shape, cm⁻¹. */
function kernelHalfWidthCm(ils: InstrumentLineShape): number {
  if (ils.kind === 'boxcar') {
    assertPositive('fullWidthCm', ils.fullWidthCm)
    return 0.5 * ils.fullWidthCm
  }
  if (ils.kind === 'triangle') {
    assertPositive('fwhmCm', ils.fwhmCm)
    return ils.fwhmCm
  }
  if (ils.kind === 'sinc') {
    const l = ils.maxPathDifferenceCm
    assertPositive('maxPathDifferenceCm', l)
    const requested = ils.kernelHalfWidthCm ?? DEFAULT_SINC_HALF_WIDTH_RESOLUTIONS / (2 * l)
    assertPositive('kernelHalfWidthCm', requested)
    if ((ils.apodization ?? 'none') === 'triangle') return requested
    // Apodizations with A(±L) ≠ 0 have sidelobes ∝ sin(2πνL)/ν; cutting where
    // cos(2πKL) = 0, i.e. K = (2m + 1)/(4L), makes the lost sidelobe area O(1/K²) instead of
    // O(1/K) (since ∫_K^∞ sin(2πνL)/ν dν ≈ cos(2πKL)/(2πKL)).
    const m = Math.max(1, Math.round((4 * l * requested - 1) / 2))
    return (2 * m + 1) / (4 * l)
  }
  throw new PhysicsError('INVALID_ARGUMENT', 'unknown instrument line shape', {
    kind: (ils as { kind: unknown }).kind,
  })
}

/**
 * Discrete, normalised kernel of an instrument line shape on a uniform grid.
 *
 * Method: samples at offsets jΔν, j = −m…m, m = ⌊w/Δν⌋ with w the support half width
 * (boxcar: W/2, value 1/W inside and half of it exactly at ±W/2; triangle: FWHM, value
 * (1 − |ν|/FWHM)/FWHM; sinc: `ftsLineShape`, truncated at ± kernelHalfWidthCm, rounded for
 * apodizations with A(±L) ≠ 0 to K = (2m + 1)/(4L) where cos(2πKL) = 0 so that the truncated
 * sidelobes carry only O(1/K²) of the area), then scales so that Σ kⱼ Δν = 1 (unit area, so a
 * constant spectrum is unchanged).
 * Notes: requires m ≥ 1 (support at least one grid step each side). Truncation changes the
 * peak by the relative area lost before renormalisation: ≈ 2/(π(2πKL)²) for the unapodized
 * sinc (2e-4 at the default K = 32/L), ≈ 1/(π²KL) for the triangle (3e-3 at the default).
 * Source: discretisation of the convolution integral (trapezoid rule); line shapes as in
 * `ftsLineShape`.
 *
 * @param ils the line shape
 * @param spacingCm grid spacing Δν, cm⁻¹
 * @returns kernel values, cm (per cm⁻¹), length 2m + 1, centre at index m
 */
export function instrumentLineShapeKernel(
  ils: InstrumentLineShape,
  spacingCm: number,
): Float64Array {
  assertPositive('spacingCm', spacingCm)
  const w = kernelHalfWidthCm(ils)
  const m = Math.floor(w / spacingCm + 1e-9)
  if (m < 1) {
    throw new PhysicsError('OUT_OF_RANGE', 'line shape is narrower than the grid spacing', {
      halfWidthCm: w,
      spacingCm,
    })
  }
  if (m > 5e6) throw new PhysicsError('OUT_OF_RANGE', 'kernel too long', { points: 2 * m + 1 })
  const kernel = new Float64Array(2 * m + 1)
  const gl = gaussLegendreUnitInterval(8)
  for (let j = -m; j <= m; j++) {
    const offset = j * spacingCm
    let v: number
    if (ils.kind === 'boxcar') {
      const edge = Math.abs(Math.abs(offset) - w) <= 1e-9 * spacingCm
      v = edge ? 0.5 / ils.fullWidthCm : Math.abs(offset) < w ? 1 / ils.fullWidthCm : 0
    } else if (ils.kind === 'triangle') {
      v = Math.max(0, 1 - Math.abs(offset) / ils.fwhmCm) / ils.fwhmCm
    } else {
      const apod = ils.apodization ?? 'none'
      assertApodization(apod)
      v = apod.startsWith('norton-beer')
        ? ftsQuadrature(offset, ils.maxPathDifferenceCm, apod, gl.nodes, gl.weights)
        : ftsLineShape(offset, ils.maxPathDifferenceCm, apod)
    }
    kernel[j + m] = v
  }
  let area = 0
  for (let i = 0; i < kernel.length; i++) area += kernel[i]
  area *= spacingCm
  if (!(area > 0)) throw new PhysicsError('OUT_OF_RANGE', 'kernel has no positive area')
  for (let i = 0; i < kernel.length; i++) kernel[i] /= area
  return kernel
}

/** Checks a grid is uniform and returns its spacing. */
function uniformSpacingCm(wavenumberCm: Float64Array): number {
  const n = wavenumberCm.length
  if (n < 2) throw new PhysicsError('INVALID_ARGUMENT', 'grid needs at least two points')
  const dv = (wavenumberCm[n - 1] - wavenumberCm[0]) / (n - 1)
  if (!(dv > 0 && Number.isFinite(dv))) {
    throw new PhysicsError('NOT_MONOTONIC', 'grid must be increasing and finite')
  }
  for (let i = 0; i < n; i++) {
    if (!(Math.abs(wavenumberCm[i] - (wavenumberCm[0] + i * dv)) <= 1e-6 * dv)) {
      throw new PhysicsError('INVALID_ARGUMENT', 'grid must be uniform (to 1e-6 of its step)', {
        index: i,
      })
    }
  }
  return dv
}

/**
 * Convolves a spectrum on a uniform grid with an instrument line shape and samples the result
 * on an output grid.
 *
 * Method: (S ∗ K)(νᵢ) = Σⱼ kⱼ S(νᵢ₋ⱼ) Δν with the normalised kernel of
 * `instrumentLineShapeKernel`, evaluated at the two input grid points bracketing each output
 * wavenumber and interpolated linearly between them.
 * Notes: the kernel support around every output point must lie inside the input grid, otherwise
 * OUT_OF_RANGE is thrown (no edge renormalisation). The interpolation error is ≈ Δν² S″/8, small
 * when Δν is much finer than the line shape. The kernel is built once per call.
 * Source: convolution integral discretised by the trapezoid rule; e.g. Griffiths & de Haseth
 * 2007, ch. 2.
 *
 * @param wavenumberCm uniform input grid, cm⁻¹
 * @param spectrum input spectrum (any unit)
 * @param ils the instrument line shape
 * @param outputWavenumberCm output wavenumbers, cm⁻¹
 * @param out convolved spectrum at the output wavenumbers (unit of `spectrum`)
 * @returns `out`
 */
export function convolveInstrumentLineShape(
  wavenumberCm: Float64Array,
  spectrum: Float64Array,
  ils: InstrumentLineShape,
  outputWavenumberCm: Float64Array,
  out: Float64Array,
): Float64Array {
  if (spectrum.length !== wavenumberCm.length || out.length !== outputWavenumberCm.length) {
    throw new PhysicsError('INVALID_ARGUMENT', 'array lengths do not match')
  }
  const dv = uniformSpacingCm(wavenumberCm)
  for (let i = 0; i < spectrum.length; i++) {
    if (!Number.isFinite(spectrum[i])) {
      throw new PhysicsError('OUT_OF_RANGE', 'spectrum must be finite', { index: i })
    }
  }
  const kernel = instrumentLineShapeKernel(ils, dv)
  const m = (kernel.length - 1) / 2
  const n = wavenumberCm.length
  const nu0 = wavenumberCm[0]
  const convolveAt = (i: number): number => {
    let sum = 0
    for (let j = -m; j <= m; j++) sum += kernel[j + m] * spectrum[i - j]
    return sum * dv
  }
  for (let o = 0; o < outputWavenumberCm.length; o++) {
    const s = (outputWavenumberCm[o] - nu0) / dv
    if (!Number.isFinite(s)) throw new PhysicsError('OUT_OF_RANGE', 'output wavenumber not finite')
    let i0 = Math.floor(s)
    let frac = s - i0
    if (frac > 1 - 1e-9) {
      i0 += 1
      frac = 0
    } else if (frac < 1e-9) {
      frac = 0
    }
    const iHigh = frac > 0 ? i0 + 1 : i0
    if (i0 - m < 0 || iHigh + m > n - 1) {
      throw new PhysicsError(
        'OUT_OF_RANGE',
        'the line shape around an output wavenumber extends beyond the input grid',
        { outputIndex: o, wavenumberCm: outputWavenumberCm[o], kernelHalfWidthCm: m * dv },
      )
    }
    const low = convolveAt(i0)
    out[o] = frac > 0 ? low + frac * (convolveAt(i0 + 1) - low) : low
  }
  return out
}
