import type {
  CatalogueDetail,
  CatalogueId,
  CatalogueSummary,
  CommitImportInput,
  ImportPreview,
  LineListInvalidDetails,
  StickSpectrum,
} from '@shared/schemas/catalogues'
import type { Page } from '@shared/schemas/paging'
import { http, queryString } from './http'

export type { LineListInvalidDetails }

/** A page of line catalogues: the built-in one first, then imports, newest first. */
export function fetchCatalogues(
  params: { page?: number; pageSize?: number; search?: string } = {},
) {
  return http.get<Page<CatalogueSummary>>(`/catalogues?${queryString(params)}`)
}

/** One catalogue with its per-molecule table, provenance (imports) or bands and accuracy notes (built-in). */
export async function fetchCatalogue(id: CatalogueId): Promise<CatalogueDetail> {
  return (await http.get<{ catalogue: CatalogueDetail }>(`/catalogues/${id}`)).catalogue
}

/** The strongest line per bin and molecule over a range (whole catalogue when the range is left out). */
export function fetchStickSpectrum(
  id: CatalogueId,
  range: { startCm?: number; endCm?: number; bins?: number } = {},
) {
  return http.get<StickSpectrum>(`/catalogues/${id}/sticks?${queryString(range)}`)
}

/**
 * Uploads a line list to be checked record by record. Answers its summary and a token valid for 30
 * minutes; a 400 LINE_LIST_INVALID ApiError carries `LineListInvalidDetails` (line, field, value).
 */
export function uploadLineList(file: File) {
  const form = new FormData()
  form.append('file', file, file.name)
  return http.upload<ImportPreview>('/catalogues/imports', form)
}

/** Stores a checked upload as a new catalogue. */
export async function commitLineListImport(
  token: string,
  input: CommitImportInput,
): Promise<CatalogueDetail> {
  return (
    await http.post<{ catalogue: CatalogueDetail }>(`/catalogues/imports/${token}/commit`, input)
  ).catalogue
}

/** Deletes an imported catalogue (owner or administrator; refused while a run uses it). */
export async function deleteCatalogue(id: number): Promise<void> {
  await http.delete(`/catalogues/${id}`)
}
