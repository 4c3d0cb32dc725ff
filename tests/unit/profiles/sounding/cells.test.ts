import { describe, expect, it } from 'vitest'
import { isMissingCell, readCell, splitLine } from '../../../../shared/profiles/sounding/cells'

describe('splitLine', () => {
  it('when a comma line has quoted cells with commas and doubled quotes, keeps them whole', () => {
    // RFC 4180 §2: fields may be enclosed in double quotes; "" inside stands for one quote.
    expect(splitLine('"Temp, °C", "say ""hi""",3', 'comma')).toEqual({
      cells: ['Temp, °C', 'say "hi"', '3'],
      unterminatedQuote: false,
    })
  })

  it('when a line ends with the delimiter, returns a last empty cell', () => {
    expect(splitLine('1000;15;', 'semicolon').cells).toEqual(['1000', '15', ''])
  })

  it('when splitting on whitespace, treats runs of spaces and tabs as one separator', () => {
    expect(splitLine('   1000 \t  15.2    80 ', 'whitespace').cells).toEqual(['1000', '15.2', '80'])
  })

  it('when a quote is not closed, reports it', () => {
    expect(splitLine('1000,"15', 'comma').unterminatedQuote).toBe(true)
  })
})

describe('readCell / isMissingCell', () => {
  it('when reading the common missing-value markers, returns missing', () => {
    // markers used by radiosonde archives (common practice)
    for (const cell of [
      '',
      ' ',
      'NA',
      'n/a',
      'NaN',
      '////',
      '//',
      '-',
      '---',
      '-9999',
      '-9999.00',
      '-999.9',
      'M',
    ])
      expect(isMissingCell(cell), `'${cell}'`).toBe(true)
  })

  it('when reading 99999 or -99, returns a number (not a marker): 99999 Pa is a real pressure', () => {
    expect(readCell('99999')).toEqual({ kind: 'number', value: 99999 })
    expect(readCell('-99')).toEqual({ kind: 'number', value: -99 })
  })

  it('when reading numbers strictly, rejects units, thousands separators and trailing text', () => {
    expect(readCell('1.5e3')).toEqual({ kind: 'number', value: 1500 })
    expect(readCell('+.5')).toEqual({ kind: 'number', value: 0.5 })
    for (const cell of ['15 C', '1,013.2', '12abc', '0x10', 'Infinity'])
      expect(readCell(cell).kind, `'${cell}'`).toBe('invalid')
  })

  it('when the decimal separator is a comma, reads 15,2 as 15.2 and only then', () => {
    expect(readCell('15,2', ',')).toEqual({ kind: 'number', value: 15.2 })
    expect(readCell('15,2', '.').kind).toBe('invalid')
  })

  it('when extra markers are given, treats them as missing', () => {
    expect(readCell('-8888', '.', ['-8888'])).toEqual({ kind: 'missing' })
    expect(readCell('-8888')).toEqual({ kind: 'number', value: -8888 })
  })
})
