import { createHash } from 'node:crypto'
import { existsSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import {
  CATALOGUE_FORMAT,
  CATALOGUE_FORMAT_VERSION,
  parseCatalogue,
  serialiseCatalogue,
} from '../../../shared/catalogue/catalogue-file'
import { buildBuiltInCatalogue } from '../../../shared/catalogue/registry'
import { PhysicsError } from '../../../shared/physics/errors'
import { expectRelativeClose } from '../../support/expect-close'

const catalogue = buildBuiltInCatalogue()
const text = serialiseCatalogue(catalogue)

describe('serialiseCatalogue', () => {
  it('when a catalogue is built and serialised twice, returns identical bytes', () => {
    // Determinism requirement of the committed catalogue (common practice).
    expect(serialiseCatalogue(buildBuiltInCatalogue())).toBe(text)
  })

  it('when serialised, writes a one-line header with format, version, counts and checksum', () => {
    const firstLine = text.slice(0, text.indexOf('\n'))
    const header = JSON.parse(firstLine.replace(/^\{"header":/, '').replace(/,$/, ''))
    expect(header.format).toBe(CATALOGUE_FORMAT)
    expect(header.formatVersion).toBe(CATALOGUE_FORMAT_VERSION)
    expect(header.lineCount).toBe(catalogue.lines.length)
    expect(header.bandCount).toBe(catalogue.bands.length)
    expect(header.checksum).toMatch(/^sha256:[0-9a-f]{64}$/)
    expect(text.endsWith('}\n')).toBe(true)
  })

  it('when the checksum is recomputed with node:crypto over the body, matches the header', () => {
    const body = text.slice(text.indexOf('\n"body":') + '\n"body":'.length, text.lastIndexOf('}'))
    const digest = createHash('sha256').update(body, 'utf8').digest('hex')
    expect(JSON.parse(text).header.checksum).toBe(`sha256:${digest}`)
  })

  it('when the file is kept small, stays under 5 MB', () => {
    // Committed-file budget (a few MB; a more compact encoding is due beyond ~5 MB): common practice.
    expect(Buffer.byteLength(text)).toBeLessThan(5_000_000)
  })
})

describe('parseCatalogue', () => {
  const parsed = parseCatalogue(text)

  it('when a serialised catalogue is parsed, returns the same lines within the stored precision', () => {
    expect(parsed.lines.length).toBe(catalogue.lines.length)
    for (let i = 0; i < parsed.lines.length; i++) {
      const a = parsed.lines[i]
      const b = catalogue.lines[i]
      expect(Math.abs(a.wavenumberCm - b.wavenumberCm)).toBeLessThanOrEqual(5.1e-7) // half a unit of the 6th decimal
      expectRelativeClose(a.intensityCmPerMolecule, b.intensityCmPerMolecule, 5e-10)
      expectRelativeClose(a.einsteinAPerS, b.einsteinAPerS, 5e-7)
      expect(Math.abs(a.lowerStateEnergyCm - b.lowerStateEnergyCm)).toBeLessThanOrEqual(5.1e-5) // half a unit of the 4th decimal
      expect(a.lowerLocalQuanta).toBe(b.lowerLocalQuanta)
      expect(a.upperGlobalQuanta).toBe(b.upperGlobalQuanta)
      expect(a.upperStatisticalWeight).toBe(b.upperStatisticalWeight)
    }
    expect(parsed.lineBandIndex).toEqual(catalogue.lineBandIndex)
  })

  it('when the parsed lines are summed per band, return the band sums to 1e-9', () => {
    // Rounding to 10 significant digits keeps the normalisation (generator requirement); the
    // H2O pure-rotation band has no adopted band intensity, so its own sum is the reference.
    const sums = new Array<number>(parsed.bands.length).fill(0)
    parsed.lines.forEach(
      (line, i) => (sums[parsed.lineBandIndex[i]] += line.intensityCmPerMolecule),
    )
    parsed.bands.forEach((band, b) => {
      const reference = band.publishedBandIntensityCmPerMolecule ?? band.intensitySumCmPerMolecule
      expectRelativeClose(sums[b], reference, 1e-9, band.id)
    })
    expect(parsed.bands.map((band) => band.molecule)).toEqual(
      catalogue.bands.map((b) => b.molecule),
    )
  })

  it('when one digit of the body is changed, throws PhysicsError PARSE_ERROR (checksum)', () => {
    const at = text.indexOf('"wavenumberCm":[') + '"wavenumberCm":['.length + 2
    const digit = text[at]
    const modified = text.slice(0, at) + (digit === '1' ? '2' : '1') + text.slice(at + 1)
    expect(() => parseCatalogue(modified)).toThrow(PhysicsError)
    try {
      parseCatalogue(modified)
    } catch (error) {
      expect((error as PhysicsError).code).toBe('PARSE_ERROR')
      expect((error as PhysicsError).message).toMatch(/checksum/)
    }
  })

  it('when the text is not a catalogue or has another version, throws PhysicsError', () => {
    expect(() => parseCatalogue('not json')).toThrow(PhysicsError)
    expect(() => parseCatalogue('{"header":{},"body":{}}')).toThrow(PhysicsError)
    const otherVersion = text.replace('"formatVersion":1', '"formatVersion":2')
    expect(() => parseCatalogue(otherVersion)).toThrow(/version/)
  })

  it('when given a custom hash function, uses it for the checksum', () => {
    const hash = (s: string) => createHash('sha256').update(s, 'utf8').digest('hex')
    expect(serialiseCatalogue(catalogue, { hash })).toBe(text)
    expect(parseCatalogue(text, { hash }).header.checksum).toBe(parsed.header.checksum)
  })
})

describe('committed catalogue file', () => {
  const path = join(__dirname, '..', '..', '..', 'data', 'builtin-catalogue.json')
  it('when data/builtin-catalogue.json is compared with a fresh build, is identical (else regenerate)', () => {
    // Regenerate with: node --import tsx scripts/generate-catalogue.ts
    expect(existsSync(path)).toBe(true)
    expect(readFileSync(path, 'utf8') === text, 'data/builtin-catalogue.json is stale').toBe(true)
  })
})
