import { readFileSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { type E2eApp, openReportedPage, signInThroughPage, startE2eApp } from '../support/e2e-app'
import type { TestApp } from '../support/test-app'

// The full-resolution window from the analyst's side: asked for in the new-run form, shown and
// downloadable on the run page. Only function is checked here; speed is measured by the bench.
let t: TestApp
let app: E2eApp
let base: string
let browser: E2eApp['browser']

beforeAll(async () => {
  app = await startE2eApp({ runs: { threads: 1 }, seedWorkspace: true })
  t = app.t
  base = app.base
  browser = app.browser
})

afterAll(async () => {
  await app?.close()
})

const DETAIL = '[data-test=run-detail-spectrum]'

describe('the full-resolution window of a run', () => {
  it('when the window leaves the range the form says so and sends nothing; a valid one is charted and downloadable', async ({ onTestFailed }) => {
    const page = await openReportedPage(browser, onTestFailed)
    await signInThroughPage(page, base, t.account('analyst'))

    await page.goto(`${base}/runs/new`)
    await page.waitForSelector('[data-test=new-run-page]')
    await page.fill('input[name=startCm]', '660')
    await page.fill('input[name=endCm]', '680')
    await page.fill('input[name=chunkWidth]', '5')
    await page.fill('input[name=runName]', 'Window test run')
    await page.locator('input[name=runName]').press('Tab')

    // Arrange a window that starts below the run's range.
    await page.click('[data-test=detail-window-switch]')
    await page.fill('input[name=detailStartCm]', '650')
    await page.fill('input[name=detailEndCm]', '670')
    await page.locator('input[name=detailEndCm]').press('Tab')
    expect(await page.textContent('[data-test=detail-window-problem]')).toContain(
      "must lie inside the run's range, 660–680 cm⁻¹",
    )
    const runsBefore = await page.evaluate(
      async () => (await (await fetch('/api/runs')).json()).total,
    )
    await page.click('[data-test=submit-run]')
    expect(await page.textContent('[data-test=new-run-error]')).toContain("inside the run's range")
    expect(await page.locator('[data-test=new-run-page]').count()).toBe(1)
    expect(await page.evaluate(async () => (await (await fetch('/api/runs')).json()).total)).toBe(
      runsBefore,
    )

    // A window inside the range goes through.
    await page.fill('input[name=detailStartCm]', '666')
    await page.locator('input[name=detailStartCm]').press('Tab')
    await page.fill('input[name=detailEndCm]', '668')
    await page.locator('input[name=detailEndCm]').press('Tab')
    expect(await page.locator('[data-test=detail-window-problem]').count()).toBe(0)
    await page.click('[data-test=submit-run]')
    await page.waitForSelector('[data-test=run-page]')
    await page.waitForSelector('[data-test=run-summary]', { timeout: 120_000 })

    const chart = page.locator(`${DETAIL} [data-points-drawn]`)
    await chart.waitFor({ timeout: 30_000 })
    const runId = Number(/\/runs\/(\d+)/.exec(page.url())![1])
    const detail = await page.evaluate(
      async (id) => (await fetch(`/api/runs/${id}/results/detail`)).json(),
      runId,
    )
    expect(detail.pointCount).toBeGreaterThan(100)
    const text = (await page.textContent(DETAIL))!
    expect(text).toContain('Full-resolution window 666–668 cm⁻¹')
    expect(text.replace(/\D/g, '')).toContain(String(detail.pointCount))
    expect(text).toContain('not evenly spaced')
    expect(await chart.locator('canvas').count()).toBeGreaterThan(0)
    expect(Number(await chart.getAttribute('data-points-drawn'))).toBeGreaterThan(0)
    expect(Number(await chart.getAttribute('data-points-drawn'))).toBeLessThanOrEqual(
      detail.pointCount,
    )

    // The server's CSV of every quantity is linked and answers.
    const href = await page.getAttribute(`${DETAIL} [data-test=detail-csv]`, 'href')
    expect(href).toBe(`/api/runs/${runId}/results.csv?table=detail`)
    const csvStatus = await page.evaluate(async (url) => (await fetch(url)).status, href!)
    expect(csvStatus).toBe(200)

    // Another quantity, and its full-resolution CSV from the chart itself.
    await page.click(`${DETAIL} [data-test=detail-quantity]`)
    await page.click('.n-base-select-option:has-text("Column transmittance")')
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.click(`${DETAIL} [data-test=chart-csv]`),
    ])
    expect(download.suggestedFilename()).toBe(
      `run-${runId}-full-resolution-columnTransmittance.csv`,
    )
    const lines = readFileSync((await download.path())!, 'utf8')
      .trim()
      .split('\r\n')
    expect(lines[0]).toBe('wavenumber (cm-1),Column transmittance (0–1)')
    expect(lines).toHaveLength(detail.pointCount + 1)
    expect(Number(lines[1].split(',')[0])).toBe(detail.wavenumberCm[0])
    expect(Number(lines[1].split(',')[1])).toBe(detail.columnTransmittance[0])
    await page.close()
  })
})
