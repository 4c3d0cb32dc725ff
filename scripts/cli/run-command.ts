import { parseArgs } from 'node:util'
import type { RunDetail } from '../../shared/schemas/runs'
import { CliError, printJson, requireNumber } from './args'
import { CAUTIONS } from './cautions'
import { computeCommand } from './compute-command'
import { settingsFromOptions } from './scenario-options'
import { TaulineServer } from './server-client'

export const runHelp = `tauline run --server URL --profile-id N [--mixture-id N] [--catalogue builtin|ID] [--name TEXT]
             [--range START:END] [--resolution CM] [--chunk CM] [--cutoff CM] [--quadrature KIND]
             [--no-continuum] [--no-wait] [--json]
  Submits a run to a Tauline server and, unless --no-wait, follows its progress and prints the
  results. Signs in with --email (or TAULINE_EMAIL) and the password in TAULINE_PASSWORD.
tauline run --local [the options of tauline compute]
  Computes on this machine instead, exactly like tauline compute.`

interface ResultsBody {
  summary: { olrWPerM2: number; surfaceDownWPerM2: number; tropopause: { pressurePa: number; netUpWPerM2: number } }
}

export async function runCommand(argv: string[]): Promise<void> {
  if (argv.includes('--local')) return computeCommand(argv.filter((a) => a !== '--local'))
  const { values } = parseArgs({
    args: argv,
    options: {
      server: { type: 'string' },
      email: { type: 'string' },
      'profile-id': { type: 'string' },
      'mixture-id': { type: 'string' },
      catalogue: { type: 'string' },
      name: { type: 'string' },
      range: { type: 'string' },
      resolution: { type: 'string' },
      chunk: { type: 'string' },
      cutoff: { type: 'string' },
      quadrature: { type: 'string' },
      'no-continuum': { type: 'boolean', default: false },
      'no-wait': { type: 'boolean', default: false },
      json: { type: 'boolean', default: false },
    },
  })
  if (!values.server) throw new CliError('--server URL is required (or use --local)')
  const email = values.email ?? process.env.TAULINE_EMAIL
  const password = process.env.TAULINE_PASSWORD
  if (!email || !password) throw new CliError('sign-in needs --email (or TAULINE_EMAIL) and TAULINE_PASSWORD in the environment')
  const server = new TaulineServer(values.server)
  await server.signIn(email, password)
  const catalogue = values.catalogue === undefined || values.catalogue === 'builtin' ? 'builtin' : requireNumber(values, 'catalogue')
  const { run } = await server.post<{ run: RunDetail }>('/runs', {
    name: values.name,
    profileId: requireNumber(values, 'profile-id'),
    mixtureId: values['mixture-id'] === undefined ? null : requireNumber(values, 'mixture-id'),
    catalogueId: catalogue,
    settings: settingsFromOptions(values),
  })
  if (values['no-wait']) {
    if (values.json) printJson({ run })
    else process.stdout.write(`run #${run.id} queued: ${run.chunkCount} chunks, input hash ${run.inputHash}\n`)
    return
  }
  let current: RunDetail = run
  while (current.status === 'queued' || current.status === 'running') {
    await new Promise((r) => setTimeout(r, 1000))
    current = (await server.get<{ run: RunDetail }>(`/runs/${run.id}`)).run
    if (!values.json) process.stderr.write(`\rrun #${run.id}: ${current.status}, ${current.chunksDone}/${current.chunkCount} chunks   `)
  }
  if (!values.json) process.stderr.write('\n')
  if (current.status !== 'succeeded') throw new CliError(`run #${run.id} ${current.status}: ${current.error ?? ''}`)
  const results = await server.get<ResultsBody>(`/runs/${run.id}/results`)
  if (values.json) {
    printJson({ run: current, summary: results.summary, cautions: CAUTIONS })
    return
  }
  const s = results.summary
  process.stdout.write(`run #${run.id} "${current.name}" (input hash ${current.inputHash})\n`)
  process.stdout.write(`OLR ${s.olrWPerM2.toFixed(2)} W m⁻², surface downward ${s.surfaceDownWPerM2.toFixed(2)} W m⁻², `)
  process.stdout.write(`net upward at the tropopause (${(s.tropopause.pressurePa / 100).toFixed(0)} hPa) ${s.tropopause.netUpWPerM2.toFixed(2)} W m⁻²\n`)
  process.stdout.write(`${new URL(`/runs/${run.id}`, values.server)}\n\n${CAUTIONS.join('\n')}\n`)
}
