import { parseArgs } from 'node:util'
import { STEFAN_BOLTZMANN_W_PER_M2_K4 } from '../../shared/physics/constants'
import {
  brightnessTemperatureK,
  planckBandIntegral,
  planckRadianceWavenumber,
  wienPeakWavenumberCm,
} from '../../shared/physics/planck'
import { parseRange, printJson, requireNumber } from './args'

export const planckHelp = `tauline planck --temperature K [--wavenumber CM] [--band START:END] [--radiance R] [--json]
  Planck radiance B(ν̃, T) in W m⁻² sr⁻¹ (cm⁻¹)⁻¹, the band integral over START:END cm⁻¹ (and π× it
  as a flux), σT⁴, the Wien peak; with --radiance, the brightness temperature of R at --wavenumber.`

export function planckCommand(argv: string[]): void {
  const { values } = parseArgs({
    args: argv,
    options: {
      temperature: { type: 'string' },
      wavenumber: { type: 'string' },
      band: { type: 'string' },
      radiance: { type: 'string' },
      json: { type: 'boolean', default: false },
    },
  })
  const temperatureK = requireNumber(values, 'temperature', values.radiance !== undefined ? 0 : undefined)
  const out: Record<string, number | string> = {}
  if (temperatureK > 0) {
    out.temperatureK = temperatureK
    out.sigmaT4WPerM2 = STEFAN_BOLTZMANN_W_PER_M2_K4 * temperatureK ** 4
    out.wienPeakWavenumberCm = wienPeakWavenumberCm(temperatureK)
  }
  if (values.wavenumber !== undefined) {
    const nu = requireNumber(values, 'wavenumber')
    out.wavenumberCm = nu
    if (temperatureK > 0) out.radianceWPerM2SrCm = planckRadianceWavenumber(nu, temperatureK)
    if (values.radiance !== undefined) {
      out.brightnessTemperatureK = brightnessTemperatureK(nu, requireNumber(values, 'radiance'))
    }
  }
  if (values.band !== undefined && temperatureK > 0) {
    const [a, b] = parseRange(values.band, 'band')
    const radiance = planckBandIntegral(a, b, temperatureK)
    out.bandStartCm = a
    out.bandEndCm = b
    out.bandRadianceWPerM2Sr = radiance
    out.bandFluxWPerM2 = Math.PI * radiance
  }
  if (values.json) printJson(out)
  else for (const [k, v] of Object.entries(out)) process.stdout.write(`${k.padEnd(28)} ${typeof v === 'number' ? v.toPrecision(8) : v}\n`)
}
