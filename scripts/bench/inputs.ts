// Inputs of the benchmark cases: the built-in catalogue, scaled copies of it, and profiles.
import { readFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { parseCatalogue } from '../../shared/catalogue/catalogue-file'
import { buildClimatologyProfile } from '../../shared/physics/atmosphere/climatology'
import {
  toLineTable,
  type LineTable,
  type SpectralLine,
} from '../../shared/physics/spectroscopy/line'
import type { AtmosphereProfile } from '../../shared/physics/types'

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..')

export interface Catalogue {
  lines: SpectralLine[]
  table: LineTable
  header: { lineCount: number; generatorVersion: string; checksum: string }
}

/** The built-in catalogue (data/builtin-catalogue.json), parsed and checksum-verified. */
export function loadBuiltInCatalogue(): Catalogue {
  const parsed = parseCatalogue(readFileSync(join(ROOT, 'data', 'builtin-catalogue.json'), 'utf8'))
  return {
    lines: parsed.lines,
    table: toLineTable(parsed.lines),
    header: {
      lineCount: parsed.header.lineCount,
      generatorVersion: parsed.header.generatorVersion,
      checksum: parsed.header.checksum,
    },
  }
}

/**
 * The catalogue with every line replaced by `factor` copies at offsets j·0.0137 cm⁻¹ (j = 0 …
 * factor − 1) and intensity S/factor, so that band intensities (and roughly the optical depths)
 * stay those of the original while the line count grows `factor` times.
 */
export function scaledCatalogue(lines: readonly SpectralLine[], factor: number): LineTable {
  if (factor === 1) return toLineTable(lines)
  const copies: SpectralLine[] = []
  for (const line of lines) {
    for (let j = 0; j < factor; j++) {
      copies.push({
        ...line,
        wavenumberCm: line.wavenumberCm + j * 0.0137,
        intensityCmPerMolecule: line.intensityCmPerMolecule / factor,
      })
    }
  }
  return toLineTable(copies)
}

/** Mid-latitude summer climatology with `layers` layers from the surface to 10 Pa. */
export function midLatitudeSummer(layers: number): AtmosphereProfile {
  return buildClimatologyProfile('mid-latitude-summer', {
    levelCount: layers + 1,
    topPressurePa: 10,
  })
}

/** The profile with its CO₂ mixing ratio multiplied by `factor` at every level. */
export function withCo2Scaled(profile: AtmosphereProfile, factor: number): AtmosphereProfile {
  return {
    ...profile,
    levels: profile.levels.map((level) => ({
      ...level,
      vmr: { ...level.vmr, CO2: (level.vmr.CO2 ?? 0) * factor },
    })),
  }
}
