import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  planAdaptiveGrid,
  requiredStepCm,
  type AdaptiveGridParameters,
  type GridRequirements,
} from '../../../../shared/physics/optics/adaptive-grid'

function requirements(
  lines: [centre: number, halfWidth: number, spread: number][],
): GridRequirements {
  return {
    count: lines.length,
    centreCm: Float64Array.from(lines, (l) => l[0]),
    halfWidthCm: Float64Array.from(lines, (l) => l[1]),
    spreadCm: Float64Array.from(lines, (l) => l[2]),
  }
}

const PARAMETERS: AdaptiveGridParameters = {
  startCm: 660,
  endCm: 670,
  coarseStepCm: 1 / 16,
  minStepCm: 2 ** -20,
  pointsPerHalfWidth: 2,
  gradingHalfWidths: 6,
}

/** min over lines of the required step at ν (see requiredStepCm). */
function required(req: GridRequirements, nu: number, p: AdaptiveGridParameters): number {
  let s = Infinity
  for (let i = 0; i < req.count; i++) {
    s = Math.min(
      s,
      requiredStepCm(
        nu - req.centreCm[i],
        req.halfWidthCm[i],
        req.spreadCm[i],
        p.pointsPerHalfWidth,
        p.gradingHalfWidths,
      ),
    )
  }
  return s
}

describe('planAdaptiveGrid', () => {
  it('when no line asks for refinement, returns the coarse grid a + m·h_c including both ends', () => {
    const grid = planAdaptiveGrid(requirements([]), PARAMETERS)
    expect(grid.refinementLevels).toBe(0)
    expect(grid.wavenumberCm.length).toBe(161)
    expect(grid.wavenumberCm[0]).toBe(660)
    expect(grid.wavenumberCm[160]).toBe(670)
    expect(grid.wavenumberCm[17]).toBe(660 + 17 / 16)
  })

  it('when lines are narrow, keeps every spacing within the required step s(d) = max(α, (d − δ)/R)/P', () => {
    // Construction property (adaptive-grid.ts): outside region j + 1 the required step is ≥ h_j.
    const req = requirements([
      [664.1234, 5e-4, 0],
      [664.131, 2e-3, 1e-4],
      [667.5, 3e-5, 0],
      [669.99, 8e-4, 0],
    ])
    const grid = planAdaptiveGrid(req, PARAMETERS)
    const nu = grid.wavenumberCm
    let checked = 0
    for (let i = 0; i + 1 < nu.length; i++) {
      const h = nu[i + 1] - nu[i]
      expect(h, `interval at ${nu[i]}`).toBeLessThanOrEqual(
        required(req, nu[i], PARAMETERS) * (1 + 1e-12),
      )
      expect(h).toBeLessThanOrEqual(required(req, nu[i + 1], PARAMETERS) * (1 + 1e-12))
      checked++
    }
    expect(checked).toBe(nu.length - 1)
    // The finest step resolves the narrowest line with P = 2 … 4 points per half width.
    expect(grid.baseStepCm).toBeLessThanOrEqual(3e-5 / 2)
    expect(grid.baseStepCm).toBeGreaterThan(3e-5 / 4)
  })

  it('when lines are narrow, keeps every coarse node, so each bin edge of the chunk is a grid point', () => {
    const grid = planAdaptiveGrid(requirements([[662.5, 1e-4, 0]]), PARAMETERS)
    const set = new Set(Array.from(grid.wavenumberCm))
    for (let m = 0; m <= 160; m++) expect(set.has(660 + m / 16), `node ${m}`).toBe(true)
    for (let i = 1; i < grid.nodeIndex.length; i++) {
      expect(grid.nodeIndex[i]).toBeGreaterThan(grid.nodeIndex[i - 1])
      expect(Number.isInteger(grid.nodeIndex[i])).toBe(true)
    }
  })

  it('when one narrow line sits in the chunk, adds about 4RP + 2RP per level points, not a uniform fine grid', () => {
    // Points per line (module comment): ≈ 4RP at the finest level plus ≈ 2RP per coarser level.
    const grid = planAdaptiveGrid(requirements([[665.01, 1e-4, 0]]), PARAMETERS)
    const added = grid.wavenumberCm.length - 161
    const levels = grid.refinementLevels
    // Finest level: the largest j with α < 2P·h_c/2^j, i.e. 2^j < 4·(1/16)/1e-4 = 2500 → j = 11
    // (h₀ = 2⁻¹⁵ cm⁻¹ ≈ 3.1e-5, between α/(2P) and α/P).
    expect(levels).toBe(11)
    const perLine = 4 * 6 * 2 + 2 * 6 * 2 * levels
    expect(added, `added ${added}, estimate ${perLine}`).toBeLessThanOrEqual(1.25 * perLine)
    expect(added).toBeGreaterThan(0.75 * perLine)
  })

  it('when the chunk is not a whole number of coarse steps or a parameter is invalid, throws PhysicsError', () => {
    const none = requirements([])
    expect(() => planAdaptiveGrid(none, { ...PARAMETERS, endCm: 670.01 })).toThrow(PhysicsError)
    expect(() => planAdaptiveGrid(none, { ...PARAMETERS, pointsPerHalfWidth: 0.5 })).toThrow(
      PhysicsError,
    )
    expect(() => planAdaptiveGrid(requirements([[665, 0, 0]]), PARAMETERS)).toThrow(PhysicsError)
    expect(() => planAdaptiveGrid(requirements([[665, 1e-3, -1]]), PARAMETERS)).toThrow(
      PhysicsError,
    )
  })
})
