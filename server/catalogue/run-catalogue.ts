import type { CatalogueId } from '../../shared/schemas/catalogues'
import type { RunInputs } from '../../shared/schemas/runs'
import { AppError } from '../errors'
import { LineCatalogue } from '../models/index'
import { BUILTIN_CATALOGUE_ID, loadBuiltInCatalogue } from './builtin-catalogue'
import { runCatalogueChecksum } from './catalogue-checksum'
import { builtInLinesUsed } from './line-table-ops'

/**
 * What a run records about its catalogue: id ('builtin' or the imported catalogue's id as text),
 * the checksum of exactly the lines it will use, a version label and the number of lines.
 */
export async function runCatalogueOf(catalogueId: CatalogueId): Promise<RunInputs['catalogue']> {
  const builtIn = loadBuiltInCatalogue()
  if (catalogueId === BUILTIN_CATALOGUE_ID) {
    return {
      id: builtIn.id,
      checksum: builtIn.checksum,
      generatorVersion: builtIn.generatorVersion,
      lineCount: builtIn.lineCount,
    }
  }
  const catalogue = await LineCatalogue.findByPk(catalogueId)
  if (!catalogue) {
    throw new AppError(400, 'VALIDATION_FAILED', `Line catalogue ${catalogueId} does not exist.`, {
      fields: [{ field: 'catalogueId', message: 'not found' }],
    })
  }
  const merged = catalogue.mergeWithBuiltIn
  const extra = merged
    ? builtInLinesUsed(
        builtIn.table,
        catalogue.provenance.summary.molecules.map((m) => m.moleculeId),
      )
    : 0
  return {
    id: String(catalogue.id),
    checksum: runCatalogueChecksum(catalogue.checksum, merged ? builtIn.checksum : null),
    generatorVersion: merged ? `imported + built-in ${builtIn.generatorVersion}` : 'imported',
    lineCount: catalogue.lineCount + extra,
  }
}
