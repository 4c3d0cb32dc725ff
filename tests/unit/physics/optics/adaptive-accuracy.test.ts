/**
 * The engine's adaptive spectral method against the brute-force path on the CO₂ ν₂ Q branch: the
 * same profile, lines and settings, once with spectralMethod 'adaptive' (adaptive grid, masked
 * multi-level optics, column solver) and once with 'reference' (uniform grid of a quarter of the
 * narrowest Voigt half width, every line summed at every point with the accurate Voigt function,
 * layer-by-layer solver).
 *
 * Tolerances (the targets of the engine, "Performance" issue): fluxes within 0.05 W m⁻² over
 * 10–3000 cm⁻¹, scaled here to the window width; heating rates within 0.01 K/day. Both are
 * asserted at every level/layer; the measured errors are printed.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { parseCatalogue } from '../../../../shared/catalogue/catalogue-file'
import { buildClimatologyProfile } from '../../../../shared/physics/atmosphere/climatology'
import { computeRadiation } from '../../../../shared/physics/engine/compute'
import { MOLECULE_IDS, toLineTable } from '../../../../shared/physics/spectroscopy/line'

const catalogue = parseCatalogue(
  readFileSync(new URL('../../../../data/builtin-catalogue.json', import.meta.url), 'utf8'),
)
const co2Lines = toLineTable(catalogue.lines.filter((l) => l.moleculeId === MOLECULE_IDS.CO2))
// 11 levels from the surface to 0.1 hPa: the top layers hold Doppler-narrow cores, the lower ones
// pressure-broadened lines — the situation the adaptive grid is built for.
const profile = buildClimatologyProfile('mid-latitude-summer', {
  levelCount: 11,
  topPressurePa: 10,
})
// The Q branch and the strongest P/R lines near the band centre; a 5 cm⁻¹ wing cutoff keeps the
// brute-force reference (every line at every point of a 1.2e-4 cm⁻¹ grid) to a few seconds.
const WINDOW = { startCm: 665, endCm: 670, chunkWidthCm: 5, outputResolutionCm: 1, wingCutoffCm: 5 }
/** Full-range targets (common practice for line-by-line benchmarks; issue "Performance"). */
const FULL_RANGE_CM = 2990
const FLUX_TOLERANCE_W_PER_M2 = (0.05 * (WINDOW.endCm - WINDOW.startCm)) / FULL_RANGE_CM
const HEATING_TOLERANCE_K_PER_DAY = 0.01

describe('adaptive spectral method against the brute-force reference', () => {
  it('when the CO₂ Q branch (665–670 cm⁻¹, 11 levels) is computed both ways, returns fluxes within 0.05 W m⁻² × 5/2990 and heating rates within 0.01 K/day', () => {
    const reference = computeRadiation(profile, co2Lines, {
      ...WINDOW,
      spectralMethod: 'reference',
    })
    const adaptive = computeRadiation(profile, co2Lines, { ...WINDOW, spectralMethod: 'adaptive' })
    let fluxError = 0
    for (let l = 0; l < profile.levels.length; l++) {
      fluxError = Math.max(
        fluxError,
        Math.abs(adaptive.fluxUpWPerM2[l] - reference.fluxUpWPerM2[l]),
        Math.abs(adaptive.fluxDownWPerM2[l] - reference.fluxDownWPerM2[l]),
      )
    }
    let heatingError = 0
    for (let k = 0; k < profile.levels.length - 1; k++) {
      heatingError = Math.max(
        heatingError,
        Math.abs(adaptive.heatingRateKPerDay[k] - reference.heatingRateKPerDay[k]),
      )
    }
    const message = `max |ΔF| = ${fluxError.toExponential(2)} W m⁻² (tolerance ${FLUX_TOLERANCE_W_PER_M2.toExponential(2)}), max |ΔH| = ${heatingError.toExponential(2)} K/day; grid points ${adaptive.gridPointCount} vs ${reference.gridPointCount}`
    expect(fluxError, message).toBeLessThanOrEqual(FLUX_TOLERANCE_W_PER_M2)
    expect(heatingError, message).toBeLessThanOrEqual(HEATING_TOLERANCE_K_PER_DAY)
    // The window really absorbs (otherwise the comparison proves nothing): the band centre is
    // emitted from the warm stratosphere, so OLR is well below the surface emission (common
    // practice).
    expect(reference.olrWPerM2).toBeLessThan(0.8 * reference.fluxUpWPerM2[0])
    // Even on the dense Q branch the adaptive grid is several times coarser than the uniform one.
    expect(adaptive.gridPointCount).toBeLessThan(reference.gridPointCount / 2)
    console.info(message)
  }, 180_000)
})
