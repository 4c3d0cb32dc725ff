import { describe, expect, it } from 'vitest'
import { C1L_W_PER_M2_SR_CM4, C2_CM_K } from '../../../../shared/physics/constants'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  createColumnTransferBlock,
  solveColumnTransfer,
  type ColumnTransferBlock,
  type ColumnTransferInput,
} from '../../../../shared/physics/transfer/column-transfer'
import { angleQuadrature } from '../../../../shared/physics/transfer/quadrature'
import { solveSchwarzschild } from '../../../../shared/physics/transfer/schwarzschild'
import { expectAbsClose, expectRelClose } from './expect-close'

/**
 * Local Planck function for the tests: B = c₁L ν³/(exp(c₂ν/T) − 1), Goody & Yung 1989 eq. (1.1),
 * CODATA 2018 constants.
 */
function planck(nuCm: number, tK: number): number {
  return (C1L_W_PER_M2_SR_CM4 * nuCm ** 3) / Math.expm1((C2_CM_K * nuCm) / tK)
}

/** Deterministic pseudo-random numbers in [0, 1) (Park & Miller 1988 minimal standard). */
function lehmer(seed: number): () => number {
  let state = seed
  return () => {
    state = (state * 16807) % 2147483647
    return (state - 1) / 2147483646
  }
}

/** Solves the whole grid in blocks and returns point-major copies of every output. */
function solveAll(input: ColumnTransferInput, blockSize: number) {
  const n = input.wavenumberCm.length
  const nLevels = input.layerOpticalDepth.length + 1
  const block: ColumnTransferBlock = createColumnTransferBlock(
    blockSize,
    nLevels,
    input.quadrature.mu.length,
  )
  const out = {
    fluxUp: new Float64Array(n * nLevels),
    fluxDown: new Float64Array(n * nLevels),
    toSpace: new Float64Array(n * nLevels),
    toa: new Float64Array(n),
    surface: new Float64Array(n),
  }
  for (let first = 0; first < n; first += blockSize) {
    const count = Math.min(blockSize, n - first)
    solveColumnTransfer(input, first, count, block)
    out.fluxUp.set(block.fluxUp.subarray(0, count * nLevels), first * nLevels)
    out.fluxDown.set(block.fluxDown.subarray(0, count * nLevels), first * nLevels)
    out.toSpace.set(block.transmittanceToSpace.subarray(0, count * nLevels), first * nLevels)
    out.toa.set(block.toaNadirRadiance.subarray(0, count), first)
    out.surface.set(block.surfaceZenithRadiance.subarray(0, count), first)
  }
  return out
}

/** A column of random layers: log-uniform τ over 1e-9 … 3e3, some exact zeros. */
function randomColumn(nLayers: number, n: number, seed: number): Float64Array[] {
  const random = lehmer(seed)
  return Array.from({ length: nLayers }, () =>
    Float64Array.from({ length: n }, () =>
      random() < 0.1 ? 0 : Math.exp(-20.7 + 28.7 * random()),
    ),
  )
}

const GL3 = angleQuadrature({ kind: 'gauss-legendre', nodes: 3 })

describe('solveColumnTransfer against the layer-by-layer solver', () => {
  const quadratures = {
    'Gauss–Legendre 3': GL3,
    diffusivity: angleQuadrature({ kind: 'diffusivity' }),
    'Gauss–Jacobi 4': angleQuadrature({ kind: 'gauss-jacobi', nodes: 4 }),
  }
  it.each([
    ['linear-in-tau', 'Gauss–Legendre 3', 1],
    ['isothermal', 'Gauss–Legendre 3', 0.9],
    ['linear-in-tau', 'diffusivity', 0.85],
    ['linear-in-tau', 'Gauss–Jacobi 4', 1],
  ] as const)(
    'when a random 30-layer column is solved (%s, %s, ε = %s), returns the same fluxes, radiances and transmittances (rel 1e-12)',
    (layerSource, quadratureName, emissivity) => {
      const quadrature = quadratures[quadratureName]
      // Reference: solveSchwarzschild (same equations, independent code path with Math.exp/expm1
      // and the planck module); both are exact for a source linear in τ (Toon et al. 1989).
      const n = 400
      const nu = Float64Array.from({ length: n }, (_, j) => 20 + 7.4 * j)
      const tau = randomColumn(30, n, 7)
      const levelT = Float64Array.from({ length: 31 }, (_, l) => 295 - 2.5 * l + 12 * Math.sin(l))
      const input: ColumnTransferInput = {
        wavenumberCm: nu,
        layerOpticalDepth: tau,
        levelTemperatureK: levelT,
        surfaceTemperatureK: 301,
        surfaceEmissivity: emissivity,
        quadrature,
        layerSource,
      }
      const reference = solveSchwarzschild({ ...input, viewingMu: [1] })
      const fast = solveAll(input, 64)
      for (let j = 0; j < n; j += 7) {
        for (let l = 0; l <= 30; l++) {
          const up = reference.fluxUpSpectral[l][j]
          expectRelClose(fast.fluxUp[j * 31 + l], up, 1e-12, `F↑ ν=${nu[j]} level ${l}`)
          // Downward flux can be ≈ 0 at the top: compare relative to the upward flux there.
          expectAbsClose(
            fast.fluxDown[j * 31 + l],
            reference.fluxDownSpectral[l][j],
            1e-12 * up,
            `F↓ ν=${nu[j]} level ${l}`,
          )
          let column = 0
          for (let k = l; k < 30; k++) column += tau[k][j]
          expectAbsClose(
            fast.toSpace[j * 31 + l],
            Math.exp(-column),
            1e-15,
            `T ν=${nu[j]} level ${l}`,
          )
        }
        expectRelClose(fast.toa[j], reference.toaRadianceUp[0][j], 1e-12, `I↑ top ν=${nu[j]}`)
        expectAbsClose(
          fast.surface[j],
          reference.surfaceRadianceDown[0][j],
          1e-12 * fast.toa[j],
          `I↓ surface ν=${nu[j]}`,
        )
      }
    },
  )

  it('when the grid is split into blocks of different sizes, returns bit-identical results', () => {
    const n = 250
    const input: ColumnTransferInput = {
      wavenumberCm: Float64Array.from({ length: n }, (_, j) => 500 + j),
      layerOpticalDepth: randomColumn(12, n, 99),
      levelTemperatureK: Float64Array.from({ length: 13 }, (_, l) => 290 - 5 * l),
      surfaceTemperatureK: 292,
      surfaceEmissivity: 0.95,
      quadrature: GL3,
    }
    const a = solveAll(input, 250)
    const b = solveAll(input, 17)
    expect(Array.from(b.fluxUp)).toEqual(Array.from(a.fluxUp))
    expect(Array.from(b.fluxDown)).toEqual(Array.from(a.fluxDown))
    expect(Array.from(b.toa)).toEqual(Array.from(a.toa))
  })
})

describe('solveColumnTransfer — analytic cases', () => {
  it('when column and black surface share one temperature, returns F↑ = πB at every level and I = B (rel 1e-14)', () => {
    // Isothermal enclosure: I = B everywhere whatever τ (Kirchhoff/Planck; Goody & Yung 1989 §2.2).
    const taus = [0, 1e-9, 1e-3, 0.049, 0.051, 0.3, 2, 50, 1e4]
    const nu = Float64Array.from(taus, (_, j) => 100 + 300 * j)
    const layers = Array.from({ length: 5 }, (_, l) =>
      Float64Array.from(taus, (_, j) => taus[(j + 2 * l) % taus.length]),
    )
    for (const layerSource of ['linear-in-tau', 'isothermal'] as const) {
      const out = solveAll(
        {
          wavenumberCm: nu,
          layerOpticalDepth: layers,
          levelTemperatureK: new Float64Array(6).fill(255),
          surfaceTemperatureK: 255,
          surfaceEmissivity: 1,
          quadrature: GL3,
          layerSource,
        },
        4,
      )
      for (let j = 0; j < nu.length; j++) {
        const b = planck(nu[j], 255)
        for (let l = 0; l < 6; l++) {
          expectRelClose(out.fluxUp[j * 6 + l], Math.PI * b, 1e-14, `${layerSource} ν=${nu[j]}`)
        }
        expectRelClose(out.toa[j], b, 1e-14, `${layerSource} I↑ ν=${nu[j]}`)
      }
    }
  })

  it('when one grey slab lies over a black surface, returns F↑_top = πΣwₐ[B_s e^{−τ/μₐ} + B(1 − e^{−τ/μₐ})] (rel 1e-13)', () => {
    // Analytic solution of dI/dτ = −I + B for constant B (Goody & Yung 1989, eq. 2.33).
    const taus = [1e-7, 0.02, 0.07, 0.6, 3, 30]
    const nu = Float64Array.from(taus, () => 700)
    const out = solveAll(
      {
        wavenumberCm: nu,
        layerOpticalDepth: [Float64Array.from(taus)],
        levelTemperatureK: [220, 220],
        surfaceTemperatureK: 300,
        surfaceEmissivity: 1,
        quadrature: GL3,
      },
      8,
    )
    const bSlab = planck(700, 220)
    const bSurface = planck(700, 300)
    taus.forEach((tau, j) => {
      let expected = 0
      for (let a = 0; a < GL3.mu.length; a++) {
        const t = Math.exp(-tau / GL3.mu[a])
        expected += Math.PI * GL3.fluxWeights[a] * (bSurface * t + bSlab * (1 - t))
      }
      expectRelClose(out.fluxUp[j * 2 + 1], expected, 1e-13, `τ = ${tau}`)
      expectRelClose(out.toa[j], bSurface * Math.exp(-tau) + bSlab * -Math.expm1(-tau), 1e-13)
    })
  })

  it('when the atmosphere is empty and ε = 0.7, returns F↑ = επB(T_s), F↓ = 0 and transmittance 1', () => {
    // Nothing absorbs or emits: the surface emits επB and nothing comes down to reflect.
    const nu = Float64Array.from([15, 667, 2400])
    const out = solveAll(
      {
        wavenumberCm: nu,
        layerOpticalDepth: [new Float64Array(3), new Float64Array(3)],
        levelTemperatureK: [280, 250, 220],
        surfaceTemperatureK: 295,
        surfaceEmissivity: 0.7,
        quadrature: GL3,
      },
      3,
    )
    for (let j = 0; j < 3; j++) {
      for (let l = 0; l < 3; l++) {
        expectRelClose(out.fluxUp[j * 3 + l], 0.7 * Math.PI * planck(nu[j], 295), 1e-14)
        expect(out.fluxDown[j * 3 + l]).toBe(0)
        expect(out.toSpace[j * 3 + l]).toBe(1)
      }
    }
  })
})

describe('solveColumnTransfer — invalid input', () => {
  const base = (): ColumnTransferInput => ({
    wavenumberCm: Float64Array.from([600, 700]),
    layerOpticalDepth: [Float64Array.from([0.1, 0.2])],
    levelTemperatureK: [280, 260],
    surfaceTemperatureK: 285,
    surfaceEmissivity: 1,
    quadrature: GL3,
  })
  const block = createColumnTransferBlock(2, 2, 3)

  it.each([
    ['a negative optical depth', { layerOpticalDepth: [Float64Array.from([0.1, -1e-3])] }],
    ['a NaN optical depth', { layerOpticalDepth: [Float64Array.from([NaN, 0.1])] }],
    ['an emissivity above 1', { surfaceEmissivity: 1.2 }],
    ['a level temperature of 0 K', { levelTemperatureK: [280, 0] }],
    ['one temperature too few', { levelTemperatureK: [280] }],
    ['a zero wavenumber', { wavenumberCm: Float64Array.from([0, 700]) }],
  ])('when given %s, throws PhysicsError', (_label, change) => {
    expect(() => solveColumnTransfer({ ...base(), ...change }, 0, 2, block)).toThrow(PhysicsError)
  })

  it('when the point range exceeds the block or the grid, throws PhysicsError', () => {
    expect(() => solveColumnTransfer(base(), 1, 2, block)).toThrow(PhysicsError)
    expect(() => solveColumnTransfer(base(), 0, 3, createColumnTransferBlock(4, 2, 3))).toThrow(
      PhysicsError,
    )
    expect(() => createColumnTransferBlock(0, 2, 3)).toThrow(PhysicsError)
  })
})
