import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { type E2eApp, openReportedPage, signInThroughPage, startE2eApp } from '../support/e2e-app'
import type { TestApp } from '../support/test-app'

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

describe('a run from the demo data', () => {
  it('is submitted from the form, its progress bar reaches 100 %, and its results appear', async ({ onTestFailed }) => {
    const page = await openReportedPage(browser, onTestFailed)
    await signInThroughPage(page, base, t.account('analyst'))

    await page.goto(`${base}/runs/new`)
    await page.waitForSelector('[data-test=new-run-page]')
    // A narrow window around the CO₂ band centre keeps the test quick.
    await page.fill('input[name=startCm]', '660')
    await page.fill('input[name=endCm]', '680')
    await page.fill('input[name=chunkWidth]', '5')
    await page.fill('input[name=runName]', 'Browser test run')
    await page.locator('input[name=runName]').press('Tab')
    await page.click('[data-test=submit-run]')

    await page.waitForSelector('[data-test=run-page]')
    expect(await page.textContent('[data-test=run-page] h2')).toContain('Browser test run')
    // Progress fills in chunk by chunk; the bar ends at 100 % and the results appear under it.
    await page.waitForSelector('[data-test=run-progress]')
    await page.waitForSelector('[data-test=run-summary]', { timeout: 120_000 })
    expect(await page.getAttribute('[data-test=run-progress] [data-percent]', 'data-percent')).toBe(
      '100',
    )
    expect(await page.textContent('[data-test=run-progress-text]')).toMatch(/4 of 4 chunks/)
    const summary = await page.textContent('[data-test=run-summary]')
    expect(summary).toMatch(/Outgoing longwave radiation\s*[\d.]+/)
    expect(await page.locator('[data-test=chart-frame]').count()).toBeGreaterThanOrEqual(4)
    const status = await page.getAttribute('[data-status]', 'data-status')
    expect(status).toBe('succeeded')

    await page.goto(`${base}/runs`)
    await page.waitForSelector('[data-test=runs-page] [data-run-id]')
    expect(await page.textContent('[data-test=runs-page]')).toContain('Browser test run')
    await page.close()
  })

  it('when its owner deletes a finished run from its page, the run is gone from the list', async ({ onTestFailed }) => {
    // The browser context is still signed in as the analyst who made the run above.
    const page = await openReportedPage(browser, onTestFailed)
    await page.goto(`${base}/runs`)
    await page.waitForSelector('[data-test=runs-page] [data-run-id]')
    const runId = await page.getAttribute('[data-test=runs-page] [data-run-id]', 'data-run-id')
    await page.goto(`${base}/runs/${runId}`)
    await page.waitForSelector('[data-test=run-summary]')
    await page.click('[data-test=delete-run]')
    await page.getByRole('button', { name: 'Confirm' }).click()
    await page.waitForURL(`${base}/runs`)
    await page.waitForSelector('[data-test=runs-page]')
    expect(await page.locator(`[data-test=runs-page] [data-run-id="${runId}"]`).count()).toBe(0)
    expect((await page.request.get(`${base}/api/runs/${runId}`)).status()).toBe(404)
    await page.close()
  })
})
