import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  gridIndexRange,
  gridWavenumbersCm,
  planChunks,
} from '../../../../shared/physics/optics/spectral-grid'

describe('gridIndexRange', () => {
  it('when the bounds are grid points, includes both', () => {
    // Definition: points n·h with a ≤ n·h ≤ b (anchored grid, common practice).
    expect(gridIndexRange(1, 2, 0.25)).toEqual({ first: 4, last: 8 })
    expect(Array.from(gridWavenumbersCm({ first: 4, last: 8 }, 0.25))).toEqual([
      1, 1.25, 1.5, 1.75, 2,
    ])
  })

  it('when no grid point lies inside, returns an empty range', () => {
    const range = gridIndexRange(1.1, 1.2, 0.25)
    expect(range.first).toBeGreaterThan(range.last)
    expect(gridWavenumbersCm(range, 0.25).length).toBe(0)
  })

  it('when a/h or b/h rounds to the wrong side, keeps exactly the n·h inside [a, b]', () => {
    // Binary floating point (IEEE 754 double, checked in node): 0.9/0.3 = 3 but 3·0.3 =
    // 0.8999999999999999 < 0.9; (0.1 + 0.2)/0.1 = 3.0000000000000004 but 3·0.1 ≥ 0.1 + 0.2;
    // 1.7/0.1 = 17 but 17·0.1 = 1.7000000000000002 > 1.7; 4.3/0.1 = 42.99999999999999 but
    // 43·0.1 = 4.3.
    const cases: [number, number, number][] = [
      [0.9, 1.5, 0.3],
      [0.1 + 0.2, 1.7, 0.1],
      [4.3, 4.3, 0.1],
    ]
    for (const [a, b, h] of cases) {
      const { first, last } = gridIndexRange(a, b, h)
      expect(first * h, `first ${a} ${h}`).toBeGreaterThanOrEqual(a)
      expect((first - 1) * h, `first − 1 ${a} ${h}`).toBeLessThan(a)
      expect(last * h, `last ${b} ${h}`).toBeLessThanOrEqual(b)
      expect((last + 1) * h, `last + 1 ${b} ${h}`).toBeGreaterThan(b)
    }
    expect(gridIndexRange(0.9, 1.5, 0.3).first).toBe(4)
    expect(gridIndexRange(0.1 + 0.2, 1.7, 0.1)).toEqual({ first: 3, last: 16 })
    expect(gridIndexRange(4.3, 4.3, 0.1)).toEqual({ first: 43, last: 43 })
  })

  it('when the step is not positive, throws OUT_OF_RANGE', () => {
    expect(() => gridIndexRange(1, 2, 0)).toThrow(PhysicsError)
  })
})

describe('planChunks', () => {
  it('when the span is a multiple of the width, returns equal contiguous chunks', () => {
    expect(planChunks(500, 530, 10)).toEqual([
      { startCm: 500, endCm: 510 },
      { startCm: 510, endCm: 520 },
      { startCm: 520, endCm: 530 },
    ])
  })

  it('when the span is not a multiple, ends with a shorter chunk at exactly the end', () => {
    const chunks = planChunks(0.5, 1, 0.3)
    expect(chunks.length).toBe(2)
    expect(chunks[0]).toEqual({ startCm: 0.5, endCm: 0.8 })
    expect(chunks[1].startCm).toBe(chunks[0].endCm)
    expect(chunks[1].endCm).toBe(1)
  })

  it('when rounding leaves a sliver at the end, merges it into the last chunk', () => {
    // (0.1 + 0.2)/0.1 = 3.0000000000000004 in binary floating point → a naive ceil gives 4 chunks.
    const end = 0.1 + 0.2
    expect(Math.ceil(end / 0.1)).toBe(4)
    const chunks = planChunks(0, end, 0.1)
    expect(chunks.length).toBe(3)
    expect(chunks[2].endCm).toBe(end)
  })

  it('when the bounds or width are invalid, throws', () => {
    expect(() => planChunks(10, 10, 1)).toThrow(PhysicsError)
    expect(() => planChunks(10, 5, 1)).toThrow(PhysicsError)
    expect(() => planChunks(0, 10, 0)).toThrow(PhysicsError)
  })
})
