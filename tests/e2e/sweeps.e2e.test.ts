import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { type E2eApp, openReportedPage, signInThroughPage, startE2eApp } from '../support/e2e-app'

// A concentration sweep from the analyst's side: asked for in the new-run form, followed and read
// on its own page, each member a run of its own. Function only; speed is measured by the bench.
let app: E2eApp

beforeAll(async () => {
  app = await startE2eApp({ runs: { threads: 1 }, seedWorkspace: true })
})

afterAll(async () => {
  await app?.close()
})

describe('a concentration sweep', () => {
  it('refuses a bad amount in the form, then runs every amount and shows forcing, fit, chart and downloads', async ({ onTestFailed }) => {
    const { base, browser, t } = app
    const page = await openReportedPage(browser, onTestFailed)
    await signInThroughPage(page, base, t.account('analyst'))
    await page.goto(`${base}/runs/new`)
    await page.waitForSelector('[data-test=new-run-page]')
    await page.fill('input[name=startCm]', '660')
    await page.fill('input[name=endCm]', '680')
    await page.fill('input[name=chunkWidth]', '5')
    await page.locator('input[name=chunkWidth]').press('Tab')

    await page.click('[data-test=sweep-switch]')
    await page.fill('input[name=sweepAmounts]', '280, 560, lots')
    await page.locator('input[name=sweepAmounts]').press('Tab')
    expect(await page.textContent('[data-test=sweep-problem]')).toContain('Amount 3 (“lots”) is not a number ≥ 0.')
    const runsBefore = await page.evaluate(async () => (await (await fetch('/api/runs')).json()).total)
    await page.click('[data-test=submit-run]')
    expect(await page.textContent('[data-test=new-run-error]')).toContain('Amount 3')
    expect(await page.evaluate(async () => (await (await fetch('/api/runs')).json()).total)).toBe(runsBefore)

    await page.fill('input[name=sweepAmounts]', '280, 560, 1120')
    await page.locator('input[name=sweepAmounts]').press('Tab')
    expect(await page.textContent('[data-test=submit-run]')).toContain('Start the sweep (3 runs)')
    await page.click('[data-test=submit-run]')
    await page.waitForSelector('[data-test=sweep-page]')
    await page.waitForSelector('[data-test=sweep-fit]', { timeout: 120_000 })

    const rows = page.locator('[data-test=sweep-members] tbody tr')
    expect(await rows.count()).toBe(3)
    expect(await rows.nth(0).textContent()).toContain('280 (reference)')
    expect(await rows.nth(0).textContent()).toContain('0.000')
    expect(await page.textContent('[data-test=sweep-fit]')).toContain('Per doubling')
    expect(await page.locator('[data-test=chart-frame] canvas').count()).toBeGreaterThan(0)
    expect(await page.textContent('[data-test=cautions]')).toContain('Clear sky only')

    const sweepId = Number(/\/sweeps\/(\d+)/.exec(page.url())![1])
    const csv = await page.evaluate(async (id) => (await fetch(`/api/sweeps/${id}/forcing.csv`)).text(), sweepId)
    expect(csv.split('\n')[0]).toBe('CO2_ppmv,run_id,status,olr_W_m-2,forcing_top_W_m-2,forcing_tropopause_W_m-2,forcing_surface_W_m-2')
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('[data-test=chart-csv]')])
    expect(download.suggestedFilename()).toBe(`tauline-sweep-${sweepId}-forcing-chart.csv`)

    // A member is a run of its own, linked back to its sweep.
    await rows.nth(1).locator('a').click()
    await page.waitForSelector('[data-test=run-page]')
    expect(await page.textContent('[data-test=run-sweep-link]')).toBe(`sweep #${sweepId}`)

    // The runs list names each member's sweep, and the link leads there, not to the run.
    await page.goto(`${base}/runs`)
    const sweepLinks = page.locator('[data-test=run-sweep]')
    await sweepLinks.first().waitFor()
    expect(await sweepLinks.count()).toBe(3)
    await sweepLinks.first().click()
    await page.waitForSelector('[data-test=sweep-page]')
    expect(page.url()).toBe(`${base}/sweeps/${sweepId}`)

    // Sweeps are listed among the comparisons, with their status and amounts.
    await page.click('[data-area=comparisons]')
    const listed = page.locator(`[data-test=sweeps-list] [data-sweep-id="${sweepId}"]`)
    await listed.waitFor()
    expect(await listed.textContent()).toContain('CO₂ 280, 560, 1120 ppmv (reference 280)')
    await listed.locator('a').click()
    await page.waitForSelector('[data-test=sweep-page]')
    expect(page.url()).toBe(`${base}/sweeps/${sweepId}`)
    await page.close()
  }, 180_000)
})
