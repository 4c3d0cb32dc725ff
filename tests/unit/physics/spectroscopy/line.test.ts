import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  createLineTable,
  lowerBoundIndex,
  sliceLineTableByWavenumber,
  toLineTable,
  validateLineTable,
  type SpectralLine,
} from '../../../../shared/physics/spectroscopy/line'

function line(wavenumberCm: number, overrides: Partial<SpectralLine> = {}): SpectralLine {
  return {
    moleculeId: 2,
    isotopologueId: 1,
    wavenumberCm,
    intensityCmPerMolecule: wavenumberCm * 1e-22,
    einsteinAPerS: 0.5,
    airHalfWidthCmPerAtm: 0.07,
    selfHalfWidthCmPerAtm: 0.09,
    lowerStateEnergyCm: 10,
    temperatureExponentAir: 0.7,
    pressureShiftCmPerAtm: -0.001,
    ...overrides,
  }
}

describe('toLineTable', () => {
  it('when lines are unsorted, returns columns sorted by wavenumber with their source index', () => {
    const lines = [line(700), line(600, { moleculeId: 1 }), line(650, { isotopologueId: 3 })]
    const table = toLineTable(lines)
    expect(table.length).toBe(3)
    expect(Array.from(table.wavenumberCm)).toEqual([600, 650, 700])
    expect(Array.from(table.sourceIndex)).toEqual([1, 2, 0])
    expect(Array.from(table.moleculeId)).toEqual([1, 2, 2])
    expect(Array.from(table.isotopologueId)).toEqual([1, 3, 1])
    expect(table.intensityCmPerMolecule[0]).toBe(600 * 1e-22)
    expect(table.pressureShiftCmPerAtm[2]).toBe(-0.001)
  })

  it('when two lines share a wavenumber, keeps their input order', () => {
    const table = toLineTable([
      line(700, { lowerStateEnergyCm: 1 }),
      line(700, { lowerStateEnergyCm: 2 }),
    ])
    expect(Array.from(table.lowerStateEnergyCm)).toEqual([1, 2])
  })

  it('when a line is invalid, throws with the line index', () => {
    expect(() => toLineTable([line(700), line(-1, { intensityCmPerMolecule: 1e-20 })])).toThrow(
      /line 1: wavenumberCm/,
    )
    expect(() => toLineTable([line(700, { intensityCmPerMolecule: Number.NaN })])).toThrow(
      PhysicsError,
    )
    expect(() => toLineTable([line(700, { isotopologueId: 0 })])).toThrow(/isotopologueId/)
    expect(() => toLineTable([line(700, { lowerStateEnergyCm: -1 })])).toThrow(/lowerStateEnergyCm/)
  })
})

describe('lowerBoundIndex and sliceLineTableByWavenumber', () => {
  const table = toLineTable([600, 610, 610, 620, 630, 640].map((nu) => line(nu)))

  it('when searching, returns the first row with ν ≥ the target', () => {
    expect(lowerBoundIndex(table, 0)).toBe(0)
    expect(lowerBoundIndex(table, 610)).toBe(1)
    expect(lowerBoundIndex(table, 610.0001)).toBe(3)
    expect(lowerBoundIndex(table, 640)).toBe(5)
    expect(lowerBoundIndex(table, 641)).toBe(6)
  })

  it('when slicing [610, 630), returns the rows inside the half-open range as views', () => {
    const slice = sliceLineTableByWavenumber(table, 610, 630)
    expect(slice.start).toBe(1)
    expect(slice.length).toBe(3)
    expect(Array.from(slice.wavenumberCm)).toEqual([610, 610, 620])
    expect(slice.wavenumberCm.buffer).toBe(table.wavenumberCm.buffer)
    validateLineTable(slice)
  })

  it('when adjacent ranges are sliced, returns every line exactly once', () => {
    const a = sliceLineTableByWavenumber(table, 0, 620)
    const b = sliceLineTableByWavenumber(table, 620, 1000)
    expect(a.length + b.length).toBe(table.length)
  })

  it('when the range is empty or inverted, returns no rows or throws', () => {
    expect(sliceLineTableByWavenumber(table, 611, 619).length).toBe(0)
    expect(() => sliceLineTableByWavenumber(table, 630, 610)).toThrow(PhysicsError)
  })
})

describe('validateLineTable', () => {
  it('when wavenumbers decrease, throws NOT_MONOTONIC', () => {
    const table = createLineTable(3)
    table.wavenumberCm.set([600, 700, 650])
    expect(() => validateLineTable(table)).toThrow(
      expect.objectContaining({ code: 'NOT_MONOTONIC' }),
    )
  })

  it('when a column is shorter than the length, throws INVALID_ARGUMENT', () => {
    const table = { ...createLineTable(3), einsteinAPerS: new Float64Array(2) }
    expect(() => validateLineTable(table)).toThrow(
      expect.objectContaining({ code: 'INVALID_ARGUMENT' }),
    )
  })
})
