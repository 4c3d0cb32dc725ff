import { existsSync } from 'node:fs'
import { join, resolve } from 'node:path'
import express, { type Express } from 'express'
import session from 'express-session'
import helmet from 'helmet'
import { ipKeyGenerator, rateLimit } from 'express-rate-limit'
import { csrfSync } from 'csrf-sync'
import type pg from 'pg'
import type { Sequelize } from 'sequelize'
import type { AppConfig } from './config'
import { createPassport } from './auth/passport'
import { ThrottledPgSessionStore } from './auth/session-store'
import type { Logger } from './logger'
import { apiNotFound, errorHandler } from './middlewares/error-handler'
import { authRoutes } from './routes/auth.routes'
import { cataloguesRoutes } from './routes/catalogues.routes'
import { healthRoutes } from './routes/health.routes'
import { mixturesRoutes } from './routes/mixtures.routes'
import { profilesRoutes } from './routes/profiles.routes'
import { reviewsRoutes, runReviewsRoutes } from './routes/reviews.routes'
import { runsRoutes } from './routes/runs.routes'
import { sweepsRoutes } from './routes/sweeps.routes'
import { comparisonsRoutes } from './routes/comparisons.routes'
import type { RunQueue } from './runs/run-queue'
import { usersRoutes } from './routes/users.routes'

export interface AppDeps {
  config: AppConfig
  sequelize: Sequelize
  sessionPool: pg.Pool
  logger: Logger
  /** Built client (vite build output) to serve with an SPA fallback; omitted in API-only tests. */
  clientDistDir?: string
  /** The run queue, once connected; run submission answers 503 without it. */
  getRunQueue?: () => RunQueue | undefined
}

export const SESSION_COOKIE = 'tauline.sid'

/** Builds the Express app without listening, so tests drive it through supertest. */
export function createApp({ config, sequelize, sessionPool, logger, clientDistDir, getRunQueue }: AppDeps): Express {
  const app = express()
  app.disable('x-powered-by')
  app.set('trust proxy', 'loopback')
  app.use(
    helmet({
      // Plain http on a LAN address must keep working, so no upgrade-insecure-requests or HSTS.
      contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } },
      hsts: false,
    }),
  )
  app.use(express.json({ limit: '2mb' }))

  app.use(
    session({
      name: SESSION_COOKIE,
      store: new ThrottledPgSessionStore(sessionPool),
      secret: config.sessionSecret,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.cookieSecure, maxAge: config.sessionMaxAgeMs },
    }),
  )
  const passport = createPassport()
  app.use(passport.session())

  const { generateToken, csrfSynchronisedProtection } = csrfSync({
    getTokenFromRequest: (req) => req.get('x-csrf-token'),
    errorConfig: { statusCode: 403, message: 'invalid csrf token', code: 'EBADCSRFTOKEN' },
  })

  // Count failed sign-ins per address and e-mail, so one noisy user does not lock out others.
  const signInLimiter = rateLimit({
    windowMs: config.loginRateLimit.windowMs,
    limit: config.loginRateLimit.max,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').toLowerCase()}`,
    handler: (_req, res) => {
      res.status(429).json({
        error: {
          code: 'TOO_MANY_ATTEMPTS',
          message: 'Too many failed sign-ins. Wait a few minutes and try again.',
        },
      })
    },
  })

  const api = express.Router()
  api.use('/health', healthRoutes(sequelize))
  api.use(csrfSynchronisedProtection)
  api.use('/auth', authRoutes(passport, generateToken, signInLimiter))
  api.use('/admin/users', usersRoutes())
  api.use('/profiles', profilesRoutes())
  api.use('/mixtures', mixturesRoutes())
  api.use('/catalogues', cataloguesRoutes())
  api.use('/runs/:id/reviews', runReviewsRoutes(sequelize))
  api.use('/runs', runsRoutes(sequelize, getRunQueue ?? (() => undefined)))
  api.use('/sweeps', sweepsRoutes(sequelize, getRunQueue ?? (() => undefined)))
  api.use('/comparisons', comparisonsRoutes())
  api.use('/reviews', reviewsRoutes(sequelize))
  api.use(apiNotFound)
  app.use('/api', api)

  if (clientDistDir && existsSync(join(clientDistDir, 'index.html'))) {
    const root = resolve(clientDistDir)
    app.use(express.static(root, { index: false, maxAge: '1h' }))
    // Every non-API path is a client route: answer with the SPA shell, never cached.
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache')
      res.sendFile(join(root, 'index.html'))
    })
  }

  app.use(errorHandler(logger))
  return app
}
