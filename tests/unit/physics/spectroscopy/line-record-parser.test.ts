import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import {
  LINE_RECORD_LENGTH,
  parseLineRecord,
  parseLineRecords,
} from '../../../../shared/physics/spectroscopy/line-record-parser'
import { lineRecord, type RecordField } from '../../../fixtures/line-lists/record-builder'

// The record builder (layout of Rothman et al. 2005, JQSRT 96, 139, Table 1; from memory) and the
// invented base record shaped like a CO2 ν₂ line are shared with the catalogue-import tests.
type FieldName = RecordField
const record = lineRecord

function parseError(text: string, lineNumber = 7): PhysicsError {
  try {
    parseLineRecord(text, lineNumber)
  } catch (error) {
    if (error instanceof PhysicsError) return error
    throw error
  }
  throw new Error('expected a parse error')
}

describe('parseLineRecord', () => {
  it('when given a well-formed record, reads every field exactly', () => {
    const text = record()
    expect(text.length).toBe(LINE_RECORD_LENGTH)
    const line = parseLineRecord(text, 1)
    expect(line).toEqual({
      moleculeId: 2,
      isotopologueId: 1,
      wavenumberCm: 667.661235,
      intensityCmPerMolecule: 3.215e-19,
      einsteinAPerS: 1.52,
      airHalfWidthCmPerAtm: 0.0721,
      selfHalfWidthCmPerAtm: 0.095,
      lowerStateEnergyCm: 234.1234,
      temperatureExponentAir: 0.75,
      pressureShiftCmPerAtm: -0.001234,
      upperGlobalQuanta: '       0 1 1 01',
      lowerGlobalQuanta: '       0 0 0 01',
      upperLocalQuanta: '               ',
      lowerLocalQuanta: '     R 12e     ',
      uncertaintyIndices: [3, 6, 6, 5, 5, 4],
      referenceIndices: [2, 3, 4, 5, 6, 7],
      lineMixingFlag: '',
      upperStatisticalWeight: 27,
      lowerStatisticalWeight: 25,
    })
  })

  it('when the isotopologue code is 0 or a letter, returns 10, 11, 12, …', () => {
    // Database convention for isotopologue numbers above 9 (Gordon et al. 2022, from memory).
    expect(parseLineRecord(record({ isotopologue: '0' }), 1).isotopologueId).toBe(10)
    expect(parseLineRecord(record({ isotopologue: 'A' }), 1).isotopologueId).toBe(11)
    expect(parseLineRecord(record({ isotopologue: 'C' }), 1).isotopologueId).toBe(13)
  })

  it('when the record ends with \\r, \\n or \\r\\n, accepts it', () => {
    expect(parseLineRecord(`${record()}\r`, 1).wavenumberCm).toBe(667.661235)
    expect(parseLineRecord(`${record()}\r\n`, 1).wavenumberCm).toBe(667.661235)
    expect(parseLineRecord(`${record()}\n`, 1).wavenumberCm).toBe(667.661235)
  })

  it('when optional columns are blank, returns zeros for indices and no statistical weights', () => {
    const line = parseLineRecord(
      record({ uncertainty: '', references: '', gUpper: '', gLower: '', lineMixing: 'Y' }),
      1,
    )
    expect(line.uncertaintyIndices).toEqual([0, 0, 0, 0, 0, 0])
    expect(line.referenceIndices).toEqual([0, 0, 0, 0, 0, 0])
    expect(line.upperStatisticalWeight).toBeUndefined()
    expect(line.lowerStatisticalWeight).toBeUndefined()
    expect(line.lineMixingFlag).toBe('Y')
  })

  it('when numbers use a D exponent or a leading sign, reads them', () => {
    // Fortran D exponent (common practice in Fortran-written files).
    const line = parseLineRecord(
      record({ intensity: '3.215D-19', nAir: '-.05', deltaAir: '+.000100' }),
      1,
    )
    expect(line.intensityCmPerMolecule).toBe(3.215e-19)
    expect(line.temperatureExponentAir).toBe(-0.05)
    expect(line.pressureShiftCmPerAtm).toBe(0.0001)
  })

  it('when the record is too short, throws with the line number and the record field', () => {
    const error = parseError(record().slice(0, 159), 12)
    expect(error.code).toBe('PARSE_ERROR')
    expect(error.details).toMatchObject({
      lineNumber: 12,
      field: 'record',
      columnRange: [1, 159],
      expected: '160 characters, got 159',
    })
    expect(error.message).toMatch(/^line 12, columns 1–159 \(record\)/)
  })

  it('when the wavenumber is not a number, throws with its columns and text', () => {
    const error = parseError(record({ wavenumber: '667.66x' }))
    expect(error.details).toMatchObject({
      lineNumber: 7,
      field: 'wavenumberCm',
      columnRange: [4, 15],
      value: '     667.66x',
    })
  })

  const rejected: [string, Partial<Record<FieldName, string>>, string, [number, number]][] = [
    ['zero wavenumber', { wavenumber: '0.000000' }, 'wavenumberCm', [4, 15]],
    ['negative intensity', { intensity: '-3.215E-19' }, 'intensityCmPerMolecule', [16, 25]],
    ['negative Einstein A', { einsteinA: '-1.52E+00' }, 'einsteinAPerS', [26, 35]],
    ['γ_air without a decimal point', { gammaAir: '721' }, 'airHalfWidthCmPerAtm', [36, 40]],
    ['blank γ_self', { gammaSelf: '' }, 'selfHalfWidthCmPerAtm', [41, 45]],
    [
      'negative E″ (unknown-energy marker)',
      { lowerEnergy: '-1.0000' },
      'lowerStateEnergyCm',
      [46, 55],
    ],
    ['non-numeric n_air', { nAir: 'n/a' }, 'temperatureExponentAir', [56, 59]],
    ['overflowing δ', { deltaAir: '1.0E999' }, 'pressureShiftCmPerAtm', [60, 67]],
    ['zero molecule number', { molecule: '00' }, 'moleculeId', [1, 2]],
    ['blank molecule number', { molecule: '' }, 'moleculeId', [1, 2]],
    ['lower-case isotopologue code', { isotopologue: 'a' }, 'isotopologueId', [3, 3]],
    ['non-digit uncertainty index', { uncertainty: '36x554' }, 'uncertaintyIndices', [130, 130]],
    ['non-numeric reference index', { references: ' 2 3 4 ?6 7' }, 'referenceIndices', [140, 141]],
    ['negative statistical weight', { gLower: '-25.0' }, 'lowerStatisticalWeight', [154, 160]],
  ]
  for (const [what, overrides, field, columnRange] of rejected) {
    it(`when the record has a ${what}, throws naming ${field}`, () => {
      const error = parseError(record(overrides))
      expect(error.details).toMatchObject({ lineNumber: 7, field, columnRange })
    })
  }

  it('when several fields are bad, lists every one in details.errors', () => {
    const error = parseError(record({ wavenumber: 'x', intensity: 'y', gUpper: 'z' }))
    const errors = (error.details as { errors: { field: string }[] }).errors
    expect(errors.map((e) => e.field)).toEqual([
      'wavenumberCm',
      'intensityCmPerMolecule',
      'upperStatisticalWeight',
    ])
  })
})

describe('parseLineRecords', () => {
  const input = [
    record(),
    '',
    record({ intensity: 'bad' }),
    record({ wavenumber: '700.000000' }),
    record().slice(0, 100),
    '   ',
  ]

  it("when onError is 'collect', returns the good lines and every error with its line number", () => {
    const result = parseLineRecords(input, { onError: 'collect' })
    expect(result.lines.map((l) => l.wavenumberCm)).toEqual([667.661235, 700])
    expect(result.errors.map((e) => [e.lineNumber, e.field])).toEqual([
      [3, 'intensityCmPerMolecule'],
      [5, 'record'],
    ])
    expect(result.errors[0]).toEqual({
      lineNumber: 3,
      field: 'intensityCmPerMolecule',
      columnRange: [16, 25],
      value: '       bad',
      expected: "a number ≥ 0 with a decimal point (E10.3, e.g. '3.215E-19')",
    })
    expect(result.recordCount).toBe(4)
    expect(result.stoppedEarly).toBe(false)
  })

  it('when onError is the default, throws PARSE_ERROR at the first bad record', () => {
    expect(() => parseLineRecords(input)).toThrow(
      expect.objectContaining({
        code: 'PARSE_ERROR',
        details: expect.objectContaining({ lineNumber: 3 }),
      }),
    )
  })

  it('when maxErrors is reached with records left, stops early', () => {
    const result = parseLineRecords(input, { onError: 'collect', maxErrors: 1 })
    expect(result.errors.length).toBe(1)
    expect(result.lines.length).toBe(1)
    expect(result.stoppedEarly).toBe(true)
  })

  it('when given a generator, reads it lazily like an array', () => {
    function* lines(): Generator<string> {
      for (let k = 0; k < 3; k++) yield record({ wavenumber: (600 + k).toFixed(6) })
    }
    expect(parseLineRecords(lines()).lines.map((l) => l.wavenumberCm)).toEqual([600, 601, 602])
  })

  it('when options are invalid, throws INVALID_ARGUMENT', () => {
    expect(() => parseLineRecords([], { maxErrors: 0, onError: 'collect' })).toThrow(PhysicsError)
  })
})
