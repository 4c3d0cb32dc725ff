import { readFileSync } from 'node:fs'
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { type E2eApp, openReportedPage, signInThroughPage, startE2eApp } from '../support/e2e-app'
import type { TestApp } from '../support/test-app'

// Six invented CO2 lines near 667 cm⁻¹ (tests/fixtures/line-lists/README.md).
const FIXTURE = 'tests/fixtures/line-lists/co2-667.par'
const MALFORMED = 'tests/fixtures/line-lists/malformed.par'

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

beforeEach(async ({ onTestFailed }) => {
  page = await openReportedPage(browser, onTestFailed)
})

afterAll(async () => {
  await app?.close()
})

const text = (selector: string) => page.locator(selector).first().innerText()

/** The CSV behind the stick chart, as downloaded by the chart's button. */
async function downloadSticksCsv(): Promise<string[]> {
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.click('[data-test=chart-sticks] [data-test=chart-csv]'),
  ])
  return readFileSync((await download.path())!, 'utf8')
    .split('\r\n')
    .filter(Boolean)
}

describe('line catalogues in the browser', () => {
  it('when an analyst uploads a line list, the summary shows, saving opens the catalogue with its stick chart and range selector', async () => {
    const { email, password } = t.account('analyst')
    await signInThroughPage(page, base, { email, password })

    await page.goto(`${base}/catalogues`)
    await page.waitForSelector('[data-test=catalogue-table] >> text=Built-in catalogue')
    await page.click('[data-test=import-line-list]')
    expect(await text('[data-test=line-list-limits]')).toContain('512 MiB')

    // A file with bad records: every problem by line and field, nothing to save.
    await page.setInputFiles('[data-test=line-list-file]', MALFORMED)
    await page.waitForSelector('[data-test=import-errors] table')
    expect(
      await page
        .locator('[data-test=import-errors] tr[data-line]')
        .evaluateAll((rows) =>
          rows.map((r) => [r.getAttribute('data-line'), r.getAttribute('data-field')]),
        ),
    ).toEqual([
      ['3', 'wavenumberCm'],
      ['5', 'record'],
      ['6', 'airHalfWidthCmPerAtm'],
    ])
    expect(await page.$('[data-test=save-catalogue]')).toBeNull()

    await page.setInputFiles('[data-test=line-list-file]', FIXTURE)
    await page.waitForSelector('[data-test=import-summary]')
    expect(await text('[data-test=summary-lines]')).toBe('6')
    expect(await text('[data-test=summary-range]')).toBe('662.4–676.0 cm⁻¹')
    expect(await text('[data-test=summary-band]')).toContain('4 lines')
    expect(await text('[data-test=import-summary] [data-test=molecule-table]')).toContain('626')
    await page.fill('input[name=catalogueName]', 'Six CO2 lines')
    await page.click('[data-test=save-catalogue]')

    await page.waitForURL(/\/catalogues\/\d+$/)
    await page.waitForSelector('[data-test=chart-sticks] canvas')
    expect(await text('[data-test=catalogue-title]')).toBe('Six CO2 lines')
    expect(await text('[data-test=catalogue-lines]')).toBe('6')
    expect(await text('[data-test=provenance]')).toContain('co2-667.par')
    const whole = await downloadSticksCsv()
    expect(whole[0]).toBe(
      'molecule,source,wavenumber (cm-1),intensity (cm-1/(molecule cm-2)),log10 intensity',
    )
    expect(whole).toHaveLength(1 + 6)
    expect(whole[3]).toMatch(/^CO2,catalogue,667\.3796,3\.305e-18,-17\.48/)

    // Zoom to 660–668 cm⁻¹: three of the six lines.
    await page.fill('input[name=sticksFrom]', '660')
    await page.fill('input[name=sticksTo]', '668')
    await page.click('[data-test=sticks-apply]')
    await page.waitForFunction(() =>
      document.querySelector('[data-test=chart-sticks]')?.textContent?.includes('3 lines in range'),
    )
    expect(await downloadSticksCsv()).toHaveLength(1 + 3)

    // The new-run form offers it.
    const id = page.url().split('/').pop()
    await page.click('[data-test=run-with-catalogue]')
    await page.waitForURL(new RegExp(`/runs/new\\?catalogue=${id}$`))
    await page.waitForFunction(() =>
      document.querySelector('[data-test=run-catalogue]')?.textContent?.includes('Six CO2 lines'),
    )
  })

  it('when anyone opens the built-in catalogue, the accuracy caution, bands with confidence tags and the stick chart show', async () => {
    await page.goto(`${base}/catalogues/builtin`)
    await page.waitForSelector('[data-test=chart-sticks] canvas')
    expect(await text('[data-test=accuracy-caution]')).toContain('not a measured line list')
    expect(await page.locator('[data-test=band-table] tbody tr').count()).toBeGreaterThan(20)
    expect(
      await page.locator('[data-test=band-table] [data-confidence=MEMORY-low]').count(),
    ).toBeGreaterThan(0)
  })
})
