import { describe, expect, it } from 'vitest'
import { LINEAR_BANDS } from '../../../shared/catalogue/constants/linear-bands'
import {
  ASYMMETRIC_BAND_GENERATORS,
  BUILT_IN_BAND_GENERATORS,
  CATALOGUE_GENERATOR_VERSION,
  LINEAR_BAND_GENERATORS,
  buildBuiltInCatalogue,
  dropNonIntegerStatisticalWeights,
  type BandGenerator,
} from '../../../shared/catalogue/registry'
import { PhysicsError } from '../../../shared/physics/errors'
import type { SpectralLine } from '../../../shared/physics/spectroscopy/line'
import { expectRelativeClose } from '../../support/expect-close'

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
      let min = Infinity
      let max = -Infinity
      let sum = 0
      for (const line of own) {
        min = Math.min(min, line.wavenumberCm)
        max = Math.max(max, line.wavenumberCm)
        sum += line.intensityCmPerMolecule
      }
      expect(min).toBe(band.minWavenumberCm)
      expect(max).toBe(band.maxWavenumberCm)
      expectRelativeClose(sum, band.intensitySumCmPerMolecule, 1e-12, band.id)
      // Generators normalise each band to its adopted band intensity (generator requirement).
      if (band.publishedBandIntensityCmPerMolecule !== null) {
        expectRelativeClose(sum, band.publishedBandIntensityCmPerMolecule, 1e-9, band.id)
      }
      expect(band.source.length).toBeGreaterThan(10)
    })
  })

  it('when the asymmetric generators are wired in, lists H2O, O3 and CH4 bands after the linear ones', () => {
    expect(BUILT_IN_BAND_GENERATORS.length).toBe(
      LINEAR_BAND_GENERATORS.length + ASYMMETRIC_BAND_GENERATORS.length,
    )
    expect(ASYMMETRIC_BAND_GENERATORS.map((g) => g.id)).toEqual([
      'h2o-161-rotation',
      'h2o-161-nu2',
      'o3-666-nu3',
      'o3-666-nu1',
      'ch4-211-nu4',
    ])
    const byId = new Map(catalogue.bands.map((band) => [band.id, band]))
    for (const id of [
      'h2o-161-rotation',
      'h2o-161-nu2',
      'o3-666-nu3',
      'o3-666-nu1',
      'ch4-211-nu4',
    ]) {
      expect(byId.get(id)?.lineCount, id).toBeGreaterThan(50)
    }
    // Lines of each band carry their own molecule (ids 1 H2O, 3 O3, 6 CH4; database numbering).
    catalogue.lines.forEach((line, i) => {
      expect(line.moleculeId).toBe(catalogue.bands[catalogue.lineBandIndex[i]].moleculeId)
    })
  })

  it('when the H2O pure-rotation band is summed, is within 3 % of the rigid-rotor sum rule', () => {
    // ΣS = (8π³/3hc)μ²(A + C) = 5.32e-17 cm/molecule (computed by hand from μ = 1.8546 D, Clough
    // et al. 1973, J. Chem. Phys. 59, 2254, from memory; the real value differs by a few % because
    // of centrifugal distortion): 3 %.
    const band = catalogue.bands.find((b) => b.id === 'h2o-161-rotation')!
    expect(band.publishedBandIntensityCmPerMolecule).toBeNull()
    expectRelativeClose(band.intensitySumCmPerMolecule, 5.32e-17, 0.03)
  })

  it('when CH4 lines carry the non-integer average upper weight, drops it and keeps A', () => {
    // File convention: integer statistical weights (catalogue-file.ts); CH4 g′ = (4/3)(2J′+1)².
    const lines = [
      { ...fakeLine(1300), upperStatisticalWeight: 4 / 3, lowerStatisticalWeight: 5 },
      { ...fakeLine(1301), upperStatisticalWeight: 12, lowerStatisticalWeight: 2.5 },
    ]
    dropNonIntegerStatisticalWeights(lines)
    expect(lines[0].upperStatisticalWeight).toBeUndefined()
    expect(lines[0].lowerStatisticalWeight).toBe(5)
    expect(lines[1].upperStatisticalWeight).toBe(12)
    expect(lines[1].lowerStatisticalWeight).toBeUndefined()
    expect(lines[0].einsteinAPerS).toBe(1)
    const ch4 = catalogue.lines.filter((line) => line.moleculeId === 6)
    expect(ch4.length).toBeGreaterThan(0)
    for (const line of ch4) {
      if (line.upperStatisticalWeight !== undefined) {
        expect(Number.isInteger(line.upperStatisticalWeight)).toBe(true)
      }
    }
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
