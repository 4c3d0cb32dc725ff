/**
 * The total row count for one page of a list. A page shorter than the page size already tells it,
 * so the count query runs only for a full page, or an empty one past the first.
 */
export async function pageTotal(
  query: { page: number; pageSize: number },
  rowCount: number,
  count: () => Promise<number>,
): Promise<number> {
  const offset = (query.page - 1) * query.pageSize
  if (rowCount < query.pageSize && (rowCount > 0 || offset === 0)) return offset + rowCount
  return count()
}
