import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Role } from '../../shared/schemas/auth'
import { signedInAgent } from '../support/http-agent'
import { createPresetProfile, QUICK_RUN_SETTINGS, waitForRun } from '../support/runs'
import { type E2eApp, openReportedPage, type OnTestFailed, signInThroughPage, startE2eApp } from '../support/e2e-app'
import type { TestApp } from '../support/test-app'

let t: TestApp
let app: E2eApp
let base: string
let browser: E2eApp['browser']
let runId: number

beforeAll(async () => {
  app = await startE2eApp({ runs: { threads: 1 } })
  t = app.t
  base = app.base
  browser = app.browser
  const analyst = await signedInAgent(t, 'analyst')
  const profileId = await createPresetProfile(analyst)
  const created = await analyst
    .post('/api/runs', { name: 'Run to sign off', profileId, settings: QUICK_RUN_SETTINGS })
    .expect(202)
  runId = created.body.run.id
  expect((await waitForRun(analyst, runId)).status).toBe('succeeded')
})

afterAll(async () => {
  await app?.close()
})

async function signIn(role: Role, onTestFailed: OnTestFailed): Promise<Page> {
  // One browser profile for both tests: start each signed out.
  await browser.context.clearCookies()
  const page = await openReportedPage(browser, onTestFailed)
  await signInThroughPage(page, base, t.account(role))
  return page
}

describe('reviews in the browser', () => {
  it('when a reviewer signs a run off from the queue, it leaves the queue and its page shows a matching signature', async ({ onTestFailed }) => {
    const page = await signIn('reviewer', onTestFailed)
    await page.click('[data-area=reviews]')
    const row = `[data-test=reviews-page] [data-run-id="${runId}"]`
    await page.waitForSelector(row)
    expect(await page.textContent(row)).toContain('Run to sign off')
    expect(await page.textContent(row)).toContain('Ines Varga')
    await page.click(`${row} [data-test=open-review]`)
    await page.waitForSelector('[data-test=review-drawer]')

    // Asking for changes needs a comment: the form says so before anything is sent.
    await page.click('[data-test=review-state-changes-requested]')
    await page.click('[data-test=review-submit]')
    await page.waitForSelector('[data-test=review-drawer] >> text=Say what should change.')

    await page.click('[data-test=review-state-signed-off]')
    await page.fill('textarea[name=reviewComment]', 'Band centre and fluxes checked.')
    await page.click('[data-test=review-submit]')
    await page.waitForSelector('[data-test=review-drawer]', { state: 'detached' })
    await page.waitForSelector(row, { state: 'detached' })

    await page.goto(`${base}/runs/${runId}`)
    const badge = await page.waitForSelector('[data-test=run-signed-off]')
    expect(await badge.textContent()).toContain('Signed off by Tomas Okafor')
    expect(await page.textContent('[data-test=run-review-panel]')).toContain(
      'Band centre and fluxes checked.',
    )
    expect(await page.$('[data-test=review-form]')).toBeNull()
    await page.click('[data-test=verify-signature]')
    const result = await page.waitForSelector('[data-test=verify-result]')
    expect(await result.getAttribute('data-valid')).toBe('true')

    await page.goto(`${base}/runs`)
    await page.waitForSelector(`[data-run-id="${runId}"] [data-test=run-signed-off]`)
    await page.close()
  })

  it('when an analyst opens the reviews page, sees "not for your role" and no Reviews link', async ({ onTestFailed }) => {
    const page = await signIn('analyst', onTestFailed)
    expect(await page.$('[data-area=reviews]')).toBeNull()
    await page.goto(`${base}/reviews`)
    await page.waitForSelector('[data-test=forbidden]')
    expect(await page.$('[data-test=reviews-page]')).toBeNull()
    await page.close()
  })
})
