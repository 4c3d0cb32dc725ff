import { readFileSync } from 'node:fs'
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { type E2eApp, openReportedPage, signInThroughPage, startE2eApp } from '../support/e2e-app'
import type { TestApp } from '../support/test-app'

const FIXTURE = 'tests/fixtures/soundings/comma-degc-hpa-dewpoint.csv'

let t: TestApp
let app: E2eApp
let base: string
let browser: E2eApp['browser']
let page: Page

beforeAll(async () => {
  app = await startE2eApp({})
  t = app.t
  base = app.base
  browser = app.browser
})

afterAll(async () => {
  await app?.close()
})

beforeEach(async ({ onTestFailed }) => {
  await browser.context.clearCookies()
  page = await openReportedPage(browser, onTestFailed)
})

async function signInAsAnalyst() {
  const { email, password } = t.account('analyst')
  await signInThroughPage(page, base, { email, password })
}

const text = (selector: string) => page.locator(selector).first().innerText()

/** Picks an option in an open naive-ui select menu by its exact label. */
async function pickOption(trigger: string, label: string) {
  await page.click(trigger)
  await page.locator('.n-base-select-option', { hasText: new RegExp(`^${label}$`) }).click()
}

describe('atmospheres in the browser', () => {
  it('when an analyst uploads a sounding, the mapping is pre-filled, Check shows the chart, and Save opens the editor where a bad pressure is flagged', async () => {
    await signInAsAnalyst()
    await page.goto(`${base}/profiles/upload`)
    await page.waitForSelector('[data-test=sounding-limits]')
    expect(await text('[data-test=sounding-limits]')).toContain('2 MiB')

    await page.setInputFiles('[data-test=sounding-file]', FIXTURE)
    await page.waitForSelector('[data-test=mapping-table]')
    expect((await text('[data-test=map-field-0]')).trim()).toBe('Pressure')
    expect((await text('[data-test=map-unit-0]')).trim()).toBe('hPa')
    expect((await text('[data-test=map-field-2]')).trim()).toBe('Temperature')
    expect((await text('[data-test=map-unit-2]')).trim()).toBe('°C')
    expect((await text('[data-test=map-field-3]')).trim()).toBe('Dew point')
    expect((await text('[data-test=map-field-4]')).trim()).toBe('Not used')
    expect(await text('[data-test=guess-reasons]')).toContain('wind is not used')

    // A wrong unit and back: the choice sticks, the guess explanation follows it.
    await pickOption('[data-test=map-unit-2]', 'K')
    expect((await text('[data-test=map-unit-2]')).trim()).toBe('K')
    await pickOption('[data-test=map-unit-2]', '°C')
    expect((await text('[data-test=map-unit-2]')).trim()).toBe('°C')

    await page.click('[data-test=check-sounding]')
    await page.waitForSelector('[data-test=step-check] [data-test=chart-temperature] canvas')
    expect(await text('[data-test=sounding-report]')).toMatch(/8\s+levels: 8 from the file/)

    await page.fill('input[name=soundingName]', 'Launch EXAMPLE-1')
    await page.click('[data-test=save-sounding]')
    await page.waitForURL(/\/profiles\/\d+$/)
    await page.waitForSelector('[data-test=profile-editor] [data-test=chart-temperature] canvas')
    expect(await text('[data-test=profile-title]')).toBe('Launch EXAMPLE-1')
    expect(await page.inputValue('input[name=pressure-0]')).toBe('1000')
    expect(await page.$('[data-test=validation-ok]')).not.toBeNull()

    // The chart's data: exactly the plotted points, as CSV.
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.click('[data-test=chart-temperature] [data-test=chart-csv]'),
    ])
    const csv = readFileSync((await download.path())!, 'utf8')
    expect(csv.split('\r\n')[0]).toBe('pressure (hPa),temperature (K)')
    expect(csv.split('\r\n')).toHaveLength(1 + 8)

    // Level 3 (850 hPa) typed as 950 hPa: above the 925 hPa below it.
    await page.fill('input[name=pressure-2]', '950')
    await page.press('input[name=pressure-2]', 'Enter')
    await page.waitForSelector('[data-test=validation-errors]')
    expect(await text('[data-test=validation-errors]')).toContain(
      'Level 3: pressure 950 hPa is not lower than the level below (Level 2, 925 hPa)',
    )
    expect(await page.getAttribute('input[name=pressure-2]', 'data-severity')).toBe('error')
    await page.close()
  })

  it('when an analyst starts from a preset, adjusts it, continues to the editor and saves, the new atmosphere is listed', async () => {
    await signInAsAnalyst()
    await page.goto(`${base}/profiles`)
    await page.waitForSelector('[data-test=profiles-page]')
    await page.click('[data-test=new-profile]')
    await page.click('text=From a preset…')
    await page.waitForSelector('[data-test=preset-dialog]')
    await page.click('[data-preset=us-standard-1976]')
    expect(await page.isDisabled('input[name=presetTropopause]')).toBe(true)
    await page.click('[data-preset=mid-latitude-winter]')
    expect(await page.isDisabled('input[name=presetTropopause]')).toBe(false)
    await page.fill('input[name=presetLevels]', '31')
    await page.press('input[name=presetLevels]', 'Tab')
    await page.waitForFunction(() =>
      document.querySelector('[data-test=preset-preview]')?.textContent?.includes('Levels 31'),
    )
    await page.waitForSelector('[data-test=preset-preview] [data-test=chart-temperature] canvas')
    await page.click('[data-test=preset-continue]')

    await page.waitForURL(/\/profiles\/new\?preset=mid-latitude-winter/)
    await page.waitForSelector('[data-test=profile-editor] [data-test=chart-humidity] canvas')
    expect(await page.locator('[data-test=level-table] tbody tr').count()).toBe(31)
    await page.fill('input[name=profileName]', 'Winter, 31 levels')
    await page.click('[data-test=save-profile]')
    await page.waitForURL(/\/profiles\/\d+$/)
    await page.waitForSelector('[data-test=column-totals] [data-total=pw]')

    await page.click('text=← All atmospheres')
    await page.waitForSelector('text=Winter, 31 levels')
    await page.close()
  })
})
