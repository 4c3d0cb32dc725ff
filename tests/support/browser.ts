import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { chromium, type BrowserContext } from 'playwright-core'

/** Debian's Chromium, never a downloaded browser. */
export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium'

const ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  '--disable-quic',
  '--disable-dev-shm-usage',
]

/** A headless browser context with a fresh profile folder; close() also deletes the folder. */
export async function launchBrowser(options: { colorScheme?: 'light' | 'dark' } = {}): Promise<{
  context: BrowserContext
  close: () => Promise<void>
}> {
  const profileDir = mkdtempSync(join(tmpdir(), 'tauline-chromium-'))
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: ARGS,
    viewport: { width: 1360, height: 860 },
    colorScheme: options.colorScheme ?? 'light',
  })
  return {
    context,
    close: async () => {
      await context.close()
      rmSync(profileDir, { recursive: true, force: true })
    },
  }
}
