import { parseArgs } from 'node:util'
import { compareRuns, computeRadiation } from '../../shared/physics/engine/compute'
import type { MixtureGases } from '../../shared/schemas/mixtures'
import { CliError, printJson, requireNumber } from './args'
import { CAUTIONS } from './cautions'
import { catalogueLines, gasesFromOptions, profileFromOptions, progressPrinter, scenarioHelp, scenarioOptionSpec, settingsFromOptions, withGases } from './scenario-options'

export const forcingHelp = `tauline forcing --gas co2|ch4|n2o --from AMOUNT --to AMOUNT [options] [--json]
  Instantaneous clear-sky forcing of changing one gas (ppmv for CO₂, ppbv for CH₄ and N₂O): the
  reduction of net upward flux at the top, the tropopause and the surface, and its spectrum.
${scenarioHelp}`

const GAS_UNITS = { co2: { id: 'CO2', unit: 'ppmv', factor: 1e-6 }, ch4: { id: 'CH4', unit: 'ppbv', factor: 1e-9 }, n2o: { id: 'N2O', unit: 'ppbv', factor: 1e-9 } } as const

export function forcingCommand(argv: string[]): void {
  const { values } = parseArgs({ args: argv, options: { ...scenarioOptionSpec, gas: { type: 'string' }, from: { type: 'string' }, to: { type: 'string' } } })
  const gasKey = String(values.gas ?? '').toLowerCase() as keyof typeof GAS_UNITS
  const gas = GAS_UNITS[gasKey]
  if (!gas) throw new CliError(`--gas must be co2, ch4 or n2o; got "${values.gas ?? ''}"`)
  const from = requireNumber(values, 'from')
  const to = requireNumber(values, 'to')
  const base = profileFromOptions(values)
  const others = gasesFromOptions(values)
  const at = (amount: number): MixtureGases => ({ ...others, [gas.id]: { mode: 'uniform', vmr: amount * gas.factor } })
  const settings = settingsFromOptions(values)
  const { table, checksum, lineCount } = catalogueLines()
  const t0 = Date.now()
  const before = computeRadiation(withGases(base, at(from)), table, settings, progressPrinter(values.quiet!, `${gas.id} ${from} ${gas.unit}`))
  const after = computeRadiation(withGases(base, at(to)), table, settings, progressPrinter(values.quiet!, `${gas.id} ${to} ${gas.unit}`))
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
