/**
 * Checked uploads waiting for their commit: `<token>.lines` (the file as uploaded) and
 * `<token>.json` (who uploaded it, its hash and summary) in one folder of the system's temporary
 * directory. A token lives IMPORT_TOKEN_TTL_MS (30 minutes); expired files are removed whenever
 * a new upload arrives. Files on disk (not memory) so a 512 MiB upload costs no RAM and any server
 * process on the machine can commit it.
 */
import { randomBytes } from 'node:crypto'
import { mkdirSync } from 'node:fs'
import { readdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { IMPORT_TOKEN_TTL_MS, type LineListSummary } from '../../../shared/schemas/catalogues'

/**
 * Folder of uploads in progress and checked files waiting for their commit: TAULINE_IMPORT_DIR
 * when set (read at each call, so tests can give each process its own), else a folder in the
 * system's temporary directory. It needs room for every upload waiting at a time (each up to
 * 512 MiB, kept up to 30 minutes).
 */
export function importDir(): string {
  return process.env.TAULINE_IMPORT_DIR || join(tmpdir(), 'tauline-line-imports')
}

const TOKEN_PATTERN = /^[0-9a-f]{32}$/

export interface PendingImport {
  token: string
  ownerId: number
  fileName: string
  byteSize: number
  fileSha256: string
  parsedAt: string
  expiresAt: string
  summary: LineListSummary
}

/** Creates the import folder when missing; returns it. */
export function ensureImportDir(): string {
  const dir = importDir()
  mkdirSync(dir, { recursive: true, mode: 0o700 })
  return dir
}

/** A fresh name for an upload being received. */
export function uploadFileName(): string {
  return `upload-${randomBytes(12).toString('hex')}.part`
}

/** Path of the kept file of a token (throws on a malformed token, so no path can be smuggled in). */
export function pendingFilePath(token: string): string {
  if (!TOKEN_PATTERN.test(token)) throw new Error('malformed import token')
  return join(importDir(), `${token}.lines`)
}

function metaPath(token: string): string {
  return join(importDir(), `${token}.json`)
}

export function isImportToken(token: string): boolean {
  return TOKEN_PATTERN.test(token)
}

/** Keeps a checked upload under a new token; moves the file, never copies it. */
export async function keepPendingImport(
  uploadPath: string,
  meta: Omit<PendingImport, 'token' | 'expiresAt'>,
  now = Date.now(),
): Promise<PendingImport> {
  const token = randomBytes(16).toString('hex')
  const pending: PendingImport = {
    ...meta,
    token,
    expiresAt: new Date(now + IMPORT_TOKEN_TTL_MS).toISOString(),
  }
  ensureImportDir()
  await rename(uploadPath, pendingFilePath(token))
  await writeFile(metaPath(token), JSON.stringify(pending), { mode: 0o600 })
  return pending
}

/** The pending import of a token, or null when unknown or expired (expired ones are removed). */
export async function findPendingImport(
  token: string,
  now = Date.now(),
): Promise<PendingImport | null> {
  if (!isImportToken(token)) return null
  let pending: PendingImport
  try {
    pending = JSON.parse(await readFile(metaPath(token), 'utf8')) as PendingImport
  } catch {
    return null
  }
  if (Date.parse(pending.expiresAt) <= now) {
    await removePendingImport(token)
    return null
  }
  return pending
}

/**
 * Takes a pending import for a commit, so two commits of one token cannot both store it: the
 * description file is renamed away (atomic), and put back by `releasePendingImport` on failure.
 * Returns null when unknown or expired, 'busy' while another commit holds it.
 */
export async function claimPendingImport(
  token: string,
  now = Date.now(),
): Promise<PendingImport | null | 'busy'> {
  const pending = await findPendingImport(token, now)
  if (!pending) return isImportToken(token) && (await exists(busyPath(token))) ? 'busy' : null
  try {
    await rename(metaPath(token), busyPath(token))
  } catch {
    return 'busy'
  }
  return pending
}

/** Gives a claimed pending import back (after a failed commit), so it can be committed again. */
export async function releasePendingImport(token: string): Promise<void> {
  await rename(busyPath(token), metaPath(token)).catch(() => undefined)
}

export async function removePendingImport(token: string): Promise<void> {
  if (!isImportToken(token)) return
  await rm(pendingFilePath(token), { force: true })
  await rm(metaPath(token), { force: true })
  await rm(busyPath(token), { force: true })
}

function busyPath(token: string): string {
  return join(importDir(), `${token}.json.busy`)
}

async function exists(path: string): Promise<boolean> {
  return stat(path).then(
    () => true,
    () => false,
  )
}

/** Removes expired pending imports and uploads abandoned for longer than the token lifetime. */
export async function sweepPendingImports(now = Date.now()): Promise<void> {
  let names: string[]
  try {
    names = await readdir(importDir())
  } catch {
    return
  }
  for (const name of names) {
    const path = join(importDir(), name)
    try {
      if (name.endsWith('.json')) {
        await findPendingImport(name.slice(0, -5), now)
      } else if (name.endsWith('.part') || name.endsWith('.lines') || name.endsWith('.busy')) {
        // Abandoned uploads, files whose description is gone, and claims of a crashed commit.
        const info = await stat(path)
        const orphan =
          name.endsWith('.lines') &&
          !names.includes(`${name.slice(0, -6)}.json`) &&
          !names.includes(`${name.slice(0, -6)}.json.busy`)
        if ((!name.endsWith('.lines') || orphan) && now - info.mtimeMs > IMPORT_TOKEN_TTL_MS)
          await rm(path, { force: true })
      }
    } catch {
      // Another process may have removed it meanwhile.
    }
  }
}
