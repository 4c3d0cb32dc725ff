import { readFileSync } from 'node:fs'
import { availableParallelism } from 'node:os'
import { loadBuiltInCatalogue } from '../../server/catalogue/builtin-catalogue'
import { applyMixture } from '../../shared/mixtures/apply-mixture'
import type { ComputeSettings } from '../../shared/physics/engine/settings'
import type { AtmosphereProfile } from '../../shared/physics/types'
import { buildPresetProfile } from '../../shared/presets/atmosphere-presets'
import type { MixtureGases } from '../../shared/schemas/mixtures'
import { SWEPT_GASES, type SweptGas } from '../../shared/schemas/sweeps'
import { withSweptAmount } from '../../shared/mixtures/swept-amount'
import { presetIdSchema, profileInputSchema } from '../../shared/schemas/profiles'
import { CliError, optionalString, parseRange, requireNumber } from './args'

/** Options shared by compute, forcing and sweep: the atmosphere, the gases, the spectral settings. */
export const scenarioOptionSpec = {
  atmosphere: { type: 'string' },
  profile: { type: 'string' },
  levels: { type: 'string' },
  'top-pressure': { type: 'string' },
  'surface-temperature': { type: 'string' },
  emissivity: { type: 'string' },
  co2: { type: 'string' },
  ch4: { type: 'string' },
  n2o: { type: 'string' },
  'h2o-scale': { type: 'string' },
  'o3-scale': { type: 'string' },
  range: { type: 'string' },
  resolution: { type: 'string' },
  chunk: { type: 'string' },
  cutoff: { type: 'string' },
  quadrature: { type: 'string' },
  'no-continuum': { type: 'boolean', default: false },
  threads: { type: 'string' },
  json: { type: 'boolean', default: false },
  quiet: { type: 'boolean', default: false },
} as const

export const scenarioHelp = `  Atmosphere:  --atmosphere ID (us-standard-1976, tropical, mid-latitude-summer, mid-latitude-winter,
               subarctic-summer, subarctic-winter; default us-standard-1976) or --profile FILE.json
               (a Tauline profile: name, surfaceTemperatureK, surfaceEmissivity, levels[{pressurePa,
               temperatureK, heightM, vmr{H2O,O3,CO2,N2O,CH4}}]); --levels N (61), --top-pressure PA (10),
               --surface-temperature K, --emissivity E (1)
  Gases:       --co2 PPMV, --ch4 PPBV, --n2o PPBV (uniform dry-air mole fractions), --h2o-scale F, --o3-scale F
  Spectrum:    --range START:END cm⁻¹ (10:3000), --resolution CM (1, output bins), --chunk CM (20),
               --cutoff CM (25, line wings), --quadrature gauss-legendre:N | gauss-jacobi:N | diffusivity
               (gauss-legendre:3), --no-continuum
  Threads:     --threads N (one per core): chunks computed in parallel, same numbers as one thread
  Output:      --json (machine-readable), --quiet (no progress on stderr)`

type Values = Record<string, string | boolean | undefined>

/** The atmosphere of the command line, before gas changes. */
export function profileFromOptions(v: Values): AtmosphereProfile {
  if (v.profile !== undefined) {
    const file = String(v.profile)
    let raw: unknown
    try {
      raw = JSON.parse(readFileSync(file, 'utf8'))
    } catch (err) {
      throw new CliError(`--profile ${file}: ${(err as Error).message}`)
    }
    const parsed = profileInputSchema.safeParse({ source: 'form', description: '', ...(raw as object) })
    if (!parsed.success) {
      const issue = parsed.error.issues[0]
      throw new CliError(`--profile ${file}: ${issue.path.join('.')}: ${issue.message}`)
    }
    return { name: parsed.data.name, surfaceTemperatureK: parsed.data.surfaceTemperatureK, surfaceEmissivity: parsed.data.surfaceEmissivity, levels: parsed.data.levels }
  }
  const id = optionalString(v, 'atmosphere') ?? 'us-standard-1976'
  const preset = presetIdSchema.safeParse(id)
  if (!preset.success) throw new CliError(`--atmosphere must be one of ${presetIdSchema.options.join(', ')}; got "${id}"`)
  const { profile } = buildPresetProfile({
    preset: preset.data,
    levelCount: requireNumber(v, 'levels', 61),
    topPressurePa: requireNumber(v, 'top-pressure', 10),
    surfaceTemperatureK: v['surface-temperature'] === undefined ? undefined : requireNumber(v, 'surface-temperature'),
    humidityScale: 1,
    surfaceEmissivity: requireNumber(v, 'emissivity', 1),
  })
  return profile
}

/** Gas changes given on the command line, as a mixture. */
export function gasesFromOptions(v: Values): MixtureGases {
  const gases: MixtureGases = {}
  if (v.co2 !== undefined) gases.CO2 = { mode: 'uniform', vmr: requireNumber(v, 'co2') * 1e-6 }
  if (v.ch4 !== undefined) gases.CH4 = { mode: 'uniform', vmr: requireNumber(v, 'ch4') * 1e-9 }
  if (v.n2o !== undefined) gases.N2O = { mode: 'uniform', vmr: requireNumber(v, 'n2o') * 1e-9 }
  if (v['h2o-scale'] !== undefined) gases.H2O = { mode: 'scale', factor: requireNumber(v, 'h2o-scale') }
  if (v['o3-scale'] !== undefined) gases.O3 = { mode: 'scale', factor: requireNumber(v, 'o3-scale') }
  return gases
}

/** A gas a forcing or a sweep may change, with the unit its amounts are given in. */
export interface ChangeableGas {
  id: SweptGas
  unit: string
}

/** The --gas option of forcing and sweep. */
export function changeableGasOption(v: Values): ChangeableGas {
  const id = String(v.gas ?? '').toUpperCase()
  if (!Object.hasOwn(SWEPT_GASES, id)) throw new CliError(`--gas must be co2, ch4 or n2o; got "${String(v.gas ?? '')}"`)
  return { id: id as SweptGas, unit: SWEPT_GASES[id as SweptGas].unit }
}

/** The profile with `gas` at a uniform amount (in the gas's unit) and the other command-line changes. */
export function profileWithAmount(
  base: AtmosphereProfile,
  others: MixtureGases,
  gas: ChangeableGas,
  amount: number,
): AtmosphereProfile {
  return withSweptAmount(withGases(base, others), gas.id, amount)
}

export function withGases(profile: AtmosphereProfile, gases: MixtureGases): AtmosphereProfile {
  return applyMixture(profile, gases).profile
}

export function settingsFromOptions(v: Values): Partial<ComputeSettings> {
  const [startCm, endCm] = v.range === undefined ? [10, 3000] : parseRange(String(v.range), 'range')
  const settings: Partial<ComputeSettings> = {
    startCm,
    endCm,
    outputResolutionCm: requireNumber(v, 'resolution', 1),
    chunkWidthCm: requireNumber(v, 'chunk', 20),
    wingCutoffCm: requireNumber(v, 'cutoff', 25),
    waterVapourContinuum: !v['no-continuum'],
  }
  if (v.quadrature !== undefined) {
    const [kind, n] = String(v.quadrature).split(':')
    if (kind === 'diffusivity') settings.quadrature = { kind: 'diffusivity' }
    else if (kind === 'gauss-legendre' || kind === 'gauss-jacobi') settings.quadrature = { kind, nodes: Number(n ?? 3) }
    else throw new CliError(`--quadrature must be gauss-legendre:N, gauss-jacobi:N or diffusivity; got "${String(v.quadrature)}"`)
  }
  return settings
}

/** --threads: worker threads for the chunks (default one per core). */
export function threadsFromOptions(v: Values): number {
  const threads = requireNumber(v, 'threads', availableParallelism())
  if (!Number.isInteger(threads) || threads < 1 || threads > 256) {
    throw new CliError(`--threads must be a whole number from 1 to 256, got "${String(v.threads)}"`)
  }
  return threads
}

export function catalogueLines() {
  return loadBuiltInCatalogue()
}

/** Progress on stderr, one line rewritten in place. */
export function progressPrinter(quiet: boolean, label: string) {
  const started = Date.now()
  return ({ chunksDone, chunkCount }: { chunksDone: number; chunkCount: number }) => {
    if (quiet) return
    const s = (Date.now() - started) / 1000
    const eta = chunksDone > 0 ? (s / chunksDone) * (chunkCount - chunksDone) : NaN
    process.stderr.write(`\r${label}: ${chunksDone}/${chunkCount} chunks, ${s.toFixed(1)} s${Number.isFinite(eta) ? `, ~${eta.toFixed(0)} s left` : ''}   `)
    if (chunksDone === chunkCount) process.stderr.write('\n')
  }
}
