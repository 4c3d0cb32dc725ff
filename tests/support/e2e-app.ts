import { existsSync } from 'node:fs'
import type { Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import type { Page } from 'playwright-core'
import type { TestContext } from 'vitest'
import { launchBrowser } from './browser'
import { createTestApp, type TestApp } from './test-app'

/** The test context's `onTestFailed`, as handed to a test or a beforeEach hook. */
export type OnTestFailed = TestContext['onTestFailed']

export interface E2eApp {
  t: TestApp
  /** http://127.0.0.1:<port> of the app serving the built client. */
  base: string
  browser: Awaited<ReturnType<typeof launchBrowser>>
  close: () => Promise<void>
}

/** The app with the built client on a loopback port, and a headless Chromium. */
export async function startE2eApp(
  options: Omit<Parameters<typeof createTestApp>[0] & object, 'clientDistDir'> = {},
): Promise<E2eApp> {
  if (!existsSync('dist/index.html'))
    throw new Error('Build the client first (npx vite build); npm test does it.')
  const t = await createTestApp({ ...options, clientDistDir: 'dist' })
  const server: Server = t.app.listen(0, '127.0.0.1')
  await new Promise((resolve) => server.once('listening', resolve))
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
  const browser = await launchBrowser()
  return {
    t,
    base,
    browser,
    close: async () => {
      await browser.close()
      await new Promise((resolve) => server.close(resolve))
      await t.close()
    },
  }
}

/** Signs in through the sign-in page and waits for the dashboard. */
export async function signInThroughPage(
  page: Page,
  base: string,
  account: { email: string; password: string },
): Promise<void> {
  await page.goto(`${base}/sign-in`)
  await page.fill('input[name=email]', account.email)
  await page.fill('input[name=password]', account.password)
  await page.click('[data-test=sign-in-submit]')
  await page.waitForSelector('[data-test=dashboard]')
}

/**
 * Keeps what a page saw (console errors, uncaught errors, failed and refused requests) and, when
 * the current test fails, prints it with the page's address and text and saves a screenshot
 * under tests/.artifacts/: a browser failure in CI then says what the user would have seen.
 */
export function reportPageOnFailure(page: Page, onTestFailed: OnTestFailed): void {
  const seen: string[] = []
  const stamp = () => new Date().toISOString().slice(11, 23)
  page.on('console', (m) => {
    if (m.type() === 'error' || m.type() === 'warning') seen.push(`${stamp()} console.${m.type()}: ${m.text()}`)
  })
  page.on('pageerror', (e) => seen.push(`${stamp()} uncaught: ${e.message}`))
  page.on('requestfailed', (r) => seen.push(`${stamp()} failed: ${r.method()} ${r.url()} (${r.failure()?.errorText})`))
  page.on('response', (r) => {
    if (r.status() >= 400) seen.push(`${stamp()} ${r.status()}: ${r.request().method()} ${r.url()}`)
  })
  onTestFailed(async () => {
    if (page.isClosed()) return
    const shot = `tests/.artifacts/e2e-failure-${Date.now()}.png`
    const [text] = await Promise.all([
      page.locator('body').innerText({ timeout: 2000 }).catch(() => '(no text)'),
      page.screenshot({ path: shot, fullPage: true, timeout: 5000 }).catch(() => undefined),
    ])
    console.error(
      [
        `page at failure: ${page.url()} (screenshot ${shot})`,
        `page text: ${text.replace(/\s+/g, ' ').slice(0, 800)}`,
        ...(seen.length ? ['page events:', ...seen.slice(-40)] : ['page events: none']),
      ].join('\n'),
    )
  })
}

/** A new page of the shared browser context, reported when the current test fails. */
export async function openReportedPage(
  browser: E2eApp['browser'],
  onTestFailed: OnTestFailed,
): Promise<Page> {
  const page = await browser.context.newPage()
  reportPageOnFailure(page, onTestFailed)
  return page
}
