import { existsSync } from 'node:fs'
import type { Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import type { Page } from 'playwright-core'
import { launchBrowser } from './browser'
import { createTestApp, type TestApp } from './test-app'

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
