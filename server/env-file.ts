import { existsSync, readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'

/**
 * Loads KEY=value lines from .env (or .env.example when .env is missing) into process.env
 * without overriding variables that are already set. Same rules as scripts/lib.sh.
 */
export function loadEnvFile(rootUrl = new URL('..', import.meta.url)): void {
  const candidates = ['.env', '.env.example'].map((f) => fileURLToPath(new URL(f, rootUrl)))
  const file = candidates.find((f) => existsSync(f))
  if (!file) return
  for (const raw of readFileSync(file, 'utf8').split(/\r?\n/)) {
    const line = raw.trim()
    if (!line || line.startsWith('#') || !line.includes('=')) continue
    const key = line.slice(0, line.indexOf('='))
    if (process.env[key] === undefined) process.env[key] = line.slice(line.indexOf('=') + 1)
  }
}
