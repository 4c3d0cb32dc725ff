import { parseArgs } from 'node:util'
import { compareRuns } from '../../shared/physics/engine/compute'
import { printJson, requireNumber } from './args'
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

export const forcingHelp = `tauline forcing --gas co2|ch4|n2o --from AMOUNT --to AMOUNT [options] [--json]
  Instantaneous clear-sky forcing of changing one gas (ppmv for CO₂, ppbv for CH₄ and N₂O): the
  reduction of net upward flux at the top, the tropopause and the surface, and its spectrum.
${scenarioHelp}`

export async function forcingCommand(argv: string[]): Promise<void> {
  const { values } = parseArgs({ args: argv, options: { ...scenarioOptionSpec, gas: { type: 'string' }, from: { type: 'string' }, to: { type: 'string' } } })
  const gas = changeableGasOption(values)
  const from = requireNumber(values, 'from')
  const to = requireNumber(values, 'to')
  const base = profileFromOptions(values)
  const others = gasesFromOptions(values)
  const settings = settingsFromOptions(values)
  const catalogue = catalogueLines()
  const { checksum, lineCount } = catalogue
  const t0 = Date.now()
  // The two runs share everything that does not depend on the gas (engine/compute-sweep.ts).
  const { members } = await computeOnThreads(
    [from, to].map((amount) => profileWithAmount(base, others, gas, amount)),
    catalogue,
    settings,
    gas.id,
    threadsFromOptions(values),
    progressPrinter(values.quiet!, `${gas.id} ${from} and ${to} ${gas.unit}`),
  )
  const [before, after] = members
  const f = compareRuns(before, after)
  const wallSeconds = (Date.now() - t0) / 1000
  if (values.json) {
    printJson({
      atmosphere: base.name,
      gas: gas.id,
      unit: gas.unit,
      from,
      to,
      catalogue: { checksum, lineCount },
      settings: before.settings,
      engineVersion: before.engineVersion,
      forcingWPerM2: { toa: f.toaWPerM2, tropopause: f.tropopauseWPerM2, surface: f.surfaceWPerM2 },
      tropopause: before.tropopause,
      olrWPerM2: { before: before.olrWPerM2, after: after.olrWPerM2 },
      spectrum: { wavenumberCm: before.wavenumberCm, toaForcingSpectral: f.toaSpectral, tropopauseForcingSpectral: f.tropopauseSpectral },
      wallSeconds,
      cautions: CAUTIONS,
    })
    return
  }
  process.stdout.write(`${base.name}: ${gas.id} ${from} → ${to} ${gas.unit} (${wallSeconds.toFixed(1)} s)\n\n`)
  process.stdout.write(`Forcing at the top of the atmosphere  ${f.toaWPerM2.toFixed(3)} W m⁻²\n`)
  process.stdout.write(`Forcing at the tropopause (${(before.tropopause.pressurePa / 100).toFixed(0)} hPa)  ${f.tropopauseWPerM2.toFixed(3)} W m⁻²\n`)
  process.stdout.write(`Forcing at the surface                ${f.surfaceWPerM2.toFixed(3)} W m⁻²\n\n${CAUTIONS.join('\n')}\n`)
}
