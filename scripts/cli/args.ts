/** Small helpers for reading command-line options with clear errors. */

export class CliError extends Error {}

export function requireNumber(options: Record<string, unknown>, name: string, fallback?: number): number {
  const raw = options[name]
  if (raw === undefined) {
    if (fallback !== undefined) return fallback
    throw new CliError(`--${name} is required`)
  }
  const value = Number(raw)
  if (!Number.isFinite(value)) throw new CliError(`--${name} must be a number, got "${String(raw)}"`)
  return value
}

export function optionalString(options: Record<string, unknown>, name: string): string | undefined {
  const raw = options[name]
  return raw === undefined ? undefined : String(raw)
}

/** Parses "a:b" into two numbers (e.g. --range 10:3000). */
export function parseRange(text: string, name: string): [number, number] {
  const parts = text.split(':').map(Number)
  if (parts.length !== 2 || parts.some((p) => !Number.isFinite(p)) || parts[0] >= parts[1]) {
    throw new CliError(`--${name} must look like START:END with START < END, got "${text}"`)
  }
  return [parts[0], parts[1]]
}

/** Prints a value as JSON (typed arrays as plain arrays, NaN as null). */
export function printJson(value: unknown): void {
  process.stdout.write(
    JSON.stringify(
      value,
      (_k, v) => {
        if (ArrayBuffer.isView(v) && !(v instanceof DataView)) return Array.from(v as unknown as ArrayLike<number>)
        if (typeof v === 'number' && !Number.isFinite(v)) return null
        return v
      },
      2,
    ) + '\n',
  )
}

export function printTable(rows: (string | number)[][]): void {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => String(r[c]).length)))
  for (const row of rows) {
    process.stdout.write(row.map((cell, c) => String(cell).padStart(widths[c])).join('  ') + '\n')
  }
}
