import { readFileSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { signedInAgent } from '../support/http-agent'
import { createPresetProfile, QUICK_RUN_SETTINGS, waitForRun } from '../support/runs'
import { type E2eApp, openReportedPage, signInThroughPage, startE2eApp } from '../support/e2e-app'

// Two runs compared from a reviewer's side: picked in the page, read as forcing, charts and
// downloads, swapped, and refused with a reason when their bins differ.
let app: E2eApp
const ids: { reference: number; doubled: number; narrower: number } = { reference: 0, doubled: 0, narrower: 0 }

beforeAll(async () => {
  app = await startE2eApp({ runs: { threads: 1 } })
  const a = await signedInAgent(app.t, 'analyst')
  const profileId = await createPresetProfile(a)
  const submit = async (name: string, ppmv: number, settings = QUICK_RUN_SETTINGS) => {
    const mixtureId = (await a.post('/api/mixtures', { name, gases: { CO2: { mode: 'uniform', vmr: ppmv * 1e-6 } } }).expect(201)).body.mixture.id
    const id = (await a.post('/api/runs', { name, profileId, mixtureId, settings }).expect(202)).body.run.id as number
    expect((await waitForRun(a, id)).status).toBe('succeeded')
    return id
  }
  ids.reference = await submit('Scenario K reference', 400)
  ids.doubled = await submit('Scenario K doubled', 800)
  ids.narrower = await submit('Scenario K narrow', 400, { ...QUICK_RUN_SETTINGS, endCm: 670 })
})

afterAll(async () => {
  await app?.close()
})

describe('comparing two runs in the browser', () => {
  it('starts from a run, picks the other, shows forcing, input differences, charts and downloads, swaps them, and explains a refusal', async ({ onTestFailed }) => {
    const { base, browser, t } = app
    const page = await openReportedPage(browser, onTestFailed)
    await signInThroughPage(page, base, t.account('reviewer'))
    // From the reference run's own page.
    await page.goto(`${base}/runs/${ids.reference}`)
    await page.click('[data-test=compare-run]')
    await page.waitForSelector('[data-test=comparisons-page]')
    expect(page.url()).toContain(`before=${ids.reference}`)

    const pick = async (select: string, runName: string) => {
      await page.click(`[data-test=${select}]`)
      // The other select's menu stays in the page, hidden: take the open one's option, then wait
      // until its menu has faded out, so the next pick cannot hit it.
      await page.locator('.n-base-select-option', { hasText: runName }).filter({ visible: true }).first().click()
      await page.waitForFunction(() =>
        [...document.querySelectorAll<HTMLElement>('.n-base-select-menu')].every((menu) => menu.offsetParent === null),
      )
    }
    await page.waitForSelector('[data-test=compare-before] >> text=Scenario K reference')
    await pick('compare-after', 'Scenario K doubled')
    await page.waitForSelector('[data-test=compare-forcing] [data-test=forcing-top]')
    expect(page.url()).toContain(`before=${ids.reference}`)
    expect(page.url()).toContain(`after=${ids.doubled}`)
    const topForcing = Number((await page.locator('[data-test=forcing-top] td').nth(4).innerText()).trim())
    // The CO₂ band centre: negative at the top (see the comparisons API test).
    expect(topForcing).toBeLessThan(0)
    expect(await page.locator('[data-test=compare-inputs]').innerText()).toContain('mixture.gases.CO2.vmr')
    await page.waitForSelector('[data-test=compare-chart-forcing] canvas')
    await page.waitForSelector('[data-test=cautions]')

    // The chart's data: exactly the plotted spectral forcing, as CSV.
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.click('[data-test=compare-chart-forcing] [data-test=chart-csv]'),
    ])
    const rows = readFileSync((await download.path())!, 'utf8').split('\r\n').filter(Boolean)
    expect(rows[0]).toMatch(/Top of the atmosphere/)
    expect(rows).toHaveLength(1 + 20)

    // Swapped, the forcing changes sign.
    await page.click('[data-test=compare-swap]')
    await page.waitForFunction(
      (before) => new URL(location.href).searchParams.get('before') === String(before),
      ids.doubled,
    )
    await page.waitForSelector('[data-test=forcing-top]')
    const swapped = Number((await page.locator('[data-test=forcing-top] td').nth(4).innerText()).trim())
    expect(swapped).toBeCloseTo(-topForcing, 3)

    // Runs on different bins: the reason, not a chart.
    await page.goto(`${base}/comparisons?before=${ids.reference}&after=${ids.narrower}`)
    await page.waitForSelector('[data-test=compare-error]')
    expect(await page.locator('[data-test=compare-error]').innerText()).toMatch(/different spectral bins \(20 bins .* against 10 bins/)
    expect(await page.$('[data-test=compare-forcing]')).toBeNull()
  })
})
