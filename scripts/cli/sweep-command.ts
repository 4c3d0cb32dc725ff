import { parseArgs } from 'node:util'
import { compareRuns, type ForcingComparison } from '../../shared/physics/engine/compute'
import type { RadiationResult } from '../../shared/physics/engine/merge'
import { fitLogarithmicForcing, type LogFitResult } from '../../shared/physics/diagnostics/log-fit'
import { CliError, printJson, printTable, requireNumber } from './args'
import { CAUTIONS } from './cautions'
import {
  catalogueLines,
  changeableGasOption,
  gasesFromOptions,
  profileFromOptions,
  profileWithAmount,
  progressPrinter,
  scenarioHelp,
  scenarioOptionSpec,
  settingsFromOptions,
  threadsFromOptions,
} from './scenario-options'
import { computeOnThreads } from './threaded-compute'

export const sweepHelp = `tauline sweep --gas co2|ch4|n2o --amounts A,B,... [--reference AMOUNT] [--independent] [options] [--json]
  Runs with one gas at each amount (uniform; ppmv for CO₂, ppbv for CH₄ and N₂O), computed together
  so that everything that does not depend on the gas is computed once, and the forcing of each
  amount against the reference amount (default: the first) at the top, the tropopause and the
  surface, with a logarithmic fit ΔF = a ln(C/C₀) at each. --independent computes every amount as
  a run of its own instead (slower; the two agree within the adaptive method's tolerances).
${scenarioHelp}`

/** Parses --amounts "280,400,560" into at least two distinct non-negative numbers. */
export function parseAmounts(text: string | undefined): number[] {
  if (text === undefined) throw new CliError('--amounts is required (e.g. --amounts 280,400,560)')
  const amounts = text.split(',').map((item, index) => {
    const value = Number(item.trim())
    if (item.trim() === '' || !Number.isFinite(value) || value < 0) {
      throw new CliError(`--amounts item ${index + 1} must be a number ≥ 0, got "${item}"`)
    }
    return value
  })
  if (new Set(amounts).size < 2) throw new CliError('--amounts needs at least two different amounts')
  return amounts
}

interface LevelForcing {
  name: 'top' | 'tropopause' | 'surface'
  forcingWPerM2: number[]
  fit: LogFitResult | null
}

export async function sweepCommand(argv: string[]): Promise<void> {
  const { values } = parseArgs({
    args: argv,
    options: {
      ...scenarioOptionSpec,
      gas: { type: 'string' },
      amounts: { type: 'string' },
      reference: { type: 'string' },
      independent: { type: 'boolean', default: false },
    },
  })
  const gas = changeableGasOption(values)
  const amounts = parseAmounts(values.amounts)
  const reference = requireNumber(values, 'reference', amounts[0])
  if (!(reference >= 0)) throw new CliError('--reference must be ≥ 0')
  // The reference is computed as a member of its own when it is not one of the amounts.
  const members = amounts.includes(reference) ? amounts : [...amounts, reference]
  const base = profileFromOptions(values)
  const others = gasesFromOptions(values)
  const settings = settingsFromOptions(values)
  const catalogue = catalogueLines()
  const { checksum, lineCount } = catalogue
  const threads = threadsFromOptions(values)
  const profiles = members.map((amount) => profileWithAmount(base, others, gas, amount))
  const label = `${gas.id} sweep, ${members.length} amounts`
  const started = Date.now()
  let results: RadiationResult[]
  let opticsShared: boolean
  let independentReason: string | null
  if (values.independent) {
    results = []
    for (const [m, profile] of profiles.entries()) {
      const progress = progressPrinter(values.quiet!, `${gas.id} ${members[m]} ${gas.unit}`)
      results.push((await computeOnThreads([profile], catalogue, settings, gas.id, threads, progress)).members[0])
    }
    opticsShared = false
    independentReason = 'asked for with --independent'
  } else {
    const sweep = await computeOnThreads(profiles, catalogue, settings, gas.id, threads, progressPrinter(values.quiet!, label))
    results = sweep.members
    independentReason = sweep.independentReason
    opticsShared = independentReason === null
  }
  const wallSeconds = (Date.now() - started) / 1000
  const referenceResult = results[members.indexOf(reference)]
  const comparisons = results.map((r) => compareRuns(referenceResult, r))
  const fittable = reference > 0 && members.every((a) => a > 0)
  const picks: [LevelForcing['name'], (c: ForcingComparison) => number][] = [
    ['top', (c) => c.toaWPerM2],
    ['tropopause', (c) => c.tropopauseWPerM2],
    ['surface', (c) => c.surfaceWPerM2],
  ]
  const levels: LevelForcing[] = picks.map(([name, pick]) => {
    const forcingWPerM2 = comparisons.map(pick)
    return {
      name,
      forcingWPerM2,
      fit: fittable ? fitLogarithmicForcing(members, forcingWPerM2, reference, true) : null,
    }
  })

  if (values.json) {
    printJson({
      atmosphere: base.name,
      gas: gas.id,
      unit: gas.unit,
      reference,
      amounts: members,
      catalogue: { checksum, lineCount },
      settings: results[0].settings,
      engineVersion: results[0].engineVersion,
      opticsShared,
      independentReason,
      tropopause: referenceResult.tropopause,
      olrWPerM2: results.map((r) => r.olrWPerM2),
      forcingWPerM2: Object.fromEntries(levels.map((l) => [l.name, l.forcingWPerM2])),
      logarithmicFit: Object.fromEntries(levels.map((l) => [l.name, l.fit])),
      wallSeconds,
      cautions: CAUTIONS,
    })
    return
  }
  const how = opticsShared ? 'optics shared' : `computed one by one: ${independentReason}`
  process.stdout.write(`${base.name}: ${label} (${gas.unit}), ${how} (${wallSeconds.toFixed(1)} s)\n`)
  process.stdout.write(`Forcing against ${reference} ${gas.unit}; tropopause at ${(referenceResult.tropopause.pressurePa / 100).toFixed(0)} hPa.\n\n`)
  printTable([
    [`${gas.id} ${gas.unit}`, 'OLR W m⁻²', 'ΔF top', 'ΔF tropopause', 'ΔF surface'],
    ...members.map((amount, m) => [
      amount,
      results[m].olrWPerM2.toFixed(3),
      ...levels.map((l) => l.forcingWPerM2[m].toFixed(3)),
    ]),
  ])
  process.stdout.write('\n')
  if (fittable) {
    process.stdout.write(`Fit ΔF = a ln(C/${reference}) (least squares through the origin):\n`)
    for (const l of levels) {
      const fit = l.fit!
      process.stdout.write(
        `  ${l.name.padEnd(11)} a = ${fit.slopeWPerM2.toFixed(3)} W m⁻², ${fit.perDoublingWPerM2.toFixed(3)} W m⁻² per doubling, R² = ${fit.rSquared.toFixed(4)}\n`,
      )
    }
  } else {
    process.stdout.write('No logarithmic fit: it needs every amount and the reference above zero.\n')
  }
  process.stdout.write(`\n${CAUTIONS.join('\n')}\n`)
}
