import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { PhysicsError } from '../../../../shared/physics/errors'
import { MAX_REPORTED_ERRORS, SoundingError } from '../../../../shared/profiles/sounding/issues'
import {
  SOUNDING_LIMITS,
  parseSoundingText,
  type ParseSoundingOptions,
} from '../../../../shared/profiles/sounding/parse'

const fixture = (name: string) =>
  readFileSync(new URL(`../../../fixtures/soundings/${name}`, import.meta.url), 'utf8')

/** Runs the parser expecting a SoundingError and returns it. */
function parseError(text: string, options?: ParseSoundingOptions): SoundingError {
  try {
    parseSoundingText(text, options)
  } catch (error) {
    expect(error).toBeInstanceOf(SoundingError)
    expect(error).toBeInstanceOf(PhysicsError)
    return error as SoundingError
  }
  throw new Error('expected parseSoundingText to throw')
}

const GOOD_CSV = 'PRES,TEMP,DWPT\n1000,15,10\n850,6,1\n700,-2,-8\n500,-18,-28\n'

describe('parseSoundingText — good files', () => {
  it('when reading the comma CSV fixture, skips comments and blanks and keeps file line numbers', () => {
    const parsed = parseSoundingText(fixture('comma-degc-hpa-dewpoint.csv'))
    expect(parsed.delimiter).toBe('comma')
    expect(parsed.decimalSeparator).toBe('.')
    expect(parsed.header).toEqual(['PRES', 'HGHT', 'TEMP', 'DWPT', 'DRCT', 'SKNT'])
    expect(parsed.headerLineNumber).toBe(3)
    expect(parsed.lineNumbers).toEqual([4, 5, 7, 8, 9, 11, 12, 13])
    expect(parsed.rows[2]).toEqual(['850.0', '1510', '15.2', '0.0', '220', '20'])
    expect(parsed.comments[0]).toMatch(/^Hand-made test sounding/)
    expect(parsed.unitsRow).toBeUndefined()
  })

  it('when reading the whitespace fixture, detects runs of spaces and the units line', () => {
    const parsed = parseSoundingText(fixture('whitespace-k-pa-rh.txt'))
    expect(parsed.delimiter).toBe('whitespace')
    expect(parsed.header).toEqual(['PRES', 'HGHT', 'TEMP', 'RELH', 'SKNT'])
    expect(parsed.unitsRow).toEqual(['Pa', 'm', 'K', '%', 'knot'])
    expect(parsed.unitsLineNumber).toBe(4)
    expect(parsed.lineNumbers).toEqual([6, 7, 8, 9, 10, 11])
    expect(parsed.rows[0]).toEqual(['101300', '10', '293.15', '80.0', '5'])
  })

  it('when reading the semicolon fixture, detects semicolons', () => {
    const parsed = parseSoundingText(fixture('semicolon-gkg-no-heights.csv'))
    expect(parsed.delimiter).toBe('semicolon')
    expect(parsed.header).toEqual(['pressure_hPa', 'temperature_C', 'mixing_ratio_g/kg'])
    expect(parsed.rows).toHaveLength(6)
    expect(parsed.lineNumbers[0]).toBe(4)
  })

  it('when the file is tab-separated with quoted names, CRLF line ends and a byte-order mark, reads it', () => {
    const text = '\ufeff"Pressure (hPa)"\t"Temp, °C"\r\n1000\t15\r\n900\t9\r\n800\t3\r\n'
    const parsed = parseSoundingText(text)
    expect(parsed.delimiter).toBe('tab')
    expect(parsed.header).toEqual(['Pressure (hPa)', 'Temp, °C'])
    expect(parsed.lineNumbers).toEqual([2, 3, 4])
  })

  it('when a semicolon file writes decimal commas, reports the decimal separator as a comma', () => {
    const parsed = parseSoundingText('p;t\n1000;15,2\n900;9,1\n800;3,0\n')
    expect(parsed.decimalSeparator).toBe(',')
    expect(parsed.rows[0]).toEqual(['1000', '15,2'])
  })

  it('when a comma file has a space after each comma, still chooses commas', () => {
    const parsed = parseSoundingText('PRES, TEMP, DWPT\n1000, 15, 10\n850, 6, 1\n700, -2, -8\n')
    expect(parsed.delimiter).toBe('comma')
    expect(parsed.rows[1]).toEqual(['850', '6', '1'])
  })
})

describe('parseSoundingText — rejected files', () => {
  it('when the file is empty, throws EMPTY_FILE for the whole file', () => {
    const error = parseError('')
    expect(error.issues).toHaveLength(1)
    expect(error.issues[0]).toMatchObject({ code: 'EMPTY_FILE', lineNumber: null, field: 'file' })
    expect(error.issues[0].message).toBe('The file is empty.')
    expect(error.code).toBe('PARSE_ERROR')
  })

  it('when the file has only comments and blank lines, throws EMPTY_FILE', () => {
    const error = parseError('# launch cancelled\n\n   \n# no data\n')
    expect(error.issues[0]).toMatchObject({ code: 'EMPTY_FILE', field: 'file' })
    expect(error.issues[0].message).toMatch(/only comments or blank lines/)
  })

  it('when the file contains a NUL byte, throws BINARY_FILE naming its line', () => {
    const error = parseError('PRES,TEMP\n1000,15\n850,\u0000\u0001\n700,-2\n')
    expect(error.issues[0]).toMatchObject({ code: 'BINARY_FILE', lineNumber: 3, field: 'file' })
    expect(error.issues[0].expected).toBe('a text file (CSV or space-separated columns)')
  })

  it('when most characters are control or undecodable characters, throws BINARY_FILE', () => {
    // A compressed file read as UTF-8: control characters and U+FFFD replacement characters.
    let text = 'PK'
    for (let i = 0; i < 400; i++) text += i % 3 === 0 ? '\ufffd' : i % 3 === 1 ? '\u0003' : 'a'
    const error = parseError(text)
    expect(error.issues[0]).toMatchObject({ code: 'BINARY_FILE', lineNumber: 1 })
    expect(error.issues[0].message).toMatch(/looks binary/)
  })

  it('when the file is larger than 2 MiB, throws FILE_TOO_LARGE', () => {
    expect(SOUNDING_LIMITS.maxBytes).toBe(2 * 1024 * 1024)
    const text = GOOD_CSV + '#'.repeat(SOUNDING_LIMITS.maxBytes)
    const error = parseError(text)
    expect(error.issues[0]).toMatchObject({
      code: 'FILE_TOO_LARGE',
      lineNumber: null,
      field: 'file',
    })
    expect(error.issues[0].message).toMatch(/larger than 2 MiB/)
  })

  it('when multi-byte characters take the file over the limit, counts UTF-8 bytes, not characters', () => {
    // 'é' is 2 bytes in UTF-8 (RFC 3629): 60 characters, 110 bytes.
    const text = 'p,t\n' + 'é'.repeat(50) + '\n1,2\n'
    expect(text.length).toBeLessThanOrEqual(64)
    const error = parseError(text, { maxBytes: 64 })
    expect(error.issues[0].code).toBe('FILE_TOO_LARGE')
  })

  it('when the first content line is all numbers, throws NO_HEADER naming that line', () => {
    const error = parseError('# no header below\n1000,15,10\n850,6,1\n700,-2,-8\n')
    expect(error.issues[0]).toMatchObject({ code: 'NO_HEADER', lineNumber: 2, field: 'header' })
    expect(error.issues[0].message).toMatch(/^Line 2: expected a header line naming the columns/)
  })

  it('when the columns use an unsupported delimiter, throws NO_DELIMITER naming the header line', () => {
    const error = parseError('PRES|TEMP|DWPT\n1000|15|10\n850|6|1\n700|-2|-8\n')
    expect(error.issues[0]).toMatchObject({ code: 'NO_DELIMITER', lineNumber: 1, field: 'header' })
    expect(error.issues[0].expected).toBe(
      'column names separated by commas, semicolons, tabs or spaces',
    )
  })

  it('when a row uses another delimiter than the header, throws CELL_COUNT_MISMATCH naming the row', () => {
    const text = 'PRES,TEMP,DWPT\n1000,15,10\n925;11;7\n850,6,1\n700,-2,-8\n'
    const error = parseError(text)
    expect(error.issues).toHaveLength(1)
    expect(error.issues[0]).toMatchObject({
      code: 'CELL_COUNT_MISMATCH',
      lineNumber: 3,
      field: 'row',
      value: '925;11;7',
      expected: '3 cells separated by commas',
    })
    expect(error.issues[0].message).toBe(
      'Line 3: found 1 cell but the header (line 1) has 3 columns separated by commas. ' +
        'This line seems to be separated by semicolons.',
    )
  })

  it('when several rows have the wrong number of cells, names every one of them', () => {
    const text = 'PRES,TEMP,DWPT\n1000,15,10\n925,11\n850,6,1,4\n700,-2,-8\n'
    const error = parseError(text)
    expect(error.issues.map((i) => [i.code, i.lineNumber])).toEqual([
      ['CELL_COUNT_MISMATCH', 3],
      ['CELL_COUNT_MISMATCH', 4],
    ])
    expect(error.message).toMatch(/\(and 1 more problem\)$/)
  })

  it('when 60 rows are bad, reports the first 50 and counts all 60', () => {
    let text = 'PRES,TEMP\n1000,15\n'
    for (let i = 0; i < 60; i++) text += `${990 - i},1,2\n`
    const error = parseError(text)
    expect(MAX_REPORTED_ERRORS).toBe(50)
    expect(error.issues).toHaveLength(50)
    expect(error.issueCount).toBe(60)
    expect(error.issues[49].lineNumber).toBe(52)
  })

  it('when a quoted cell is not closed, throws UNTERMINATED_QUOTE naming the row', () => {
    const error = parseError('PRES,TEMP\n1000,15\n"850,6\n700,-2\n')
    expect(error.issues[0]).toMatchObject({
      code: 'UNTERMINATED_QUOTE',
      lineNumber: 3,
      field: 'row',
    })
  })

  it('when there are fewer than 3 data rows, throws TOO_FEW_ROWS', () => {
    expect(SOUNDING_LIMITS.minLevels).toBe(3)
    const error = parseError('PRES,TEMP\n1000,15\n850,6\n')
    expect(error.issues[0]).toMatchObject({ code: 'TOO_FEW_ROWS', lineNumber: 3, field: 'file' })
    expect(error.issues[0].message).toBe(
      'The file has 2 data rows after the header (line 1); at least 3 levels are needed.',
    )
  })

  it('when there are more than 20 000 data rows, throws TOO_MANY_ROWS at the first extra row', () => {
    expect(SOUNDING_LIMITS.maxRows).toBe(20_000)
    const lines = ['p,t']
    for (let i = 0; i <= SOUNDING_LIMITS.maxRows; i++) lines.push(`${100000 - i},250`)
    const error = parseError(lines.join('\n'))
    expect(error.issues).toHaveLength(1)
    expect(error.issues[0]).toMatchObject({
      code: 'TOO_MANY_ROWS',
      lineNumber: 20_002,
      field: 'file',
    })
  })
})
