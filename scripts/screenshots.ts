// Takes screenshots of the main pages in light and dark themes into tests/.artifacts/screens,
// so people can look at what the app shows. Usage: node --import tsx scripts/screenshots.ts [baseUrl]
import { mkdirSync } from 'node:fs'
import { launchBrowser } from '../tests/support/browser'
import { DEMO_TEAM } from '../server/demo/demo-team'
import { loadEnvFile } from '../server/env-file'

loadEnvFile()
const base = process.argv[2] ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`
const pages = (process.argv[3] ?? '/,/admin,/runs,/help').split(',')
const out = 'tests/.artifacts/screens'
mkdirSync(out, { recursive: true })
const admin = DEMO_TEAM.find((m) => m.role === 'admin')!

for (const scheme of ['light', 'dark'] as const) {
  const { context, close } = await launchBrowser({ colorScheme: scheme })
  const page = await context.newPage()
  await page.goto(`${base}/sign-in`)
  await page.waitForSelector('[data-test=sign-in-submit]')
  await page.screenshot({ path: `${out}/sign-in-${scheme}.png` })
  await page.fill('input[name=email]', admin.email)
  await page.fill('input[name=password]', process.env.DEMO_PASSWORD ?? '')
  await page.click('[data-test=sign-in-submit]')
  await page.waitForSelector('[data-test=who-am-i]')
  for (const path of pages) {
    await page.goto(`${base}${path}`)
    await page.waitForLoadState('networkidle')
    const name = path === '/' ? 'dashboard' : path.slice(1).replaceAll('/', '-')
    await page.screenshot({ path: `${out}/${name}-${scheme}.png`, fullPage: true })
  }
  await close()
}
process.stdout.write(`screenshots in ${out}\n`)
