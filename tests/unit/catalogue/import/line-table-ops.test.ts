import { describe, expect, it } from 'vitest'
import {
  builtInLinesUsed,
  mergeWithBuiltIn,
  sortedByWavenumber,
} from '../../../../server/catalogue/line-table-ops'
import { toLineTable, type SpectralLine } from '../../../../shared/physics/spectroscopy/line'

const base = {
  isotopologueId: 1,
  intensityCmPerMolecule: 1e-20,
  einsteinAPerS: 1,
  airHalfWidthCmPerAtm: 0.07,
  selfHalfWidthCmPerAtm: 0.09,
  lowerStateEnergyCm: 10,
  temperatureExponentAir: 0.75,
  pressureShiftCmPerAtm: 0,
}
const at = (moleculeId: number, wavenumberCm: number, einsteinAPerS = 1): SpectralLine => ({
  ...base,
  moleculeId,
  wavenumberCm,
  einsteinAPerS,
})

describe('line table operations', () => {
  it('when a table is out of order, returns it sorted by wavenumber with equal positions in input order', () => {
    const table = toLineTable([at(2, 700), at(2, 650), at(2, 680)])
    // toLineTable sorts; shuffle its rows by hand to get an unsorted table.
    table.wavenumberCm.set([700, 650, 650])
    table.einsteinAPerS.set([1, 2, 3])
    const sorted = sortedByWavenumber(table)
    expect(Array.from(sorted.wavenumberCm)).toEqual([650, 650, 700])
    expect(Array.from(sorted.einsteinAPerS)).toEqual([2, 3, 1])
    const already = toLineTable([at(2, 1), at(2, 2)])
    expect(sortedByWavenumber(already)).toBe(already)
  })

  it('when merged, keeps every imported line and the built-in lines of the molecules the import lacks', () => {
    const builtIn = toLineTable([
      at(1, 600, 10),
      at(2, 640, 20),
      at(3, 660, 30),
      at(2, 700, 40),
      at(1, 720, 50),
    ])
    const imported = toLineTable([at(2, 650, 1), at(2, 660, 2)])
    const merged = mergeWithBuiltIn(builtIn, imported)
    expect(Array.from(merged.wavenumberCm)).toEqual([600, 650, 660, 660, 720])
    expect(Array.from(merged.moleculeId)).toEqual([1, 2, 3, 2, 1])
    // On equal wavenumbers the built-in line comes first (O3 at 660 before the imported CO2).
    expect(Array.from(merged.einsteinAPerS)).toEqual([10, 1, 30, 2, 50])
    expect(Array.from(merged.sourceIndex)).toEqual([
      builtIn.sourceIndex[0],
      5,
      builtIn.sourceIndex[2],
      6,
      builtIn.sourceIndex[4],
    ])
    expect(builtInLinesUsed(builtIn, [2])).toBe(3)
  })
})
