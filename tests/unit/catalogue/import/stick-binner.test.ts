import { describe, expect, it } from 'vitest'
import { StickBinner } from '../../../../server/catalogue/stick-binner'

function columns(lines: [moleculeId: number, wavenumberCm: number, intensity: number][]) {
  return {
    length: lines.length,
    moleculeId: Int32Array.from(lines.map((l) => l[0])),
    wavenumberCm: Float64Array.from(lines.map((l) => l[1])),
    intensityCmPerMolecule: Float64Array.from(lines.map((l) => l[2])),
  }
}

describe('StickBinner', () => {
  it('when several lines share a bin, keeps the strongest per molecule; the range end falls in the last bin', () => {
    const binner = new StickBinner(0, 10, 5)
    binner.add(
      columns([
        [2, 0.5, 1e-20],
        [2, 1.5, 3e-20],
        [1, 1.0, 5e-21],
        [2, 4.0, 2e-20],
        [2, 10, 7e-21],
        [2, 10.5, 9e-19],
        [1, 3.0, 0],
      ]),
    )
    const r = binner.result('builtin')
    expect(r).toMatchObject({ binWidthCm: 2, lineCountInRange: 6 })
    expect(r.series.map((s) => [s.molecule, s.wavenumberCm, s.intensityCmPerMolecule])).toEqual([
      ['H2O', [1.0], [5e-21]],
      ['CO2', [1.5, 4.0, 10], [3e-20, 2e-20, 7e-21]],
    ])
  })

  it('when built-in lines are added with a molecule filter, keeps them apart and drops the excluded molecules', () => {
    const binner = new StickBinner(0, 10, 10)
    binner.add(columns([[2, 5, 1e-19]]))
    binner.add(
      columns([
        [2, 5, 1e-18],
        [3, 6, 1e-20],
      ]),
      { fromBuiltIn: true, molecule: (id) => id !== 2 },
    )
    const r = binner.result(7)
    expect(r.series.map((s) => [s.molecule, s.fromBuiltIn, s.wavenumberCm])).toEqual([
      ['CO2', false, [5]],
      ['O3', true, [6]],
    ])
  })

  it('when the range or bin count is invalid, throws', () => {
    expect(() => new StickBinner(5, 5, 10)).toThrow()
    expect(() => new StickBinner(0, 5, 0)).toThrow()
  })
})
