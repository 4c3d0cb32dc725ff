/**
 * Line catalogues: the read-only built-in one and imported line lists (two-step import: check a
 * file and keep it under a token, then commit it in one transaction), stick spectra, deletion.
 * Never sees req/res.
 */
import { createHash } from 'node:crypto'
import { rm } from 'node:fs/promises'
import { basename } from 'node:path'
import { Op, QueryTypes, type WhereOptions } from 'sequelize'
import { createLineTable, type LineTable } from '../../shared/physics/spectroscopy/line'
import type {
  CatalogueDetail,
  CatalogueId,
  CatalogueSummary,
  CommitImportInput,
  ImportPreview,
  LineListInvalidDetails,
  SticksQuery,
  StickSpectrum,
} from '../../shared/schemas/catalogues'
import type { ListQuery, Page } from '../../shared/schemas/paging'
import { AppError } from '../errors'
import { LineCatalogue, User } from '../models/index'
import { assertCanModify, type Actor } from '../services/access'
import { BUILTIN_CATALOGUE_ID, loadBuiltInCatalogue } from './builtin-catalogue'
import { builtInCatalogueDetail, builtInCatalogueSummary } from './builtin-catalogue-info'
import { moleculeName } from './import/line-list-summary'
import {
  claimPendingImport,
  keepPendingImport,
  pendingFilePath,
  releasePendingImport,
  removePendingImport,
  sweepPendingImports,
} from './import/pending-imports'
import { describeLineListError, scanLineList, type LineListScan } from './import/scan-line-list'
import {
  BLOCK_LINE_CAPACITY,
  blockLineCount,
  decodeBlockInto,
  LineBlockBuilder,
} from './line-block-codec'
import { builtInLinesUsed } from './line-table-ops'
import { StickBinner } from './stick-binner'

/** Who stores a catalogue: an Actor with a display name for the provenance record. */
export interface CatalogueOwner extends Actor {
  name: string
}

function lineListInvalid(scan: LineListScan): AppError {
  const where = scan.errors[0] ? describeLineListError(scan.errors[0]) : ''
  const details: LineListInvalidDetails = {
    errors: scan.errors,
    errorCount: scan.errorCount,
    recordCount: scan.recordCount,
    stoppedEarly: scan.stoppedEarly,
  }
  return new AppError(
    400,
    'LINE_LIST_INVALID',
    `${scan.errorCount} problem(s) in the line list${scan.stoppedEarly ? ' (reading stopped early)' : ''}. First: ${where}`,
    details,
  )
}

const emptyLineList = () => new AppError(400, 'LINE_LIST_EMPTY', 'The file holds no line records.')

/** A file name fit for display and storage (no folders, at most 255 characters). */
function displayFileName(name: string): string {
  return basename(name.replace(/\\/g, '/')).slice(0, 255) || 'line-list'
}

// ---- import ----

/**
 * Checks an uploaded file record by record and keeps it for IMPORT_TOKEN_TTL_MS under a token.
 * A file with any bad record is removed and refused (400 LINE_LIST_INVALID naming line and field).
 */
export async function previewImport(
  actor: Actor,
  upload: { path: string; originalName: string },
): Promise<ImportPreview> {
  await sweepPendingImports()
  let scan: LineListScan
  try {
    scan = await scanLineList(upload.path)
    if (scan.errorCount > 0) throw lineListInvalid(scan)
    if (scan.summary.lineCount === 0) throw emptyLineList()
  } catch (err) {
    await rm(upload.path, { force: true })
    throw err
  }
  const pending = await keepPendingImport(upload.path, {
    ownerId: actor.id,
    fileName: displayFileName(upload.originalName),
    byteSize: scan.byteSize,
    fileSha256: scan.fileSha256,
    parsedAt: new Date().toISOString(),
    summary: scan.summary,
  })
  return {
    token: pending.token,
    fileName: pending.fileName,
    byteSize: pending.byteSize,
    fileSha256: pending.fileSha256,
    expiresAt: pending.expiresAt,
    summary: pending.summary,
  }
}

/** Stores a previewed file as a new catalogue (one transaction) and forgets the token. */
export async function commitImport(
  owner: CatalogueOwner,
  token: string,
  input: CommitImportInput,
): Promise<CatalogueDetail> {
  const pending = await claimPendingImport(token)
  if (pending === 'busy') throw AppError.conflict('This upload is being saved already.')
  if (!pending)
    throw new AppError(
      404,
      'IMPORT_NOT_FOUND',
      'This upload is unknown or has expired (checked files are kept 30 minutes). Upload the file again.',
    )
  if (pending.ownerId !== owner.id) {
    await releasePendingImport(token)
    throw AppError.forbidden('Only the person who uploaded this file can save it.')
  }
  let id: number
  try {
    id = await storeLineList({
      path: pendingFilePath(token),
      fileName: pending.fileName,
      owner,
      input,
      expectedFileSha256: pending.fileSha256,
      parsedAt: pending.parsedAt,
    })
  } catch (err) {
    await releasePendingImport(token)
    throw err
  }
  await removePendingImport(token)
  return getCatalogue(id)
}

export interface StoreLineListOptions {
  path: string
  fileName: string
  owner: CatalogueOwner
  input: CommitImportInput
  /** Refuse (409) when the file's SHA-256 differs from the one checked at preview. */
  expectedFileSha256?: string
  parsedAt?: string
  /** Lines per stored block (default BLOCK_LINE_CAPACITY). */
  blockLineCapacity?: number
}

/**
 * Reads a line-list file again and stores it, all in ONE transaction: the catalogue row, then a
 * block every `blockLineCapacity` lines as the file streams by, then the totals. Any bad record,
 * a changed file or a database error rolls everything back: no half catalogue is ever visible.
 * Returns the new catalogue's id.
 */
export async function storeLineList(o: StoreLineListOptions): Promise<number> {
  const sequelize = LineCatalogue.sequelize!
  return sequelize.transaction(async (transaction) => {
    const fileName = displayFileName(o.fileName)
    const created = await LineCatalogue.create(
      {
        name: o.input.name,
        description: o.input.description,
        kind: 'imported',
        sourceFileName: fileName,
        provenance: {} as LineCatalogue['provenance'],
        mergeWithBuiltIn: o.input.mergeWithBuiltIn,
        lineCount: 0,
        blockCount: 0,
        minWavenumberCm: 0,
        maxWavenumberCm: 0,
        checksum: '',
        ownerId: o.owner.id,
      },
      { transaction },
    )
    const builder = new LineBlockBuilder(o.blockLineCapacity ?? BLOCK_LINE_CAPACITY)
    const dataHash = createHash('sha256')
    let blockCount = 0
    const flush = async () => {
      const block = builder.finish()
      dataHash.update(block.data)
      await sequelize.query(
        'INSERT INTO catalogue_line_blocks (catalogue_id, block_index, line_count, min_wavenumber_cm, max_wavenumber_cm, data) VALUES ($1, $2, $3, $4, $5, $6)',
        {
          bind: [
            created.id,
            blockCount,
            block.lineCount,
            block.minWavenumberCm,
            block.maxWavenumberCm,
            block.data,
          ],
          transaction,
        },
      )
      blockCount++
    }
    const scan = await scanLineList(o.path, {
      stopAtFirstError: true,
      onLine: (line) => {
        builder.add(line)
        if (builder.full) return flush()
      },
    })
    if (scan.errorCount > 0) throw lineListInvalid(scan)
    if (o.expectedFileSha256 && scan.fileSha256 !== o.expectedFileSha256) {
      throw AppError.conflict('The uploaded file changed after it was checked. Upload it again.')
    }
    if (scan.summary.lineCount === 0) throw emptyLineList()
    if (builder.length > 0) await flush()
    await created.update(
      {
        provenance: {
          fileName,
          fileSha256: scan.fileSha256,
          byteSize: scan.byteSize,
          uploadedBy: { id: o.owner.id, name: o.owner.name },
          parsedAt: o.parsedAt ?? new Date().toISOString(),
          summary: scan.summary,
        },
        lineCount: scan.summary.lineCount,
        blockCount,
        minWavenumberCm: scan.summary.minWavenumberCm,
        maxWavenumberCm: scan.summary.maxWavenumberCm,
        checksum: `sha256:${dataHash.digest('hex')}`,
      },
      { transaction },
    )
    return created.id
  })
}

// ---- reading ----

function toSummary(c: LineCatalogue): CatalogueSummary {
  return {
    id: c.id,
    name: c.name,
    description: c.description,
    kind: 'imported',
    readOnly: false,
    lineCount: c.lineCount,
    molecules: c.provenance.summary.molecules.map((m) => m.molecule),
    minWavenumberCm: c.minWavenumberCm,
    maxWavenumberCm: c.maxWavenumberCm,
    checksum: c.checksum,
    mergeWithBuiltIn: c.mergeWithBuiltIn,
    sourceFileName: c.sourceFileName,
    ownerId: c.ownerId,
    ownerName: c.owner?.displayName ?? '',
    createdAt: c.createdAt.toISOString(),
    updatedAt: c.updatedAt.toISOString(),
  }
}

/** The built-in molecules a merged import takes from the built-in catalogue. */
function builtInMoleculesUsed(c: LineCatalogue): number[] {
  if (!c.mergeWithBuiltIn) return []
  const own = new Set(c.provenance.summary.molecules.map((m) => m.moleculeId))
  return builtInCatalogueDetail()
    .moleculeTable.map((m) => m.moleculeId)
    .filter((id) => !own.has(id))
}

function toDetail(c: LineCatalogue): CatalogueDetail {
  const summary = c.provenance.summary
  const extra = c.mergeWithBuiltIn
    ? builtInLinesUsed(
        loadBuiltInCatalogue().table,
        summary.molecules.map((m) => m.moleculeId),
      )
    : 0
  return {
    ...toSummary(c),
    moleculeTable: summary.molecules,
    strongestBand: summary.strongestBand,
    warnings: summary.warnings,
    provenance: c.provenance,
    builtInMoleculesUsed: builtInMoleculesUsed(c).map(moleculeName),
    effectiveLineCount: c.lineCount + extra,
  }
}

const ownerInclude = [{ model: User, as: 'owner', attributes: ['displayName'] }]

/** The built-in catalogue first (read-only), then imports newest first; one page of them. */
export async function listCatalogues(query: ListQuery): Promise<Page<CatalogueSummary>> {
  const search = query.search?.toLowerCase()
  const builtIn = builtInCatalogueSummary()
  const builtInCount =
    !search || `${builtIn.name} ${builtIn.description}`.toLowerCase().includes(search) ? 1 : 0
  const offset = (query.page - 1) * query.pageSize
  const leading = offset < builtInCount ? builtInCount - offset : 0
  const where: WhereOptions = query.search
    ? {
        [Op.or]: [
          { name: { [Op.iLike]: `%${query.search}%` } },
          { description: { [Op.iLike]: `%${query.search}%` } },
          { sourceFileName: { [Op.iLike]: `%${query.search}%` } },
        ],
      }
    : {}
  const { rows, count } = await LineCatalogue.findAndCountAll({
    where,
    include: ownerInclude,
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: query.pageSize - leading,
    offset: Math.max(0, offset - builtInCount),
  })
  return {
    items: [...(leading ? [builtIn] : []), ...rows.map(toSummary)],
    total: count + builtInCount,
    page: query.page,
    pageSize: query.pageSize,
  }
}

async function findOrFail(id: number): Promise<LineCatalogue> {
  const c = await LineCatalogue.findByPk(id, { include: ownerInclude })
  if (!c) throw AppError.notFound('Line catalogue')
  return c
}

export async function getCatalogue(id: CatalogueId): Promise<CatalogueDetail> {
  if (id === BUILTIN_CATALOGUE_ID) return builtInCatalogueDetail()
  return toDetail(await findOrFail(id))
}

/** Chart range: as asked, else the catalogue's lines widened to whole cm⁻¹ (a lone line gets ±1 cm⁻¹). */
function defaultRange(minCm: number, maxCm: number, query: SticksQuery): [number, number] {
  let start = query.startCm ?? Math.floor(minCm)
  let end = query.endCm ?? Math.ceil(maxCm)
  if (!(end > start)) {
    start = Math.max(0, start - 1)
    end = start + 2
  }
  return [start, end]
}

/**
 * The strongest line per bin per molecule over [startCm, endCm], for the stick chart. Imported
 * catalogues are read block by block (only blocks overlapping the range), so memory stays at one
 * block whatever the catalogue size; a merged catalogue adds the built-in lines it uses.
 */
export async function stickSpectrum(id: CatalogueId, query: SticksQuery): Promise<StickSpectrum> {
  const builtIn = loadBuiltInCatalogue()
  if (id === BUILTIN_CATALOGUE_ID) {
    const d = builtInCatalogueDetail()
    const [start, end] = defaultRange(d.minWavenumberCm, d.maxWavenumberCm, query)
    const binner = new StickBinner(start, end, query.bins)
    binner.add(builtIn.table)
    return binner.result(id)
  }
  const c = await findOrFail(id)
  const own = new Set(c.provenance.summary.molecules.map((m) => m.moleculeId))
  const usesBuiltIn = (moleculeId: number) => !own.has(moleculeId)
  let minCm = c.minWavenumberCm
  let maxCm = c.maxWavenumberCm
  if (c.mergeWithBuiltIn) {
    for (const m of builtInCatalogueDetail().moleculeTable) {
      if (!usesBuiltIn(m.moleculeId)) continue
      minCm = Math.min(minCm, m.minWavenumberCm)
      maxCm = Math.max(maxCm, m.maxWavenumberCm)
    }
  }
  const [start, end] = defaultRange(minCm, maxCm, query)
  const binner = new StickBinner(start, end, query.bins)
  const sequelize = LineCatalogue.sequelize!
  const blocks = await sequelize.query<{ block_index: number }>(
    'SELECT block_index FROM catalogue_line_blocks WHERE catalogue_id = $1 AND max_wavenumber_cm >= $2 AND min_wavenumber_cm <= $3 ORDER BY block_index',
    { bind: [c.id, start, end], type: QueryTypes.SELECT },
  )
  let scratch: LineTable = createLineTable(0)
  for (const { block_index: blockIndex } of blocks) {
    const [row] = await sequelize.query<{ data: Buffer }>(
      'SELECT data FROM catalogue_line_blocks WHERE catalogue_id = $1 AND block_index = $2',
      {
        bind: [c.id, blockIndex],
        type: QueryTypes.SELECT,
      },
    )
    const n = blockLineCount(row.data)
    if (scratch.wavenumberCm.length < n) scratch = createLineTable(Math.max(n, BLOCK_LINE_CAPACITY))
    decodeBlockInto(row.data, scratch, 0)
    binner.add({ ...scratch, length: n })
  }
  if (c.mergeWithBuiltIn) binner.add(builtIn.table, { fromBuiltIn: true, molecule: usesBuiltIn })
  return binner.result(c.id)
}

// ---- deletion ----

/** Deletes an imported catalogue (owner or administrator), unless a queued or running run uses it. */
export async function deleteCatalogue(actor: Actor, id: CatalogueId): Promise<void> {
  if (id === BUILTIN_CATALOGUE_ID)
    throw AppError.forbidden('The built-in catalogue is read-only and cannot be deleted.')
  const sequelize = LineCatalogue.sequelize!
  await sequelize.transaction(async (transaction) => {
    const c = await LineCatalogue.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE })
    if (!c) throw AppError.notFound('Line catalogue')
    assertCanModify(actor, c.ownerId, 'line catalogue')
    const [{ count }] = await sequelize.query<{ count: string }>(
      "SELECT count(*) AS count FROM runs WHERE status IN ('queued', 'running') AND inputs->'catalogue'->>'id' = $1",
      { bind: [String(id)], type: QueryTypes.SELECT, transaction },
    )
    const runCount = Number(count)
    if (runCount > 0) {
      throw AppError.conflict(
        `${runCount} queued or running run${runCount > 1 ? 's use' : ' uses'} this catalogue. Wait for ${runCount > 1 ? 'them' : 'it'} to finish, or stop ${runCount > 1 ? 'them' : 'it'}, before deleting.`,
        { runCount },
      )
    }
    await c.destroy({ transaction })
  })
}
