import Papa from 'papaparse'

/** One column of a chart's data table: its header (with the unit) and the value of each row. */
export interface ChartCsvTable {
  /** Column headers, e.g. ['series', 'pressure (hPa)', 'temperature (K)']. */
  fields: string[]
  /** One array per row, in the order of `fields`. */
  rows: (string | number | null)[][]
}

/** CSV text of a chart's data table (RFC 4180 quoting, CRLF line ends, header first). */
export function chartCsvText(table: ChartCsvTable): string {
  return Papa.unparse({ fields: table.fields, data: table.rows }, { newline: '\r\n' })
}

/** A file name safe on every system: letters, digits, dashes; '.csv' added. */
export function csvFileName(title: string): string {
  const stem = title
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, '')
    .trim()
    .replace(/[\s_]+/g, '-')
    .toLowerCase()
  return `${stem || 'chart-data'}.csv`
}

/** Offers the CSV to the browser as a download (a Blob URL, revoked after the click). */
export function downloadCsv(table: ChartCsvTable, fileName: string): void {
  const blob = new Blob([chartCsvText(table)], { type: 'text/csv;charset=utf-8' })
  const url = URL.createObjectURL(blob)
  const link = document.createElement('a')
  link.href = url
  link.download = fileName
  link.style.display = 'none'
  document.body.appendChild(link)
  link.click()
  link.remove()
  setTimeout(() => URL.revokeObjectURL(url), 1000)
}
