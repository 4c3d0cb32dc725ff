import type { Page } from 'playwright-core'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { AREA_ROLES, ROLES, type Role } from '../../shared/schemas/auth'
import { type E2eApp, openReportedPage, startE2eApp } from '../support/e2e-app'
import type { TestApp } from '../support/test-app'

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

async function signIn(email: string, password: string) {
  await page.goto(`${base}/sign-in`)
  await page.fill('input[name=email]', email)
  await page.fill('input[name=password]', password)
  await page.click('[data-test=sign-in-submit]')
}

function expectedAreas(role: Role): string[] {
  return Object.entries(AREA_ROLES)
    .filter(([, roles]) => (roles as readonly Role[]).includes(role))
    .map(([area]) => area)
    .sort()
}

describe('signing in through the browser', () => {
  it.each(ROLES)(
    'when the %s signs in, sees the navigation of that role and can sign out',
    async (role) => {
      const { email, password } = t.account(role)
      await signIn(email, password)
      await page.waitForSelector('[data-test=dashboard]')
      const areas = await page.$$eval('nav [data-area]', (els) =>
        els.map((e) => e.getAttribute('data-area')!),
      )
      expect(areas.sort()).toEqual(expectedAreas(role))
      expect(await page.textContent('[data-test=who-am-i]')).toContain(
        role === 'admin' ? 'Administrator' : role === 'reviewer' ? 'Reviewer' : 'Analyst',
      )

      await page.click('[data-test=sign-out]')
      await page.waitForSelector('[data-test=sign-in-submit]')
      expect(new URL(page.url()).pathname).toBe('/sign-in')
      // The session is really gone: a protected page sends us back to sign in.
      await page.goto(`${base}/runs`)
      await page.waitForSelector('[data-test=sign-in-submit]')
      await page.close()
    },
  )

  it('when the password is wrong, shows a clear message and stays on the sign-in page', async () => {
    await signIn(t.account('analyst').email, 'definitely-wrong')
    const alert = await page.waitForSelector('[data-test=sign-in-error]')
    expect(await alert.textContent()).toMatch(/e-mail or password is not right/i)
    expect(new URL(page.url()).pathname).toBe('/sign-in')
    await page.close()
  })

  it('when an analyst opens the admin page, sees "not for your role" and the admin API answers 403', async () => {
    await signIn(t.account('analyst').email, t.account('analyst').password)
    await page.waitForSelector('[data-test=dashboard]')
    await page.goto(`${base}/admin`)
    await page.waitForSelector('[data-test=forbidden]')
    expect(await page.$('[data-test=admin-page]')).toBeNull()
    const status = await page.evaluate(async () => (await fetch('/api/admin/users')).status)
    expect(status).toBe(403)
    await page.close()
  })

  it('when signed out, a deep link goes to sign-in and returns to the page after signing in', async () => {
    await page.goto(`${base}/help`)
    await page.waitForSelector('[data-test=sign-in-submit]')
    expect(new URL(page.url()).searchParams.get('redirect')).toBe('/help')
    await page.fill('input[name=email]', t.account('reviewer').email)
    await page.fill('input[name=password]', t.account('reviewer').password)
    await page.click('[data-test=sign-in-submit]')
    await page.waitForSelector('[data-test=help-page]')
    await page.close()
  })

  it('when the admin adds a person in the People page, the new row appears', async () => {
    await signIn(t.account('admin').email, t.account('admin').password)
    await page.waitForSelector('[data-test=dashboard]')
    await page.goto(`${base}/admin`)
    await page.waitForSelector('[data-test=admin-page] tbody tr')
    await page.click('[data-test=add-person]')
    await page.fill('input[name=displayName]', 'Pella Quist')
    await page.fill('input[name=newEmail]', 'pella.quist@example.org')
    await page.fill('input[name=newPassword]', 'a-long-first-password')
    await page.click('[data-test=create-account]')
    await page.waitForSelector('text=pella.quist@example.org')
    await page.close()
  })
})
