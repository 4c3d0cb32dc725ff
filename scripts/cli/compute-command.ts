import { writeFileSync } from 'node:fs'
import { parseArgs } from 'node:util'
import Papa from 'papaparse'
import { CliError, parseRange, printJson, printTable } from './args'
import { CAUTIONS } from './cautions'
import { catalogueLines, gasesFromOptions, profileFromOptions, progressPrinter, scenarioHelp, scenarioOptionSpec, settingsFromOptions, threadsFromOptions, withGases } from './scenario-options'
import { computeOnThreads } from './threaded-compute'

export const computeHelp = `tauline compute [atmosphere, gas and spectrum options] [--spectrum-out FILE.csv]
               [--window START:END --window-out FILE.csv] [--json]
  One line-by-line calculation: fluxes at every level, OLR, surface downward flux, heating rates,
  spectral OLR. Uses the built-in line catalogue.
${scenarioHelp}
  --spectrum-out FILE.csv  write the binned spectra (OLR, surface downward flux, brightness temperature)
  --window START:END       keep a window (≤ 100 cm⁻¹) at the calculation's own grid, no bin averaging
  --window-out FILE.csv    write that window: every grid point (not evenly spaced) with OLR, surface
                           downward flux, nadir radiance, brightness temperature, column transmittance`

export async function computeCommand(argv: string[]): Promise<void> {
  const { values } = parseArgs({
    args: argv,
    options: { ...scenarioOptionSpec, 'spectrum-out': { type: 'string' }, window: { type: 'string' }, 'window-out': { type: 'string' } },
  })
  if (values['window-out'] && !values.window) throw new CliError('--window-out needs --window START:END')
  const profile = withGases(profileFromOptions(values), gasesFromOptions(values))
  const catalogue = catalogueLines()
  const settings = settingsFromOptions(values)
  if (values.window) {
    const [startCm, endCm] = parseRange(values.window, 'window')
    settings.detailWindow = { startCm, endCm }
  }
  const t0 = Date.now()
  // One profile: nothing is swept (the gas named is not used).
  const {
    members: [r],
  } = await computeOnThreads([profile], catalogue, settings, 'CO2', threadsFromOptions(values), progressPrinter(values.quiet!, 'computing'))
  const wallSeconds = (Date.now() - t0) / 1000
  const spectrumRows = Array.from(r.wavenumberCm, (w, i) => ({
    'wavenumber_cm-1': w,
    'olr_W_m-2_(cm-1)-1': r.olrSpectral[i],
    'surface_down_W_m-2_(cm-1)-1': r.surfaceDownSpectral[i],
    toa_brightness_temperature_K: r.toaBrightnessTemperatureK[i],
  }))
  if (values['spectrum-out']) writeFileSync(values['spectrum-out'], Papa.unparse(spectrumRows) + '\n')
  const d = r.detail
  if (values['window-out'] && d) {
    const windowRows = Array.from(d.wavenumberCm, (w, i) => ({
      'wavenumber_cm-1': w,
      'olr_W_m-2_(cm-1)-1': d.olrSpectral[i],
      'surface_down_W_m-2_(cm-1)-1': d.surfaceDownSpectral[i],
      'toa_nadir_radiance_W_m-2_sr-1_(cm-1)-1': d.toaNadirRadiance[i],
      toa_brightness_temperature_K: d.toaBrightnessTemperatureK[i],
      column_transmittance: d.columnTransmittance[i],
    }))
    writeFileSync(values['window-out'], Papa.unparse(windowRows) + '\n')
  }
  if (values.json) {
    printJson({
      atmosphere: profile.name,
      catalogue: { id: catalogue.id, checksum: catalogue.checksum, lineCount: catalogue.lineCount },
      settings: r.settings,
      engineVersion: r.engineVersion,
      olrWPerM2: r.olrWPerM2,
      surfaceDownWPerM2: r.surfaceDownWPerM2,
      tropopause: r.tropopause,
      levels: {
        pressurePa: r.levelPressurePa,
        heightM: r.levelHeightM,
        temperatureK: r.levelTemperatureK,
        fluxUpWPerM2: r.fluxUpWPerM2,
        fluxDownWPerM2: r.fluxDownWPerM2,
        fluxNetUpWPerM2: r.fluxNetUpWPerM2,
      },
      heatingRateKPerDay: r.heatingRateKPerDay,
      spectrum: { wavenumberCm: r.wavenumberCm, olrSpectral: r.olrSpectral, toaBrightnessTemperatureK: r.toaBrightnessTemperatureK },
      ...(d ? { window: { pointCount: d.wavenumberCm.length, wavenumberCm: d.wavenumberCm, olrSpectral: d.olrSpectral, toaBrightnessTemperatureK: d.toaBrightnessTemperatureK } } : {}),
      wallSeconds,
      cautions: CAUTIONS,
    })
    return
  }
  process.stdout.write(`${profile.name}, ${r.settings.startCm}–${r.settings.endCm} cm⁻¹, ${catalogue.lineCount} lines, ${wallSeconds.toFixed(1)} s\n\n`)
  process.stdout.write(`OLR                      ${r.olrWPerM2.toFixed(2)} W m⁻²\n`)
  process.stdout.write(`Surface downward flux    ${r.surfaceDownWPerM2.toFixed(2)} W m⁻²\n`)
  process.stdout.write(`Tropopause               ${(r.tropopause.pressurePa / 100).toFixed(1)} hPa (${r.tropopause.method})\n\n`)
  const rows: (string | number)[][] = [['level', 'p hPa', 'z km', 'T K', 'F↑ W m⁻²', 'F↓ W m⁻²', 'heating K/day']]
  for (let i = r.levelPressurePa.length - 1; i >= 0; i--) {
    rows.push([
      i,
      (r.levelPressurePa[i] / 100).toPrecision(4),
      (r.levelHeightM[i] / 1000).toFixed(2),
      r.levelTemperatureK[i].toFixed(1),
      r.fluxUpWPerM2[i].toFixed(2),
      r.fluxDownWPerM2[i].toFixed(2),
      i < r.heatingRateKPerDay.length ? r.heatingRateKPerDay[i].toFixed(3) : '',
    ])
  }
  printTable(rows)
  process.stdout.write(`\n${CAUTIONS.join('\n')}\n`)
}
