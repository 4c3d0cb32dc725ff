import { z } from 'zod'

/** Server settings, read from the environment once at boot and validated (see .env.example). */
const configSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATABASE_URL: z.string().url().optional(),
  TAULINE_PG_PORT: z.coerce.number().int().default(54329),
  TAULINE_PG_DATABASE: z.string().default('tauline'),
  SESSION_SECRET: z.string().min(16, 'SESSION_SECRET must be at least 16 characters'),
  COOKIE_SECURE: z.enum(['auto', 'true', 'false']).default('auto'),
  SESSION_MAX_AGE_MIN: z.coerce.number().positive().default(480),
  LOGIN_RATE_LIMIT_MAX: z.coerce.number().int().positive().default(10),
  LOGIN_RATE_LIMIT_WINDOW_MIN: z.coerce.number().positive().default(15),
  DEMO_PASSWORD: z.string().min(8).default('tauline-demo-2026'),
  SEED_DEMO: z.enum(['true', 'false']).default('true'),
  LOG_LEVEL: z.enum(['debug', 'info', 'warn', 'error', 'silent']).default('info'),
  // Empty means "not set" (one thread per core), not 0.
  RUN_WORKER_THREADS: z.preprocess((v) => (v === '' ? undefined : v), z.coerce.number().int().min(0).max(256).optional()),
  RUN_CHUNKS_AHEAD: z.coerce.number().int().min(0).max(8).default(1),
  RUN_CHUNK_TIMEOUT_S: z.coerce.number().int().min(2).max(86400).default(900),
  RUN_RETRY_LIMIT: z.coerce.number().int().min(0).max(10).default(2),
  QUEUE_MAINTENANCE_S: z.coerce.number().int().min(1).max(3600).default(30),
})

export interface AppConfig {
  env: 'development' | 'production' | 'test'
  host: string
  port: number
  databaseUrl: string
  sessionSecret: string
  cookieSecure: boolean | 'auto'
  sessionMaxAgeMs: number
  loginRateLimit: { max: number; windowMs: number }
  demoPassword: string
  seedDemo: boolean
  logLevel: 'debug' | 'info' | 'warn' | 'error' | 'silent'
  runs: {
    /** Chunk threads in this process; undefined = one per core, 0 = submit only. */
    workerThreads?: number
    /** Chunk jobs a process takes beyond its threads, so the database work of the next overlaps a compute. */
    chunksAhead: number
    chunkTimeoutSeconds: number
    retryLimit: number
    maintenanceIntervalSeconds: number
  }
}

/** Parses settings; throws one readable error listing every bad variable. */
export function loadConfig(env: Record<string, string | undefined> = process.env): AppConfig {
  const parsed = configSchema.safeParse(env)
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`)
    throw new Error(`Invalid settings (see .env.example):\n${lines.join('\n')}`)
  }
  const c = parsed.data
  return {
    env: c.NODE_ENV,
    host: c.HOST,
    port: c.PORT,
    databaseUrl:
      c.DATABASE_URL ?? `postgres://postgres@127.0.0.1:${c.TAULINE_PG_PORT}/${c.TAULINE_PG_DATABASE}`,
    sessionSecret: c.SESSION_SECRET,
    cookieSecure: c.COOKIE_SECURE === 'auto' ? 'auto' : c.COOKIE_SECURE === 'true',
    sessionMaxAgeMs: c.SESSION_MAX_AGE_MIN * 60_000,
    loginRateLimit: { max: c.LOGIN_RATE_LIMIT_MAX, windowMs: c.LOGIN_RATE_LIMIT_WINDOW_MIN * 60_000 },
    demoPassword: c.DEMO_PASSWORD,
    seedDemo: c.SEED_DEMO === 'true',
    logLevel: c.LOG_LEVEL,
    runs: {
      workerThreads: c.RUN_WORKER_THREADS,
      chunksAhead: c.RUN_CHUNKS_AHEAD,
      chunkTimeoutSeconds: c.RUN_CHUNK_TIMEOUT_S,
      retryLimit: c.RUN_RETRY_LIMIT,
      maintenanceIntervalSeconds: c.QUEUE_MAINTENANCE_S,
    },
  }
}
