import { describe, expect, it } from 'vitest'
import { LINEAR_BANDS } from '../../../shared/catalogue/constants/linear-bands'
import {
  BUILT_IN_BAND_GENERATORS,
  CATALOGUE_GENERATOR_VERSION,
  LINEAR_BAND_GENERATORS,
  buildBuiltInCatalogue,
  type BandGenerator,
} from '../../../shared/catalogue/registry'
import { PhysicsError } from '../../../shared/physics/errors'
import type { SpectralLine } from '../../../shared/physics/spectroscopy/line'
import { expectRelativeClose } from './expect-close'

function fakeLine(wavenumberCm: number): SpectralLine {
  return {
    moleculeId: 1,
    isotopologueId: 1,
    wavenumberCm,
    intensityCmPerMolecule: 1e-20,
    einsteinAPerS: 1,
    airHalfWidthCmPerAtm: 0.07,
    selfHalfWidthCmPerAtm: 0.35,
    lowerStateEnergyCm: 100,
    temperatureExponentAir: 0.7,
    pressureShiftCmPerAtm: 0,
  }
}

describe('buildBuiltInCatalogue', () => {
  const catalogue = buildBuiltInCatalogue()

  it('when built, registers one generator per linear band and sorts all lines by wavenumber', () => {
    expect(LINEAR_BAND_GENERATORS.length).toBe(LINEAR_BANDS.length)
    expect(BUILT_IN_BAND_GENERATORS.length).toBeGreaterThanOrEqual(LINEAR_BANDS.length)
    expect(catalogue.generatorVersion).toBe(CATALOGUE_GENERATOR_VERSION)
    for (let i = 1; i < catalogue.lines.length; i++) {
      expect(catalogue.lines[i].wavenumberCm).toBeGreaterThanOrEqual(
        catalogue.lines[i - 1].wavenumberCm,
      )
    }
    expect(catalogue.lineBandIndex.length).toBe(catalogue.lines.length)
  })

  it('when summarised, gives each band its line count, range and ΣS equal to the published value', () => {
    catalogue.bands.forEach((band, b) => {
      const own = catalogue.lines.filter((_, i) => catalogue.lineBandIndex[i] === b)
      expect(own.length).toBe(band.lineCount)
      expect(Math.min(...own.map((l) => l.wavenumberCm))).toBe(band.minWavenumberCm)
      expectRelativeClose(
        band.intensitySumCmPerMolecule,
        band.publishedBandIntensityCmPerMolecule!,
        1e-9,
        band.id,
      )
      expect(band.source.length).toBeGreaterThan(10)
    })
  })

  it('when another generator is plugged in, merges its lines in wavenumber order', () => {
    const extra: BandGenerator = {
      id: 'test-h2o',
      molecule: 'H2O',
      moleculeId: 1,
      description: 'test generator',
      source: 'test',
      generate: () => [fakeLine(1600), fakeLine(650)],
    }
    const built = buildBuiltInCatalogue([...LINEAR_BAND_GENERATORS.slice(0, 1), extra])
    const index = built.lines.findIndex((l) => l.moleculeId === 1)
    expect(built.lines[index].wavenumberCm).toBe(650)
    expect(built.lineBandIndex[index]).toBe(1)
    expect(built.lines[built.lines.length - 1].wavenumberCm).toBe(1600)
    expect(built.bands[1].publishedBandIntensityCmPerMolecule).toBeNull()
  })

  it('when two generators share an id or a line is invalid, throws PhysicsError', () => {
    const g = LINEAR_BAND_GENERATORS[0]
    expect(() => buildBuiltInCatalogue([g, g])).toThrow(PhysicsError)
    const bad: BandGenerator = { ...g, id: 'bad', generate: () => [fakeLine(-1)] }
    expect(() => buildBuiltInCatalogue([bad])).toThrow(PhysicsError)
  })
})
