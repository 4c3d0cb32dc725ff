import Papa from 'papaparse'
import { AppError } from '../errors'

type Results = Awaited<ReturnType<typeof import('./run.service').getRunResults>>
type DetailSpectrum = Awaited<ReturnType<typeof import('./run.service').getRunDetailSpectrum>>

export const CSV_TABLES = ['spectrum', 'levels', 'layers', 'detail'] as const
export type CsvTable = (typeof CSV_TABLES)[number]

function csvHeader(runId: number, inputHash: string, engineVersion: string, extra: string[] = []): string {
  return [
    `# Tauline run ${runId}, input hash ${inputHash}, engine ${engineVersion}`,
    ...extra,
    '# Clear-sky, local thermodynamic equilibrium; see docs/PHYSICS.md for methods and limits.',
  ].join('\n')
}

/** The columns shared by the binned spectrum and the full-resolution window, at index i. */
function spectralRow(s: Record<string, (number | null)[]>, i: number): Record<string, number | null> {
  return {
    'wavenumber_cm-1': s.wavenumberCm[i],
    'olr_W_m-2_(cm-1)-1': s.olrSpectral[i],
    'surface_down_W_m-2_(cm-1)-1': s.surfaceDownSpectral[i],
    'toa_nadir_radiance_W_m-2_sr-1_(cm-1)-1': s.toaNadirRadiance[i],
    toa_brightness_temperature_K: s.toaBrightnessTemperatureK[i],
    'surface_zenith_radiance_W_m-2_sr-1_(cm-1)-1': s.surfaceZenithRadiance[i],
    column_transmittance: s.columnTransmittance[i],
  }
}

/** The full-resolution window as CSV: one row per point of the calculation's grid. */
export function detailCsv(detail: DetailSpectrum): string {
  const d = detail as unknown as Record<string, (number | null)[]> & { startCm: number; endCm: number }
  const header = csvHeader(detail.runId, detail.inputHash, detail.engineVersion, [
    `# Full-resolution window ${d.startCm}–${d.endCm} cm-1 on the calculation's own grid (not uniform: fine near line centres).`,
  ])
  const rows = d.wavenumberCm.map((_, i) => spectralRow(d, i))
  return `${header}\n${Papa.unparse(rows)}\n`
}

/** One results table as CSV with units in the column names. */
export function resultsCsv(results: Results, table: Exclude<CsvTable, 'detail'>): string {
  const r = results as unknown as {
    spectrum: Record<string, (number | null)[]>
    levels: Record<string, (number | null)[]>
    layers: Record<string, (number | null)[]>
  }
  const header = csvHeader(results.runId, results.inputHash, results.engineVersion)
  let rows: Record<string, number | null>[]
  if (table === 'spectrum') {
    const s = r.spectrum
    rows = s.wavenumberCm.map((_, i) => ({
      ...spectralRow(s, i),
      emission_pressure_Pa: s.emissionPressurePa[i],
      emission_height_m: s.emissionHeightM[i],
    }))
  } else if (table === 'levels') {
    const l = r.levels
    rows = l.pressurePa.map((_, i) => ({
      level: i,
      pressure_Pa: l.pressurePa[i],
      height_m: l.heightM[i],
      temperature_K: l.temperatureK[i],
      'flux_up_W_m-2': l.fluxUpWPerM2[i],
      'flux_down_W_m-2': l.fluxDownWPerM2[i],
      'flux_net_up_W_m-2': l.fluxNetUpWPerM2[i],
      lte_collision_to_emission_ratio: l.lteRatio[i],
    }))
  } else if (table === 'layers') {
    rows = r.layers.heatingRateKPerDay.map((h, i) => ({
      layer: i,
      pressure_bottom_Pa: r.levels.pressurePa[i],
      pressure_top_Pa: r.levels.pressurePa[i + 1],
      heating_rate_K_per_day: h,
    }))
  } else {
    throw AppError.badRequest(`table must be one of ${CSV_TABLES.join(', ')}.`, { field: 'table' })
  }
  return `${header}\n${Papa.unparse(rows)}\n`
}
