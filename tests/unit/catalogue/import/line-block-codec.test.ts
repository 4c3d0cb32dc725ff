import { describe, expect, it } from 'vitest'
import {
  blockByteLength,
  blockLineCount,
  decodeBlockInto,
  LineBlockBuilder,
} from '../../../../server/catalogue/line-block-codec'
import { createLineTable, type SpectralLine } from '../../../../shared/physics/spectroscopy/line'

// Invented lines; the values only need to survive the round trip bit for bit.
function line(i: number): SpectralLine {
  return {
    moleculeId: 1 + (i % 7),
    isotopologueId: 1 + (i % 3),
    wavenumberCm: 500 + i / 3,
    intensityCmPerMolecule: 1e-19 * (1 + i) * Math.PI,
    einsteinAPerS: 0.1 * i,
    airHalfWidthCmPerAtm: 0.07 + i * 1e-5,
    selfHalfWidthCmPerAtm: 0.09 - i * 1e-6,
    lowerStateEnergyCm: i * 1.25,
    temperatureExponentAir: 0.75,
    pressureShiftCmPerAtm: -0.001 * Math.SQRT2 * i,
  }
}

describe('line blocks', () => {
  it('when lines are encoded and decoded, returns every numeric field bit for bit', () => {
    const builder = new LineBlockBuilder(10)
    const lines = Array.from({ length: 7 }, (_, i) => line(i))
    lines.forEach((l) => builder.add(l))
    const block = builder.finish()
    expect(block).toMatchObject({ lineCount: 7, minWavenumberCm: 500, maxWavenumberCm: 502 })
    expect(block.data.length).toBe(blockByteLength(7))
    expect(blockByteLength(7)).toBe(16 + 72 * 7)
    const table = createLineTable(9)
    expect(decodeBlockInto(block.data, table, 2)).toBe(7)
    lines.forEach((l, i) => {
      for (const key of Object.keys(l) as (keyof SpectralLine)[])
        expect(table[key as 'wavenumberCm'][i + 2]).toBe(l[key])
      expect(table.sourceIndex[i + 2]).toBe(i + 2)
    })
    expect(builder.length).toBe(0)
  })

  it('when a block fills up, reports full and refuses another line', () => {
    const builder = new LineBlockBuilder(2)
    builder.add(line(0))
    expect(builder.full).toBe(false)
    builder.add(line(1))
    expect(builder.full).toBe(true)
    expect(() => builder.add(line(2))).toThrow('full')
  })

  it('when the bytes are not a block or are cut short, throws', () => {
    const builder = new LineBlockBuilder(4)
    builder.add(line(0))
    const data = builder.finish().data
    expect(blockLineCount(data)).toBe(1)
    expect(() => blockLineCount(data.subarray(0, data.length - 1))).toThrow('expected')
    const bad = Buffer.from(data)
    bad.write('XXXX', 0, 'latin1')
    expect(() => blockLineCount(bad)).toThrow('magic')
  })
})
