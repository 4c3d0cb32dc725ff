import { createHash } from 'node:crypto'
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { MAX_LINE_BYTES, scanLineList } from '../../../../server/catalogue/import/scan-line-list'
import type { SpectralLine } from '../../../../shared/physics/spectroscopy/line'
import {
  IMPORT_ERRORS_BEFORE_STOP,
  IMPORT_ERRORS_LISTED,
} from '../../../../shared/schemas/catalogues'
import { lineRecord } from '../../../fixtures/line-lists/record-builder'

// Fixtures: hand-written records with invented values (tests/fixtures/line-lists/README.md).
const CO2 = 'tests/fixtures/line-lists/co2-667.par'
const MIXED = 'tests/fixtures/line-lists/mixed-molecules.par'
const MALFORMED = 'tests/fixtures/line-lists/malformed.par'

const dir = mkdtempSync(join(tmpdir(), 'tauline-scan-test-'))
afterAll(() => rmSync(dir, { recursive: true, force: true }))

function file(name: string, text: string): string {
  const path = join(dir, name)
  writeFileSync(path, text)
  return path
}

async function collect(path: string) {
  const lines: { line: SpectralLine; lineNumber: number }[] = []
  const scan = await scanLineList(path, {
    onLine: (line, lineNumber) => void lines.push({ line, lineNumber }),
  })
  return { scan, lines }
}

const BLANK15 = ' '.repeat(15)

/** |actual/expected − 1| ≤ tolerance, with both numbers in the failure message. */
function expectRelative(actual: number, expected: number, tolerance: number) {
  expect(Math.abs(actual / expected - 1), `${actual} vs ${expected}`).toBeLessThanOrEqual(tolerance)
}

describe('scanLineList', () => {
  it('when reading the CO2 fixture, returns every field of every record exactly as written', async () => {
    const { scan, lines } = await collect(CO2)
    expect(scan).toMatchObject({ errorCount: 0, errors: [], recordCount: 6, stoppedEarly: false })
    expect(lines.map((l) => l.lineNumber)).toEqual([1, 2, 3, 4, 5, 6])
    // Values as typed into the fixture (columns per Rothman et al. 2005, Table 1; from memory).
    expect(lines[0].line).toEqual({
      moleculeId: 2,
      isotopologueId: 1,
      wavenumberCm: 662.3734,
      intensityCmPerMolecule: 1.25e-19,
      einsteinAPerS: 1.312,
      airHalfWidthCmPerAtm: 0.0735,
      selfHalfWidthCmPerAtm: 0.098,
      lowerStateEnergyCm: 163.8856,
      temperatureExponentAir: 0.76,
      pressureShiftCmPerAtm: -0.00102,
      upperGlobalQuanta: '       0 1 1 01',
      lowerGlobalQuanta: '       0 0 0 01',
      upperLocalQuanta: BLANK15,
      lowerLocalQuanta: '     P 14e     ',
      uncertaintyIndices: [3, 6, 6, 5, 5, 4],
      referenceIndices: [2, 3, 4, 5, 6, 7],
      lineMixingFlag: '',
      upperStatisticalWeight: 27,
      lowerStatisticalWeight: 29,
    })
    expect(lines[4].line).toMatchObject({
      wavenumberCm: 672.5,
      upperGlobalQuanta: '       0 2 2 01',
      lowerGlobalQuanta: '       0 1 1 01',
      lowerStateEnergyCm: 823.41,
    })
    expect(lines[5].line).toEqual({
      moleculeId: 2,
      isotopologueId: 2,
      wavenumberCm: 676.0211,
      intensityCmPerMolecule: 8e-21,
      einsteinAPerS: 1.48,
      airHalfWidthCmPerAtm: 0.074,
      selfHalfWidthCmPerAtm: 0.099,
      lowerStateEnergyCm: 58.5,
      temperatureExponentAir: 0.76,
      pressureShiftCmPerAtm: -0.0011,
      upperGlobalQuanta: '       0 1 1 01',
      lowerGlobalQuanta: '       0 0 0 01',
      upperLocalQuanta: BLANK15,
      lowerLocalQuanta: '     R 10e     ',
      uncertaintyIndices: [3, 5, 5, 4, 4, 3],
      referenceIndices: [1, 1, 1, 1, 1, 1],
      lineMixingFlag: '',
      upperStatisticalWeight: 46,
      lowerStatisticalWeight: 42,
    })
  })

  it('when reading CRLF records with a blank line, keeps file line numbers and reads blank weights as absent', async () => {
    const { scan, lines } = await collect(MIXED)
    expect(scan.summary.blankLineCount).toBe(1)
    expect(lines.map((l) => l.lineNumber)).toEqual([1, 2, 4, 5, 6, 7])
    expect(lines[0].line).toEqual({
      moleculeId: 1,
      isotopologueId: 1,
      wavenumberCm: 1594.75,
      intensityCmPerMolecule: 1.05e-20,
      einsteinAPerS: 21,
      airHalfWidthCmPerAtm: 0.095,
      selfHalfWidthCmPerAtm: 0.48,
      lowerStateEnergyCm: 0,
      temperatureExponentAir: 0.7,
      pressureShiftCmPerAtm: -0.004,
      upperGlobalQuanta: '          0 1 0',
      lowerGlobalQuanta: '          0 0 0',
      upperLocalQuanta: '  1  1  1      ',
      lowerLocalQuanta: '  0  0  0      ',
      uncertaintyIndices: [4, 5, 4, 3, 3, 2],
      referenceIndices: [10, 9, 8, 7, 6, 5],
      lineMixingFlag: '',
      upperStatisticalWeight: 9,
      lowerStatisticalWeight: 3,
    })
    const ozone = lines[3].line
    expect(ozone).toMatchObject({
      moleculeId: 3,
      wavenumberCm: 1042.084,
      pressureShiftCmPerAtm: 0,
      lineMixingFlag: 'W',
    })
    expect(ozone).not.toHaveProperty('upperStatisticalWeight')
    expect(ozone).not.toHaveProperty('lowerStatisticalWeight')
    expect(lines[4].line).toMatchObject({
      moleculeId: 5,
      isotopologueId: 1,
      wavenumberCm: 2143.2711,
    })
    expect(scan.fileSha256).toBe(createHash('sha256').update(readFileSync(MIXED)).digest('hex'))
    expect(scan.byteSize).toBe(readFileSync(MIXED).length)
  })

  it('when summarising, returns counts, sums and ranges per molecule and isotopologue, the strongest band and warnings', async () => {
    const co2 = (await scanLineList(CO2)).summary
    expect(co2).toMatchObject({
      lineCount: 6,
      minWavenumberCm: 662.3734,
      maxWavenumberCm: 676.0211,
      sortedByWavenumber: true,
      bandGroupCount: 3,
      warnings: [],
    })
    const [molecule] = co2.molecules
    // Hand sums of the fixture intensities: 1.25e-19 + 2.41e-19 + 3.305e-18 + 2.6e-19 + 1.9e-19 + 8e-21.
    expectRelative(molecule.intensitySumCmPerMolecule, 4.129e-18, 1e-12)
    expect(molecule.isotopologues[0]).toMatchObject({
      isotopologueId: 1,
      code: '626',
      lineCount: 5,
      minWavenumberCm: 662.3734,
      maxWavenumberCm: 672.5,
    })
    expectRelative(molecule.isotopologues[0].intensitySumCmPerMolecule, 4.121e-18, 1e-12)
    expect(molecule.isotopologues[1]).toMatchObject({
      isotopologueId: 2,
      code: '636',
      lineCount: 1,
      intensitySumCmPerMolecule: 8e-21,
    })
    // Fundamental 01101–00001: four lines, 3.931e-18; the hot band's one line, 1.9e-19, is weaker.
    expect(co2.strongestBand).toMatchObject({
      moleculeId: 2,
      isotopologueId: 1,
      upperGlobalQuanta: '0 1 1 01',
      lowerGlobalQuanta: '0 0 0 01',
      lineCount: 4,
      minWavenumberCm: 662.3734,
      maxWavenumberCm: 669.8812,
    })
    expectRelative(co2.strongestBand!.intensitySumCmPerMolecule, 3.931e-18, 1e-12)

    const mixed = (await scanLineList(MIXED)).summary
    expect(mixed.molecules.map((m) => [m.molecule, m.modelled, m.lineCount])).toEqual([
      ['H2O', true, 1],
      ['CO2', true, 3],
      ['O3', true, 1],
      ['molecule 5', false, 1],
    ])
    expect(mixed.molecules[1].isotopologues.map((i) => [i.isotopologueId, i.code])).toEqual([
      [1, '626'],
      [2, '636'],
      [7, null],
    ])
    expect(mixed.sortedByWavenumber).toBe(false)
    expect(mixed.warnings.map((w) => w.code)).toEqual([
      'ISOTOPOLOGUE_WITHOUT_DATA',
      'MOLECULE_NOT_MODELLED',
      'NOT_SORTED',
    ])
    expect(mixed.warnings[0].message).toContain('1 line of CO2 isotopologue 7')
  })

  it('when records are malformed, returns each problem with its line number, field, columns, value and expectation', async () => {
    const scan = await scanLineList(MALFORMED)
    expect(scan.errorCount).toBe(3)
    expect(scan.recordCount).toBe(6)
    expect(scan.errors).toEqual([
      {
        lineNumber: 3,
        field: 'wavenumberCm',
        columnRange: [4, 15],
        value: '  667,380000',
        expected: expect.stringContaining('decimal point'),
      },
      {
        lineNumber: 5,
        field: 'record',
        columnRange: [1, 159],
        value: expect.any(String),
        expected: '160 characters, got 159',
      },
      {
        lineNumber: 6,
        field: 'airHalfWidthCmPerAtm',
        columnRange: [36, 40],
        value: '-.072',
        expected: expect.stringContaining('≥ 0'),
      },
    ])
    expect(scan.summary.lineCount).toBe(3)
  })

  it('when asked to stop at the first error, returns only it and reads no further', async () => {
    const seen: number[] = []
    const scan = await scanLineList(MALFORMED, {
      stopAtFirstError: true,
      onLine: (_l, n) => void seen.push(n),
    })
    expect(scan.errors.map((e) => e.lineNumber)).toEqual([3])
    expect(scan.stoppedEarly).toBe(true)
    expect(seen).toEqual([1, 2])
  })

  it(`when a file has more than ${IMPORT_ERRORS_LISTED} bad records, lists the first ${IMPORT_ERRORS_LISTED} and counts the rest`, async () => {
    const bad = lineRecord({ wavenumber: '667' })
    const path = file(
      'many-bad.par',
      `${lineRecord()}\n${Array.from({ length: 120 }, () => bad).join('\n')}\n`,
    )
    const scan = await scanLineList(path)
    expect(scan.errorCount).toBe(120)
    expect(scan.errors).toHaveLength(IMPORT_ERRORS_LISTED)
    expect(scan.errors[0].lineNumber).toBe(2)
    expect(scan.errors[IMPORT_ERRORS_LISTED - 1].lineNumber).toBe(IMPORT_ERRORS_LISTED + 1)
    expect(scan.stoppedEarly).toBe(false)
  })

  it(`when a file is not a line list at all, stops after ${IMPORT_ERRORS_BEFORE_STOP} errors`, async () => {
    const path = file(
      'prose.txt',
      'This is not a line list.\n'.repeat(IMPORT_ERRORS_BEFORE_STOP + 500),
    )
    const scan = await scanLineList(path)
    expect(scan.errorCount).toBe(IMPORT_ERRORS_BEFORE_STOP)
    expect(scan.stoppedEarly).toBe(true)
    expect(scan.errors[0]).toMatchObject({
      lineNumber: 1,
      field: 'record',
      expected: '160 characters, got 24',
    })
  })

  it('when a line runs on past the byte limit without a break, stops with an error on that line', async () => {
    const path = file('binary.bin', `${lineRecord()}\n${'x'.repeat(MAX_LINE_BYTES + 10)}`)
    const scan = await scanLineList(path)
    expect(scan.stoppedEarly).toBe(true)
    expect(scan.errors).toEqual([expect.objectContaining({ lineNumber: 2, field: 'record' })])
  })

  it('when the file starts with a byte-order mark or ends without a line break, still reads every record', async () => {
    const path = file(
      'bom.par',
      `\ufeff${lineRecord()}\n${lineRecord({ wavenumber: '668.000000' })}`,
    )
    const { scan, lines } = await collect(path)
    expect(scan.errorCount).toBe(0)
    expect(lines.map((l) => l.line.wavenumberCm)).toEqual([667.661235, 668])
  })

  it('when the file is empty, returns an empty summary without errors', async () => {
    const scan = await scanLineList(file('empty.par', ''))
    expect(scan).toMatchObject({ errorCount: 0, recordCount: 0, byteSize: 0 })
    expect(scan.summary).toMatchObject({ lineCount: 0, molecules: [], strongestBand: null })
  })
})
