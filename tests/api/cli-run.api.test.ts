import { spawn } from 'node:child_process'
import type { AddressInfo } from 'node:net'
import type { Server } from 'node:http'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { signedInAgent } from '../support/http-agent'
import { createPresetProfile } from '../support/runs'
import { createTestApp, type TestApp } from '../support/test-app'

let t: TestApp
let server: Server
let base: string
let profileId: number

beforeAll(async () => {
  t = await createTestApp({ runs: { threads: 1 } })
  server = t.app.listen(0, '127.0.0.1')
  await new Promise((resolve) => server.once('listening', resolve))
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
  profileId = await createPresetProfile(await signedInAgent(t, 'analyst'))
})

afterAll(async () => {
  await new Promise((resolve) => server?.close(resolve))
  await t?.close()
})

function tauline(args: string[], env: Record<string, string>): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['scripts/tauline.mjs', ...args], { env: { ...process.env, ...env } })
    let stdout = ''
    let stderr = ''
    child.stdout.on('data', (d) => (stdout += d))
    child.stderr.on('data', (d) => (stderr += d))
    child.on('close', (code) => resolve({ code: code ?? -1, stdout, stderr }))
  })
}

describe('tauline run against a server', () => {
  it('submits a run, follows it to the end and prints the results as JSON', async () => {
    const { email, password } = t.account('analyst')
    const out = await tauline(
      ['run', '--server', base, '--email', email, '--profile-id', String(profileId), '--range', '660:680', '--chunk', '5', '--json'],
      { TAULINE_PASSWORD: password },
    )
    expect(out.stderr).toBe('')
    expect(out.code).toBe(0)
    const body = JSON.parse(out.stdout)
    expect(body.run.status).toBe('succeeded')
    expect(body.run.chunkCount).toBe(4)
    expect(body.summary.olrWPerM2).toBeGreaterThan(0)
    expect(body.cautions.length).toBeGreaterThan(0)
  }, 120_000)

  it('when the password is wrong, exits with code 2 and says why', async () => {
    const out = await tauline(['run', '--server', base, '--email', t.account('analyst').email, '--profile-id', String(profileId)], { TAULINE_PASSWORD: 'wrong-password' })
    expect(out.code).toBe(2)
    expect(out.stderr).toMatch(/E-mail or password is not right/)
  }, 60_000)
})
