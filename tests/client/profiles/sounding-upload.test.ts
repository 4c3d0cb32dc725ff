import { readFileSync } from 'node:fs'
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises } from '@vue/test-utils'
import { describeGuess, guessColumnMapping } from '@shared/profiles/sounding/columns'
import { parseSoundingText } from '@shared/profiles/sounding/parse'
import * as api from '@/api/profiles'
import SoundingFileDrop from '@/components/profiles/SoundingFileDrop.vue'
import {
  choicesFromGuess,
  optionsFromChoices,
  withField,
} from '@/components/profiles/sounding-mapping'
import { mountAt } from './mount-helpers'

vi.mock('@/api/profiles', () => ({
  previewSounding: vi.fn(),
  convertSounding: vi.fn(),
  saveSounding: vi.fn(),
}))

const FIXTURE = 'tests/fixtures/soundings/comma-degc-hpa-dewpoint.csv'
const text = readFileSync(FIXTURE, 'utf8')

/** What the server answers for the fixture: the same shared parser and guess it uses. */
function previewOfFixture(): api.SoundingPreview {
  const parsed = parseSoundingText(text)
  const guess = guessColumnMapping(parsed.header, parsed.rows, {
    unitsRow: parsed.unitsRow,
    decimalSeparator: parsed.decimalSeparator,
  })
  return {
    fileName: 'comma-degc-hpa-dewpoint.csv',
    delimiter: parsed.delimiter,
    header: parsed.header,
    unitsRow: parsed.unitsRow ?? null,
    rowCount: parsed.rows.length,
    sampleRows: parsed.rows.slice(0, 12),
    sampleLineNumbers: parsed.lineNumbers.slice(0, 12),
    comments: parsed.comments,
    guess,
    guessDescription: describeGuess(guess, parsed.header),
  }
}

beforeEach(() => {
  vi.mocked(api.previewSounding).mockResolvedValue(previewOfFixture())
  vi.mocked(api.convertSounding).mockResolvedValue({
    levels: [],
    report: {
      dropped: [],
      repaired: [],
      heightsFilled: false,
      order: 'surface-first',
      ozoneFromClimatology: false,
      levelLineNumbers: [],
      warnings: [],
    },
  })
})
afterEach(() => {
  vi.clearAllMocks()
  document.body.innerHTML = ''
})

describe('the column mapping of an upload', () => {
  it('when made from the guess, maps PRES/HGHT/TEMP/DWPT with their units and leaves the wind unused', () => {
    const preview = previewOfFixture()
    const choices = choicesFromGuess(preview.guess, preview.header.length)
    // The fixture's header: PRES,HGHT,TEMP,DWPT,DRCT,SKNT (values in hPa, m, °C, °C; see its comment lines)
    expect(choices).toEqual([
      { field: 'pressure', unit: 'hPa' },
      { field: 'height', unit: 'm' },
      { field: 'temperature', unit: 'degC' },
      { field: 'dewPoint', unit: 'degC' },
      { field: null, unit: null },
      { field: null, unit: null },
    ])
  })

  it('when a field is given to another column, the first column becomes unused and the unit resets', () => {
    const preview = previewOfFixture()
    const moved = withField(choicesFromGuess(preview.guess, 6), 4, 'temperature', preview.guess)
    expect(moved[2]).toEqual({ field: null, unit: null })
    expect(moved[4]).toEqual({ field: 'temperature', unit: 'K' })
    expect(optionsFromChoices(moved).mapping.temperature).toBe(4)
    const back = withField(moved, 2, 'temperature', preview.guess)
    expect(back[2]).toEqual({ field: 'temperature', unit: 'degC' })
  })

  it('when pressure is unmapped, says so and offers no options', () => {
    const preview = previewOfFixture()
    const choices = withField(choicesFromGuess(preview.guess, 6), 0, null, preview.guess)
    expect(optionsFromChoices(choices).missing).toEqual(['a pressure column'])
  })
})

describe('the upload wizard', { timeout: 30_000 }, () => {
  it('when a file is chosen, shows the mapping pre-filled from the guess, and Check sends that mapping', async () => {
    const { wrapper } = await mountAt('/profiles/upload')
    const file = new File([text], 'comma-degc-hpa-dewpoint.csv', { type: 'text/csv' })
    wrapper.findComponent(SoundingFileDrop).vm.$emit('file', file)
    await flushPromises()

    expect(api.previewSounding).toHaveBeenCalledWith(file)
    const shown = (i: number, what: 'field' | 'unit') =>
      document.querySelector(`[data-test=map-${what}-${i}]`)?.textContent?.trim()
    expect(shown(0, 'field')).toBe('Pressure')
    expect(shown(0, 'unit')).toBe('hPa')
    expect(shown(2, 'field')).toBe('Temperature')
    expect(shown(2, 'unit')).toBe('°C')
    expect(shown(3, 'field')).toBe('Dew point')
    expect(shown(4, 'field')).toBe('Not used')
    expect(document.querySelector('[data-column="4"]')!.classList.contains('unused')).toBe(true)
    const reasons = document.querySelector('[data-test=guess-reasons]')!.textContent!
    expect(reasons).toContain(
      "Column 5 'DRCT': not used — wind is not used in clear-sky radiative transfer",
    )

    await wrapper.find('[data-test=check-sounding]').trigger('click')
    await flushPromises()
    expect(api.convertSounding).toHaveBeenCalledOnce()
    const [sent, options] = vi.mocked(api.convertSounding).mock.calls[0]
    expect(sent).toBe(file)
    expect(options.mapping).toEqual({ pressure: 0, height: 1, temperature: 2, dewPoint: 3 })
    expect(options.units).toEqual({
      pressure: 'hPa',
      height: 'm',
      temperature: 'degC',
      dewPoint: 'degC',
    })
    expect(options.name).toBe('comma-degc-hpa-dewpoint')
    expect(options.extendAbove).toBeUndefined()
    wrapper.unmount()
  })

  it('when the server reports bad rows, lists them by line and column', async () => {
    const { ApiError } = await import('@/api/http')
    vi.mocked(api.convertSounding).mockRejectedValueOnce(
      new ApiError(400, 'SOUNDING_INVALID', '1 problem(s) in the sounding: …', {
        errors: [
          {
            code: 'NOT_A_NUMBER',
            lineNumber: 9,
            column: 'TEMP',
            field: 'temperature',
            value: 'x',
            expected: 'a number',
            message: "temperature 'x' is not a number.",
          },
        ],
        errorCount: 1,
      }),
    )
    const { wrapper } = await mountAt('/profiles/upload')
    wrapper.findComponent(SoundingFileDrop).vm.$emit('file', new File([text], 'a.csv'))
    await flushPromises()
    await wrapper.find('[data-test=check-sounding]').trigger('click')
    await flushPromises()
    const line = document.querySelector('[data-test=check-error]')!.textContent!
    expect(line).toContain('Line 9, column ‘TEMP’')
    expect(line).toContain("temperature 'x' is not a number.")
    wrapper.unmount()
  })
})
