import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import {
  describeGuess,
  guessColumnMapping,
  pickHumiditySource,
} from '../../../../shared/profiles/sounding/columns'
import { parseSoundingText } from '../../../../shared/profiles/sounding/parse'

const fixture = (name: string) =>
  readFileSync(new URL(`../../../fixtures/soundings/${name}`, import.meta.url), 'utf8')

function guessFor(text: string) {
  const parsed = parseSoundingText(text)
  return { parsed, guess: guessColumnMapping(parsed.header, parsed.rows, parsed) }
}

describe('guessColumnMapping — names', () => {
  it('when the header uses the usual radiosonde abbreviations, maps them and ignores the wind', () => {
    const { guess } = guessFor(fixture('comma-degc-hpa-dewpoint.csv'))
    expect(guess.mapping).toEqual({ pressure: 0, height: 1, temperature: 2, dewPoint: 3 })
    expect(guess.units).toEqual({
      pressure: 'hPa',
      height: 'm',
      temperature: 'degC',
      dewPoint: 'degC',
    })
    expect(guess.ignored).toEqual([
      {
        columnIndex: 4,
        column: 'DRCT',
        reason: 'wind is not used in clear-sky radiative transfer',
      },
      {
        columnIndex: 5,
        column: 'SKNT',
        reason: 'wind is not used in clear-sky radiative transfer',
      },
    ])
  })

  it('when names carry units in brackets or suffixes, maps the fields and takes the units from the header', () => {
    const header = ['Pressure (hPa)', 'T [K]', 'Td_C', 'RH%', 'MIXR g/kg', 'O3 (ppbv)', 'Height_km']
    const rows = [['1000', '288', '10', '70', '8', '30', '0.1']]
    const guess = guessColumnMapping(header, rows)
    expect(guess.mapping).toEqual({
      pressure: 0,
      temperature: 1,
      dewPoint: 2,
      relativeHumidity: 3,
      mixingRatio: 4,
      ozone: 5,
      height: 6,
    })
    expect(guess.units).toEqual({
      pressure: 'hPa',
      temperature: 'K',
      dewPoint: 'degC',
      relativeHumidity: 'percent',
      mixingRatio: 'gPerKg',
      ozone: 'ppbv',
      height: 'km',
    })
    for (const field of Object.keys(guess.mapping) as (keyof typeof guess.mapping)[]) {
      expect(guess.unitGuesses[field]?.basis, field).toBe('header')
    }
  })

  it('when names are single letters or spelled out, maps p, t, z, w, q and H2O', () => {
    const header = ['p', 't', 'z', 'w', 'q', 'H2O (ppmv)', 'Dew point', 'relative humidity']
    const guess = guessColumnMapping(header, [])
    expect(guess.mapping).toEqual({
      pressure: 0,
      temperature: 1,
      height: 2,
      mixingRatio: 3,
      specificHumidity: 4,
      waterVmr: 5,
      dewPoint: 6,
      relativeHumidity: 7,
    })
    expect(guess.units.waterVmr).toBe('ppmv')
  })

  it('when a name is unknown or a field repeats, lists the column as ignored with the reason', () => {
    const guess = guessColumnMapping(['PRES', 'TEMP', 'GPS fix', 'temperature', 'THTA'], [])
    expect(guess.mapping).toEqual({ pressure: 0, temperature: 1 })
    expect(guess.ignored.map((c) => [c.columnIndex, c.reason])).toEqual([
      [2, 'not recognised; expected names such as PRES, HGHT, TEMP, DWPT, RELH, MIXR or O3'],
      [3, "a second temperature column; column 2 'TEMP' is used"],
      [4, 'potential temperature is derived from pressure and temperature; not needed'],
    ])
  })
})

describe('guessColumnMapping — units from values', () => {
  // Thresholds of the guess (common practice): sea-level pressure ≈ 1013 hPa = 101 kPa;
  // air is always above 150 K and below 60 °C; soundings in metres reach thousands.
  it('when pressures exceed 2000, guesses Pa; up to 1100, hPa; up to 110, kPa', () => {
    const rows = (values: string[]) => values.map((v) => [v, '0'])
    expect(guessColumnMapping(['PRES', 'TEMP'], rows(['101300', '85000'])).units.pressure).toBe(
      'Pa',
    )
    expect(guessColumnMapping(['PRES', 'TEMP'], rows(['1013', '850'])).units.pressure).toBe('hPa')
    expect(guessColumnMapping(['PRES', 'TEMP'], rows(['101.3', '85'])).units.pressure).toBe('kPa')
  })

  it('when temperatures are below 100, guesses °C; otherwise K', () => {
    const rows = (values: string[]) => values.map((v) => ['1000', v])
    const celsius = guessColumnMapping(['PRES', 'TEMP'], rows(['24.0', '-55']))
    expect(celsius.units.temperature).toBe('degC')
    expect(celsius.unitGuesses.temperature).toMatchObject({ basis: 'values' })
    expect(celsius.unitGuesses.temperature?.reason).toBe(
      'values up to 24 are below 100: too cold for kelvin (air is above 150 K)',
    )
    expect(guessColumnMapping(['PRES', 'TEMP'], rows(['297', '218'])).units.temperature).toBe('K')
  })

  it('when heights reach at most 100, guesses km; RH up to 1.5, a fraction; ozone above 20, ppbv', () => {
    const guess = guessColumnMapping(
      ['PRES', 'TEMP', 'HGHT', 'RELH', 'O3'],
      [
        ['1000', '15', '0.1', '0.8', '35'],
        ['500', '-20', '5.6', '0.3', '80'],
      ],
    )
    expect(guess.units).toMatchObject({ height: 'km', relativeHumidity: 'fraction', ozone: 'ppbv' })
  })

  it('when a units line is present, takes the units from it', () => {
    const { guess } = guessFor(fixture('whitespace-k-pa-rh.txt'))
    expect(guess.units).toEqual({
      pressure: 'Pa',
      height: 'm',
      temperature: 'K',
      relativeHumidity: 'percent',
    })
    expect(guess.unitGuesses.pressure).toMatchObject({
      basis: 'units-row',
      reason: "the units line says 'Pa'",
    })
  })

  it('when the header says hPa but the values look like Pa, keeps hPa and reports the conflict', () => {
    const guess = guessColumnMapping(
      ['p (hPa)', 'T'],
      [
        ['101300', '15'],
        ['85000', '6'],
      ],
    )
    expect(guess.units.pressure).toBe('hPa')
    expect(guess.unitGuesses.pressure?.conflict).toBe(
      'but the largest value, 101300, is above 2000: too large for hPa, which suggests Pa',
    )
  })

  it('when no number is available, falls back to the default unit and says so', () => {
    const guess = guessColumnMapping(['PRES', 'TEMP'], [['////', '-9999']])
    expect(guess.unitGuesses.pressure).toMatchObject({ unit: 'hPa', basis: 'default' })
    expect(guess.unitGuesses.temperature).toMatchObject({ unit: 'K', basis: 'default' })
  })
})

describe('describeGuess', () => {
  it('when describing the semicolon fixture, explains each column with unit and reason', () => {
    const { parsed, guess } = guessFor(fixture('semicolon-gkg-no-heights.csv'))
    const lines = describeGuess(guess, parsed.header).map((d) => d.text)
    expect(lines).toEqual([
      "Column 1 'pressure_hPa': pressure in hPa: the header 'pressure_hPa' says hPa.",
      "Column 2 'temperature_C': temperature in °C: the header 'temperature_C' says °C.",
      "Column 3 'mixing_ratio_g/kg': mixing ratio in g/kg: the header 'mixing_ratio_g/kg' says g/kg.",
    ])
  })

  it('when two humidity columns are mapped, says which one is not used', () => {
    const guess = guessColumnMapping(
      ['PRES', 'TEMP', 'RELH', 'DWPT', 'SKNT'],
      [['1000', '15', '70', '10', '5']],
    )
    expect(pickHumiditySource(guess.mapping)).toBe('dewPoint')
    const described = describeGuess(guess, ['PRES', 'TEMP', 'RELH', 'DWPT', 'SKNT'])
    expect(described[2].text).toMatch(
      /Not used for water vapour while the dew point column is mapped\.$/,
    )
    expect(described[4]).toMatchObject({
      field: null,
      text: "Column 5 'SKNT': not used — wind is not used in clear-sky radiative transfer.",
    })
  })
})
