import { describe, expect, it } from 'vitest'
import {
  indexWindow,
  minMaxDownsample,
  pointsForWindow,
  valueExtent,
  type XYPoints,
} from '@/components/charts/downsample'

/** A non-uniform grid like the engine's: fine near `centres`, coarse between. */
function adaptiveGrid(startCm: number, endCm: number, centres: number[]): number[] {
  const x: number[] = []
  let w = startCm
  while (w <= endCm) {
    x.push(w)
    const distance = Math.min(...centres.map((c) => Math.abs(w - c)))
    w += Math.min(0.02, 0.0002 + distance * 0.01)
  }
  return x
}

/** Lorentz-shaped dips (absorption lines) on a flat 290 K background. */
function lineSpectrum(x: number[], centres: number[]): number[] {
  return x.map((w) => 290 - centres.reduce((sum, c) => sum + 70 / (1 + ((w - c) / 0.002) ** 2), 0))
}

const isAscending = (a: Float64Array) => a.every((v, i) => i === 0 || v >= a[i - 1])
const finite = (a: Float64Array) => Array.from(a).filter((v) => !Number.isNaN(v))

describe('minMaxDownsample', () => {
  it('when the input fits in two points per bucket, returns it unchanged', () => {
    const x = [1, 2, 3, 4, 5, 6]
    const y = [5, 4, 3, 2, 1, 0]
    const out = minMaxDownsample(x, y, 3)
    expect(Array.from(out.x)).toEqual(x)
    expect(Array.from(out.y)).toEqual(y)
  })

  it('when 500 000 points are reduced to 2000 buckets, returns at most 4002 points in ascending x from end to end', () => {
    const n = 500_000
    const x = Array.from({ length: n }, (_, i) => 600 + i * 1e-4 + 1e-9 * i * i)
    const y = x.map((w) => Math.sin(w * 37) + Math.sin(w * 911))
    const out = minMaxDownsample(x, y, 2000)
    expect(out.x.length).toBeLessThanOrEqual(4002)
    expect(out.x.length).toBeGreaterThan(3000)
    expect(out.x.length).toBe(out.y.length)
    expect(isAscending(out.x)).toBe(true)
    expect(out.x[0]).toBe(x[0])
    expect(out.x[out.x.length - 1]).toBe(x[n - 1])
  })

  it('when narrow lines sit on a non-uniform grid, keeps the bottom of every line and the background level', () => {
    const centres = [662.3137, 667.0012, 667.8, 671.25]
    const x = adaptiveGrid(660, 675, centres)
    const y = lineSpectrum(x, centres)
    expect(x.length).toBeGreaterThan(2000)
    const out = minMaxDownsample(x, y, 300)
    expect(out.x.length).toBeLessThanOrEqual(602)
    for (const c of centres) {
      const exact = Math.min(...y.filter((_, i) => Math.abs(x[i] - c) < 0.01))
      const kept = Math.min(...finite(out.y).filter((_, i) => Math.abs(out.x[i] - c) < 0.01))
      expect(kept, `line at ${c} cm⁻¹`).toBe(exact)
    }
    expect(Math.max(...finite(out.y))).toBe(Math.max(...y))
    expect(isAscending(out.x)).toBe(true)
  })

  it('when values are missing, keeps a gap marker (NaN) where they were, one per run of nulls', () => {
    const n = 10_000
    const x = Array.from({ length: n }, (_, i) => i)
    const y: (number | null)[] = x.map((i) => (i >= 4000 && i < 6000 ? null : Math.cos(i / 50)))
    const out = minMaxDownsample(x, y, 100)
    const gaps = Array.from(out.y.keys()).filter((i) => Number.isNaN(out.y[i]))
    expect(gaps).toHaveLength(1)
    expect(out.x[gaps[0]]).toBe(4000)
    // Nothing is drawn inside the gap.
    expect(
      Array.from(out.x).filter((w, i) => w > 4000 && w < 6000 && !Number.isNaN(out.y[i])),
    ).toEqual([])
    expect(out.x.length).toBeLessThanOrEqual(302)
    expect(isAscending(out.x)).toBe(true)
  })

  it('when every value is missing, returns a single gap marker', () => {
    const x = Array.from({ length: 1000 }, (_, i) => i)
    const out = minMaxDownsample(
      x,
      x.map(() => null),
      10,
    )
    expect(out.x.length).toBe(1)
    expect(out.y[0]).toBeNaN()
  })

  it('when some points have no wavenumber, leaves them out', () => {
    const x: (number | null)[] = Array.from({ length: 100 }, (_, i) => (i % 10 === 0 ? null : i))
    const y = Array.from({ length: 100 }, (_, i) => i)
    const out = minMaxDownsample(x, y, 10)
    expect(out.x.every((v) => Number.isFinite(v))).toBe(true)
    expect(isAscending(out.x)).toBe(true)
  })
})

describe('indexWindow', () => {
  it('when asked for [startX, endX], returns the points inside plus one neighbour on each side', () => {
    const x = [1, 2, 3, 4, 5, 6, 7]
    expect(indexWindow(x, 2.5, 4.5)).toEqual({ from: 1, to: 5 })
    expect(indexWindow(x, 0, 100)).toEqual({ from: 0, to: 7 })
    expect(indexWindow(x, 3, 3)).toEqual({ from: 1, to: 4 })
  })
})

describe('pointsForWindow', () => {
  const n = 200_000
  const x = Array.from({ length: n }, (_, i) => 600 + i * 5e-4)
  const y = x.map((w) => Math.sin(w * 50))
  const budget = { fullResolutionMaxPoints: 6000, bucketCount: 2000 }
  const context = minMaxDownsample(x, y, 600)

  it('when the window holds few enough points, draws every one of them', () => {
    const out = pointsForWindow(x, y, 650, 651, budget)
    const inside = x.filter((w) => w >= 650 && w <= 651)
    expect(out.x.length).toBe(inside.length + 2)
    expect(Array.from(out.x.subarray(1, -1))).toEqual(inside)
  })

  it('when the window holds too many points, reduces them to the bucket budget', () => {
    const out = pointsForWindow(x, y, 610, 690, budget)
    expect(out.x.length).toBeLessThanOrEqual(2 * budget.bucketCount + 2)
  })

  it('when given the overview, puts it around the window in ascending x within the drawing budget', () => {
    const out: XYPoints = pointsForWindow(x, y, 650, 651, budget, context)
    expect(isAscending(out.x)).toBe(true)
    expect(out.x[0]).toBe(600)
    expect(out.x[out.x.length - 1]).toBe(x[n - 1])
    expect(out.x.length).toBeLessThanOrEqual(budget.fullResolutionMaxPoints + context.x.length)
  })
})

describe('valueExtent', () => {
  it('when points lie outside the window or are missing, ignores them; positiveOnly drops ≤ 0', () => {
    const points = {
      x: Float64Array.from([1, 2, 3, 4, 5]),
      y: Float64Array.from([100, -2, NaN, 7, -100]),
    }
    expect(valueExtent(points, 2, 4)).toEqual([-2, 7])
    expect(valueExtent(points, 2, 4, true)).toEqual([7, 7])
    expect(valueExtent(points, 2.5, 2.9)).toBeNull()
  })
})
