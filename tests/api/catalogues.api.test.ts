import { createHash } from 'node:crypto'
import { once } from 'node:events'
import {
  appendFileSync,
  createWriteStream,
  existsSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
} from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { loadBuiltInCatalogue } from '../../server/catalogue/builtin-catalogue'
import { runCatalogueChecksum } from '../../server/catalogue/catalogue-checksum'
import { importDir, pendingFilePath } from '../../server/catalogue/import/pending-imports'
import { createLogger } from '../../server/logger'
import { CatalogueLineBlock, LineCatalogue } from '../../server/models/index'
import { startChunkWorkers } from '../../server/runs/chunk-workers'
import { CHUNK_QUEUE } from '../../server/runs/run-queue'
import type {
  CatalogueDetail,
  CatalogueSummary,
  ImportPreview,
  StickSpectrum,
} from '../../shared/schemas/catalogues'
import { lineRecord, syntheticRecord } from '../fixtures/line-lists/record-builder'
import { signedInAgent } from '../support/http-agent'
import { createPresetProfile, QUICK_RUN_SETTINGS, waitForRun } from '../support/runs'
import { createTestApp, type TestApp } from '../support/test-app'

type Agent = Awaited<ReturnType<typeof signedInAgent>>

const CO2_FIXTURE = 'tests/fixtures/line-lists/co2-667.par'
const MALFORMED_FIXTURE = 'tests/fixtures/line-lists/malformed.par'

let t: TestApp
let scratch: string

beforeAll(async () => {
  t = await createTestApp({ runs: { threads: 1 } })
  scratch = mkdtempSync(join(tmpdir(), 'tauline-catalogue-test-'))
  // Uploads of this file go to a folder of its own, so counting its files is not disturbed.
  process.env.TAULINE_IMPORT_DIR = join(scratch, 'imports')
})
afterAll(async () => {
  await t?.close()
  rmSync(scratch, { recursive: true, force: true })
})

/** Uploads a file from disk (streamed, never read into memory) as multipart "file"; checks the status. */
async function upload(a: Agent, path: string, status: number, name = 'lines.par') {
  const csrf = (await a.get('/api/auth/csrf').expect(200)).body.csrfToken as string
  return a.agent
    .post('/api/catalogues/imports')
    .set('x-csrf-token', csrf)
    .attach('file', path, name)
    .expect(status)
}

async function importFile(
  a: Agent,
  path: string,
  body: { name: string; mergeWithBuiltIn?: boolean },
): Promise<CatalogueDetail> {
  const preview = (await upload(a, path, 200)).body as ImportPreview
  return (await a.post(`/api/catalogues/imports/${preview.token}/commit`, body).expect(201)).body
    .catalogue as CatalogueDetail
}

/** |actual/expected − 1| ≤ tolerance, with both numbers in the failure message. */
function expectRelative(actual: number, expected: number, tolerance: number) {
  expect(Math.abs(actual / expected - 1), `${actual} vs ${expected}`).toBeLessThanOrEqual(tolerance)
}

const filesWaiting = () => (existsSync(importDir()) ? readdirSync(importDir()).length : 0)

const rowCounts = async () => ({
  catalogues: await LineCatalogue.count(),
  blocks: await CatalogueLineBlock.count(),
})

/** Writes a file of `count` synthetic records (see record-builder.ts) in pieces. */
async function writeSyntheticFile(path: string, count: number): Promise<void> {
  const out = createWriteStream(path)
  for (let i = 0; i < count; i += 2000) {
    let piece = ''
    for (let k = i; k < Math.min(count, i + 2000); k++) piece += `${syntheticRecord(k)}\n`
    if (!out.write(piece)) await once(out, 'drain')
  }
  out.end()
  await once(out, 'finish')
}

describe('catalogues API', () => {
  it('when anyone lists catalogues, the built-in one comes first, read-only, with bands, sources, confidence tags and accuracy notes', async () => {
    const reviewer = await signedInAgent(t, 'reviewer')
    const res = await reviewer.get('/api/catalogues').expect(200)
    const first = res.body.items[0] as CatalogueSummary
    expect(first).toMatchObject({ id: 'builtin', kind: 'builtin', readOnly: true })
    const builtIn = loadBuiltInCatalogue()
    expect(first.lineCount).toBe(builtIn.lineCount)
    expect(first.checksum).toBe(builtIn.checksum)
    expect(first.builtin!.bands).toHaveLength(builtIn.parsed.bands.length)
    expect(first.builtin!.bands[0]).toMatchObject({
      source: builtIn.parsed.bands[0].source,
      confidence: builtIn.parsed.bands[0].confidence,
    })
    expect(first.builtin!.confidenceTags.map((c) => c.tag)).toEqual([
      'VERIFIED',
      'COMPUTED',
      'MEMORY',
      'MEMORY-low',
    ])
    expect(first.builtin!.accuracyNotes.join(' ')).toMatch(/not a measured line list/)

    const detail = (await reviewer.get('/api/catalogues/builtin').expect(200)).body
      .catalogue as CatalogueDetail
    expect(detail.moleculeTable.map((m) => m.molecule).sort()).toEqual([
      'CH4',
      'CO2',
      'H2O',
      'N2O',
      'O3',
    ])
    expect(detail.moleculeTable.reduce((s, m) => s + m.lineCount, 0)).toBe(builtIn.lineCount)
    await reviewer.get('/api/catalogues/nonsense').expect(400)
    await reviewer.get('/api/catalogues/99999').expect(404)
  })

  it('when an analyst uploads a valid list, answers its summary and a token; the commit stores it with its provenance', async () => {
    const a = await signedInAgent(t, 'analyst')
    const before = await rowCounts()
    const preview = (await upload(a, CO2_FIXTURE, 200, 'co2-667.par')).body as ImportPreview
    const bytes = readFileSync(CO2_FIXTURE)
    expect(preview).toMatchObject({
      fileName: 'co2-667.par',
      byteSize: bytes.length,
      fileSha256: createHash('sha256').update(bytes).digest('hex'),
    })
    expect(preview.token).toMatch(/^[0-9a-f]{32}$/)
    expect(Date.parse(preview.expiresAt) - Date.now()).toBeGreaterThan(29 * 60_000)
    const s = preview.summary
    // Hand sums of the fixture's intensities (tests/fixtures/line-lists/co2-667.par).
    expect(s).toMatchObject({
      lineCount: 6,
      minWavenumberCm: 662.3734,
      maxWavenumberCm: 676.0211,
      sortedByWavenumber: true,
      bandGroupCount: 3,
    })
    expect(s.molecules).toHaveLength(1)
    expect(s.molecules[0]).toMatchObject({ molecule: 'CO2', modelled: true, lineCount: 6 })
    expectRelative(s.molecules[0].intensitySumCmPerMolecule, 4.129e-18, 1e-12)
    expect(
      s.molecules[0].isotopologues.map((i) => [i.isotopologueId, i.code, i.lineCount]),
    ).toEqual([
      [1, '626', 5],
      [2, '636', 1],
    ])
    expect(s.strongestBand).toMatchObject({
      molecule: 'CO2',
      isotopologueId: 1,
      upperGlobalQuanta: '0 1 1 01',
      lowerGlobalQuanta: '0 0 0 01',
      lineCount: 4,
    })
    expectRelative(s.strongestBand!.intensitySumCmPerMolecule, 3.931e-18, 1e-12)
    expect(await rowCounts()).toEqual(before)

    const saved = (
      await a
        .post(`/api/catalogues/imports/${preview.token}/commit`, {
          name: 'CO2 near 667',
          description: 'Six lines',
        })
        .expect(201)
    ).body.catalogue as CatalogueDetail
    expect(saved).toMatchObject({
      name: 'CO2 near 667',
      kind: 'imported',
      readOnly: false,
      lineCount: 6,
      mergeWithBuiltIn: false,
      sourceFileName: 'co2-667.par',
      ownerName: 'Ines Varga',
    })
    expect(saved.checksum).toMatch(/^sha256:[0-9a-f]{64}$/)
    expect(saved.provenance).toMatchObject({
      fileSha256: preview.fileSha256,
      byteSize: bytes.length,
      uploadedBy: { name: 'Ines Varga' },
    })
    expect(await rowCounts()).toEqual({
      catalogues: before.catalogues + 1,
      blocks: before.blocks + 1,
    })
    const block = await CatalogueLineBlock.findOne({ where: { catalogueId: saved.id as number } })
    expect(block).toMatchObject({
      blockIndex: 0,
      lineCount: 6,
      minWavenumberCm: 662.3734,
      maxWavenumberCm: 676.0211,
    })
    expect(saved.checksum).toBe(`sha256:${createHash('sha256').update(block!.data).digest('hex')}`)

    // The token is spent; the list shows the import after the built-in entry.
    await a.post(`/api/catalogues/imports/${preview.token}/commit`, { name: 'again' }).expect(404)
    const list = (await a.get('/api/catalogues?pageSize=5').expect(200)).body
    expect(list.items.map((c: CatalogueSummary) => c.id).slice(0, 2)).toEqual(['builtin', saved.id])
    expect(list.items[1]).toMatchObject({
      molecules: ['CO2'],
      minWavenumberCm: 662.3734,
      maxWavenumberCm: 676.0211,
    })
    await LineCatalogue.destroy({ where: { id: saved.id as number } })
  })

  it('when a file has malformed records, answers 400 naming each line and field, and keeps neither rows nor the file', async () => {
    const a = await signedInAgent(t, 'analyst')
    const before = await rowCounts()
    const kept = filesWaiting()
    const res = await upload(a, MALFORMED_FIXTURE, 400)
    expect(res.body.error.code).toBe('LINE_LIST_INVALID')
    expect(res.body.error.details.errorCount).toBe(3)
    expect(
      res.body.error.details.errors.map((e: { lineNumber: number; field: string }) => [
        e.lineNumber,
        e.field,
      ]),
    ).toEqual([
      [3, 'wavenumberCm'],
      [5, 'record'],
      [6, 'airHalfWidthCmPerAtm'],
    ])
    expect(res.body.error.details.errors[0]).toMatchObject({
      columnRange: [4, 15],
      value: '  667,380000',
    })
    expect(res.body.error.message).toContain('line 3, columns 4–15 (wavenumberCm)')
    expect(filesWaiting()).toBe(kept)
    expect(await rowCounts()).toEqual(before)
  })

  it('when a commit fails after blocks were written, nothing of the catalogue is stored', async () => {
    const a = await signedInAgent(t, 'analyst')
    const path = join(scratch, 'sixty-thousand.par')
    await writeSyntheticFile(path, 60_000)
    const preview = (await upload(a, path, 200)).body as ImportPreview
    expect(preview.summary.lineCount).toBe(60_000)
    // The kept file goes bad after its check: line 60 001 has no decimal point in its wavenumber.
    appendFileSync(pendingFilePath(preview.token), `${lineRecord({ wavenumber: '700' })}\n`)
    const before = await rowCounts()
    const res = await a
      .post(`/api/catalogues/imports/${preview.token}/commit`, { name: 'Half a file' })
      .expect(400)
    expect(res.body.error.details.errors[0]).toMatchObject({
      lineNumber: 60_001,
      field: 'wavenumberCm',
    })
    expect(await rowCounts()).toEqual(before)
  })

  it('when a reviewer imports or someone else commits an upload, answers 403', async () => {
    const reviewer = await signedInAgent(t, 'reviewer')
    // The role guard answers before the body is read; a multipart body still being written then
    // can fail the client's write (EPIPE), so this request carries none.
    await reviewer.post('/api/catalogues/imports', {}).expect(403)
    const analyst = await signedInAgent(t, 'analyst')
    const preview = (await upload(analyst, CO2_FIXTURE, 200)).body as ImportPreview
    const admin = await signedInAgent(t, 'admin')
    await admin
      .post(`/api/catalogues/imports/${preview.token}/commit`, { name: 'Not mine' })
      .expect(403)
    await reviewer
      .post(`/api/catalogues/imports/${preview.token}/commit`, { name: 'Not mine' })
      .expect(403)
    await analyst.post('/api/catalogues/imports/not-a-token/commit', { name: 'x' }).expect(404)
    await analyst.post(`/api/catalogues/imports/${preview.token}/commit`, { name: '' }).expect(400)
    const saved = (
      await analyst
        .post(`/api/catalogues/imports/${preview.token}/commit`, { name: 'Mine' })
        .expect(201)
    ).body.catalogue
    await reviewer.delete(`/api/catalogues/${saved.id}`).expect(403)
    await analyst.delete('/api/catalogues/builtin').expect(403)
    await admin.delete(`/api/catalogues/${saved.id}`).expect(204)
    await analyst.get(`/api/catalogues/${saved.id}`).expect(404)
  })

  it('when asked for sticks, returns the strongest line per bin and molecule', async () => {
    const a = await signedInAgent(t, 'analyst')
    const saved = await importFile(a, CO2_FIXTURE, { name: 'Sticks' })
    // 10 bins of 10 cm⁻¹ over 660–760: bin 0 holds four lines, bin 1 two (fixture positions).
    const coarse = (
      await a.get(`/api/catalogues/${saved.id}/sticks?startCm=660&endCm=760&bins=10`).expect(200)
    ).body as StickSpectrum
    expect(coarse).toMatchObject({
      startCm: 660,
      endCm: 760,
      bins: 10,
      binWidthCm: 10,
      lineCountInRange: 6,
    })
    expect(coarse.series).toHaveLength(1)
    expect(coarse.series[0]).toMatchObject({
      molecule: 'CO2',
      fromBuiltIn: false,
      wavenumberCm: [667.3796, 672.5],
      intensityCmPerMolecule: [3.305e-18, 1.9e-19],
    })
    const fine = (
      await a.get(`/api/catalogues/${saved.id}/sticks?startCm=660&endCm=680&bins=20`).expect(200)
    ).body as StickSpectrum
    expect(fine.series[0].wavenumberCm).toEqual([
      662.3734, 664.942, 667.3796, 669.8812, 672.5, 676.0211,
    ])
    const whole = (await a.get(`/api/catalogues/${saved.id}/sticks`).expect(200))
      .body as StickSpectrum
    expect(whole).toMatchObject({ startCm: 662, endCm: 677, bins: 1500, lineCountInRange: 6 })
    await a.get(`/api/catalogues/${saved.id}/sticks?startCm=700&endCm=600`).expect(400)

    // Built-in: never more points than bins per molecule; each is the strongest line of its bin.
    const builtIn = (
      await a.get('/api/catalogues/builtin/sticks?startCm=600&endCm=700&bins=50').expect(200)
    ).body as StickSpectrum
    const table = loadBuiltInCatalogue().table
    const strongest = new Map<string, number>()
    for (let i = 0; i < table.length; i++) {
      const w = table.wavenumberCm[i]
      if (w < 600 || w > 700) continue
      const key = `${table.moleculeId[i]}:${Math.min(49, Math.floor((w - 600) / 2))}`
      strongest.set(key, Math.max(strongest.get(key) ?? 0, table.intensityCmPerMolecule[i]))
    }
    let points = 0
    for (const series of builtIn.series) {
      expect(series.wavenumberCm.length).toBeLessThanOrEqual(50)
      series.wavenumberCm.forEach((nu, k) => {
        expect(series.intensityCmPerMolecule[k]).toBe(
          strongest.get(`${series.moleculeId}:${Math.min(49, Math.floor((nu - 600) / 2))}`),
        )
        points++
      })
    }
    expect(points).toBe(strongest.size)
    expect(builtIn.series.map((s) => s.molecule)).toContain('CO2')
    await LineCatalogue.destroy({ where: { id: saved.id as number } })
  })

  it('when a run uses an imported catalogue, it records the id and checksum, succeeds, and blocks deletion while queued', async () => {
    const a = await signedInAgent(t, 'analyst')
    const profileId = await createPresetProfile(a)
    const saved = await importFile(a, CO2_FIXTURE, { name: 'Six CO2 lines' })
    const system = t.runSystem!
    await system.queue.boss.offWork(CHUNK_QUEUE)
    const run = (
      await a
        .post('/api/runs', { profileId, catalogueId: saved.id, settings: QUICK_RUN_SETTINGS })
        .expect(202)
    ).body.run
    expect(run.inputs.catalogue).toEqual({
      id: String(saved.id),
      checksum: saved.checksum,
      generatorVersion: 'imported',
      lineCount: 6,
    })
    const refused = await a.delete(`/api/catalogues/${saved.id}`).expect(409)
    expect(refused.body.error.details).toEqual({ runCount: 1 })
    await startChunkWorkers(system.queue, {
      sequelize: t.sequelize,
      pool: system.pool!,
      logger: createLogger('silent'),
    })
    const done = await waitForRun(a, run.id)
    expect(done.status).toBe('succeeded')
    const results = (await a.get(`/api/runs/${run.id}/results`).expect(200)).body
    expect(results.summary.olrWPerM2).toBeGreaterThan(0)

    // The same run on the built-in catalogue computes from other lines: other hash, other OLR.
    const builtInRun = (
      await a.post('/api/runs', { profileId, settings: QUICK_RUN_SETTINGS }).expect(202)
    ).body.run
    expect(builtInRun.inputHash).not.toBe(run.inputHash)
    const builtInResults = (
      await a.get(`/api/runs/${(await waitForRun(a, builtInRun.id)).id}/results`).expect(200)
    ).body
    expect(builtInResults.summary.olrWPerM2).not.toBe(results.summary.olrWPerM2)

    await a.delete(`/api/catalogues/${saved.id}`).expect(204)
    expect(await CatalogueLineBlock.count({ where: { catalogueId: saved.id as number } })).toBe(0)
    await a
      .post('/api/runs', { profileId, catalogueId: saved.id, settings: QUICK_RUN_SETTINGS })
      .expect(400)
  })

  it('when an import is merged with the built-in catalogue, runs use its lines plus the built-in lines of the other molecules', async () => {
    const a = await signedInAgent(t, 'analyst')
    const profileId = await createPresetProfile(a)
    const saved = await importFile(a, CO2_FIXTURE, { name: 'CO2 replaced', mergeWithBuiltIn: true })
    const builtIn = loadBuiltInCatalogue()
    let otherLines = 0
    for (let i = 0; i < builtIn.table.length; i++)
      if (builtIn.table.moleculeId[i] !== 2) otherLines++
    expect(saved.builtInMoleculesUsed.sort()).toEqual(['CH4', 'H2O', 'N2O', 'O3'])
    expect(saved.effectiveLineCount).toBe(6 + otherLines)

    const run = (
      await a
        .post('/api/runs', { profileId, catalogueId: saved.id, settings: QUICK_RUN_SETTINGS })
        .expect(202)
    ).body.run
    expect(run.inputs.catalogue).toMatchObject({
      id: String(saved.id),
      checksum: runCatalogueChecksum(saved.checksum, builtIn.checksum),
      lineCount: 6 + otherLines,
    })
    expect((await waitForRun(a, run.id)).status).toBe('succeeded')

    const sticks = (
      await a.get(`/api/catalogues/${saved.id}/sticks?startCm=600&endCm=700&bins=100`).expect(200)
    ).body as StickSpectrum
    expect(sticks.series.filter((s) => !s.fromBuiltIn).map((s) => s.molecule)).toEqual(['CO2'])
    expect(sticks.series.filter((s) => s.fromBuiltIn).map((s) => s.molecule)).not.toContain('CO2')
    expect(sticks.series.some((s) => s.fromBuiltIn)).toBe(true)
  })

  it(
    'imports a generated file of one million lines with bounded memory',
    { timeout: 180_000 },
    async () => {
      const a = await signedInAgent(t, 'analyst')
      const path = join(scratch, 'million.par')
      await writeSyntheticFile(path, 1_000_000)
      const baseline = process.memoryUsage().rss
      let peak = baseline
      const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 100)
      let saved: CatalogueDetail
      try {
        saved = await importFile(a, path, { name: 'A million lines' })
      } finally {
        clearInterval(sampler)
      }
      peak = Math.max(peak, process.memoryUsage().rss)
      // 1e6 lines hold 72 MB of line data; streaming keeps the growth far below the file's 161 MB.
      expect((peak - baseline) / 1024 / 1024).toBeLessThan(300)
      expect(saved.lineCount).toBe(1_000_000)
      expect(await CatalogueLineBlock.count({ where: { catalogueId: saved.id as number } })).toBe(
        20,
      )
      const sticks = (await a.get(`/api/catalogues/${saved.id}/sticks`).expect(200))
        .body as StickSpectrum
      expect(sticks.lineCountInRange).toBe(1_000_000)
      expect(sticks.series[0].wavenumberCm.length).toBeLessThanOrEqual(1500)
      rmSync(path, { force: true })
    },
  )
})
