import { describe, expect, it } from 'vitest'
import {
  apodizationFunction,
  convolveInstrumentLineShape,
  ftsLineShape,
  ftsLineShapeByQuadrature,
  instrumentLineShapeKernel,
} from '../../../../shared/physics/diagnostics/instrument-line-shape'
import type {
  Apodization,
  InstrumentLineShape,
} from '../../../../shared/physics/diagnostics/instrument-line-shape'
import { PhysicsError } from '../../../../shared/physics/errors'
import fixture from '../fixtures/transfer-reference.json'
import { expectAbsClose, expectRelClose } from '../transfer/expect-close'

const APODIZATIONS: Apodization[] = [
  'none',
  'triangle',
  'hamming',
  'happ-genzel',
  'norton-beer-weak',
  'norton-beer-medium',
  'norton-beer-strong',
]

/** FWHM of a centred, single-peaked kernel sampled at spacing dv (linear interpolation). */
function kernelFwhm(k: Float64Array, dv: number): number {
  const m = (k.length - 1) / 2
  const half = k[m] / 2
  let j = m
  while (k[j] > half) j++
  const x = j - 1 + (k[j - 1] - half) / (k[j - 1] - k[j])
  return 2 * (x - m) * dv
}

/** Composite Simpson integral of f on [a, b] with 2n panels (independent of the code). */
function simpson(f: (x: number) => number, a: number, b: number, n: number): number {
  const h = (b - a) / (2 * n)
  let s = f(a) + f(b)
  for (let i = 1; i < 2 * n; i++) s += (i % 2 ? 4 : 2) * f(a + i * h)
  return (s * h) / 3
}

describe('apodizationFunction', () => {
  it('when u = 0, returns 1 for every apodization; when |u| > 1, returns 0', () => {
    // Normalisation A(0) = 1 (Norton & Beer 1976: coefficients of each set sum to 1 — from memory).
    for (const a of APODIZATIONS) {
      expectRelClose(apodizationFunction(a, 0), 1, 1e-15, a)
      expect(apodizationFunction(a, 1.01)).toBe(0)
    }
    expect(apodizationFunction('triangle', 0.25)).toBe(0.75)
    expectRelClose(apodizationFunction('hamming', 1), 0.08, 1e-14) // 0.54 − 0.46 (from memory)
  })
})

describe('ftsLineShape', () => {
  it('when a closed form exists, agrees with the numerical cosine transform (abs 1e-12 of 2L)', () => {
    // Two independent evaluations of ∫A(x)cos(2πνx)dx (Griffiths & de Haseth 2007, ch. 2).
    const l = 2.5
    for (const a of ['none', 'triangle', 'hamming', 'happ-genzel'] as const) {
      for (const nu of [0, 0.013, 0.1, 0.2, 0.2000001, 0.77, 3.3]) {
        expectAbsClose(
          ftsLineShape(nu, l, a),
          ftsLineShapeByQuadrature(nu, l, a),
          1e-12 * 2 * l,
          `${a} ν=${nu}`,
        )
      }
    }
  })

  it('when the apodization is Norton–Beer, matches mpmath quadrature of the cosine transform (rel 1e-12)', () => {
    // mpmath 1.2.1 quad of 2∫₀¹A(u)cos(2πνu)du, L = 1 cm (fixture transfer-reference.json).
    expect(fixture.nortonBeerLineShape).toHaveLength(15)
    for (const row of fixture.nortonBeerLineShape) {
      const v = ftsLineShape(row.offsetCm, row.maxPathDifferenceCm, row.apodization as Apodization)
      expectAbsClose(v, row.value, 1e-12 * 2, `${row.apodization} ν=${row.offsetCm}`)
    }
  })

  it('when integrated over ν, has unit area (rel 1e-6; Norton–Beer 3e-5)', () => {
    // ∫ILS dν = A(0) = 1 (Fourier inversion; Griffiths & de Haseth 2007, ch. 2). Every
    // apodization here except the triangle has A(±L) ≠ 0, so its ILS has sin(2πνL)/ν tails;
    // cutting at K = (2m + 1)/(4L) (cos 2πKL = 0) leaves O(1/K²) (≈3e-7 at K = 250.25, ≈2e-5
    // at 40.25 for the costlier numerical Norton–Beer shapes). The triangle's sinc² tail is
    // 1/(π²KL) + O(K⁻³) and is added back.
    const l = 1
    for (const a of APODIZATIONS) {
      const nortonBeer = a.startsWith('norton-beer')
      const k = a === 'triangle' ? 200 : nortonBeer ? 40.25 : 250.25
      const tail = a === 'triangle' ? 1 / (Math.PI ** 2 * k * l) : 0
      const area = simpson((v) => ftsLineShape(v, l, a), -k, k, nortonBeer ? 8000 : 100000) + tail
      expectRelClose(area, 1, nortonBeer ? 3e-5 : 1e-6, a)
    }
  })
})

describe('instrumentLineShapeKernel and convolution', () => {
  const shapes: InstrumentLineShape[] = [
    { kind: 'boxcar', fullWidthCm: 0.5 },
    { kind: 'triangle', fwhmCm: 0.5 },
    ...APODIZATIONS.map((a) => ({ kind: 'sinc' as const, maxPathDifferenceCm: 2, apodization: a })),
  ]

  it('when built on a grid, every kernel has unit area (Σk·Δν = 1, rel 1e-14) and is symmetric', () => {
    for (const ils of shapes) {
      const k = instrumentLineShapeKernel(ils, 0.01)
      let area = 0
      for (const v of k) area += v * 0.01
      expectRelClose(area, 1, 1e-14, JSON.stringify(ils))
      for (let i = 0; i < k.length; i++) expect(k[i]).toBe(k[k.length - 1 - i])
    }
  })

  it('when a monochromatic line is convolved with the unapodized sinc, returns FWHM 1.2067/(2L) (rel 1e-4)', () => {
    // FWHM of 2L sinc(2πνL): 1.207/(2L) (Griffiths & de Haseth 2007, from memory); exact
    // 1.2067091288/(2L) from mpmath root of sin u/u = 1/2 (fixture). Triangle: 1.7718/(2L).
    const l = 1
    const dv = 0.0005
    const n = 25001
    const nu = Float64Array.from({ length: n }, (_, i) => 994 + i * dv)
    const centre = 12500
    const line = new Float64Array(n)
    line[centre] = 1 / dv // unit-area line
    for (const [apod, expected] of [
      ['none', fixture.ftsFwhmInUnitsOfOneOver2L.none],
      ['triangle', fixture.ftsFwhmInUnitsOfOneOver2L.triangle],
    ] as const) {
      const out = convolveInstrumentLineShape(
        nu,
        line,
        { kind: 'sinc', maxPathDifferenceCm: l, apodization: apod, kernelHalfWidthCm: 4 },
        nu.subarray(centre - 1500, centre + 1501),
        new Float64Array(3001),
      )
      expectRelClose(kernelFwhm(out, dv), expected / (2 * l), 1e-4, apod)
      // Peak ≈ ILS(0) (2L or L) up to the truncated area (K = 4.25: 9e-4 for the sinc, 2.4e-2
      // for the triangle's sinc², see instrumentLineShapeKernel).
      expectRelClose(
        out[1500],
        apod === 'none' ? 2 * l : l,
        apod === 'none' ? 2e-3 : 3e-2,
        `${apod} peak`,
      )
    }
  })

  it('when Norton–Beer weak/medium/strong are used, returns FWHM 1.2/1.4/1.6 × the unapodized (rel 1e-3)', () => {
    // Norton & Beer 1976 designed the three functions for these broadening factors (from memory).
    const dv = 0.0005
    const base = kernelFwhm(
      instrumentLineShapeKernel({ kind: 'sinc', maxPathDifferenceCm: 1, kernelHalfWidthCm: 3 }, dv),
      dv,
    )
    for (const [a, factor] of [
      ['norton-beer-weak', 1.2],
      ['norton-beer-medium', 1.4],
      ['norton-beer-strong', 1.6],
    ] as const) {
      const k = instrumentLineShapeKernel(
        { kind: 'sinc', maxPathDifferenceCm: 1, apodization: a, kernelHalfWidthCm: 3 },
        dv,
      )
      expectRelClose(kernelFwhm(k, dv) / base, factor, 1e-3, a)
    }
  })

  it('when the spectrum is linear in ν, returns it unchanged at off-grid output points (rel 1e-13)', () => {
    // A symmetric unit-area kernel maps a + bν to itself; linear interpolation is exact for it.
    const nu = Float64Array.from({ length: 4001 }, (_, i) => 600 + i * 0.01)
    const s = nu.map((v) => 3 + 0.002 * v)
    const outNu = Float64Array.of(618.123, 620, 621.3456)
    for (const ils of shapes) {
      const out = convolveInstrumentLineShape(nu, s, ils, outNu, new Float64Array(3))
      outNu.forEach((v, i) => expectRelClose(out[i], 3 + 0.002 * v, 1e-13, JSON.stringify(ils)))
    }
  })

  it('when a boxcar of width W convolves a unit line, returns height 1/W over the width', () => {
    const dv = 0.01
    const nu = Float64Array.from({ length: 401 }, (_, i) => i * dv)
    const line = new Float64Array(401)
    line[200] = 1 / dv
    const out = convolveInstrumentLineShape(
      nu,
      line,
      { kind: 'boxcar', fullWidthCm: 0.5 },
      nu.subarray(100, 301),
      new Float64Array(201),
    )
    expectRelClose(out[100], 1 / 0.5, 1e-12, 'centre') // 1/W (discrete area 1: 24 full + 2 half points)
    expect(out[100 + 26]).toBe(0)
  })

  it('when the kernel reaches beyond the input grid or the grid is not uniform, throws PhysicsError', () => {
    const nu = Float64Array.from({ length: 101 }, (_, i) => 700 + i * 0.01)
    const s = new Float64Array(101).fill(1)
    const ils: InstrumentLineShape = { kind: 'triangle', fwhmCm: 0.2 }
    expect(() =>
      convolveInstrumentLineShape(nu, s, ils, Float64Array.of(700.1), new Float64Array(1)),
    ).toThrow(PhysicsError)
    const bent = nu.slice()
    bent[50] += 0.003
    expect(() =>
      convolveInstrumentLineShape(bent, s, ils, Float64Array.of(700.5), new Float64Array(1)),
    ).toThrow(PhysicsError)
    expect(() => instrumentLineShapeKernel({ kind: 'boxcar', fullWidthCm: 0.01 }, 0.01)).toThrow(
      PhysicsError,
    )
  })
})
