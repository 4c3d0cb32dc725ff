/** Minimal leveled logger writing one line per event to stderr (JSON-free, for humans). */
export type LogLevel = 'debug' | 'info' | 'warn' | 'error' | 'silent'
const order: Record<LogLevel, number> = { debug: 10, info: 20, warn: 30, error: 40, silent: 99 }

export interface Logger {
  debug(msg: string, extra?: unknown): void
  info(msg: string, extra?: unknown): void
  warn(msg: string, extra?: unknown): void
  error(msg: string, extra?: unknown): void
}

export function createLogger(level: LogLevel): Logger {
  const emit = (at: Exclude<LogLevel, 'silent'>) => (msg: string, extra?: unknown) => {
    if (order[at] < order[level]) return
    const tail = extra === undefined ? '' : ` ${extra instanceof Error ? extra.stack : JSON.stringify(extra)}`
    process.stderr.write(`${new Date().toISOString()} ${at.toUpperCase()} ${msg}${tail}\n`)
  }
  return { debug: emit('debug'), info: emit('info'), warn: emit('warn'), error: emit('error') }
}
