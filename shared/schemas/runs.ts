import { z } from 'zod'
import { MAX_DETAIL_WINDOW_WIDTH_CM, type ComputeSettings } from '../physics/engine/settings'
import type { AtmosphereProfile } from '../physics/types'
import type { MixtureGases } from './mixtures'
import type { SweptGas } from './sweeps'

export const RUN_STATUSES = ['queued', 'running', 'succeeded', 'failed', 'cancelled'] as const
export type RunStatus = (typeof RUN_STATUSES)[number]
export const TERMINAL_RUN_STATUSES: readonly RunStatus[] = ['succeeded', 'failed', 'cancelled']

/** Spectral settings an analyst picks for a run (defaults fill the rest). */
export const runSettingsSchema = z
  .object({
    startCm: z.number().min(1).max(5000).default(10),
    endCm: z.number().min(2).max(5000).default(3000),
    chunkWidthCm: z.number().min(0.5).max(200).default(20),
    outputResolutionCm: z.number().min(0.01).max(50).default(1),
    wingCutoffCm: z.number().min(1).max(100).default(25),
    quadrature: z
      .discriminatedUnion('kind', [
        z.object({ kind: z.literal('gauss-legendre'), nodes: z.number().int().min(1).max(8) }),
        z.object({ kind: z.literal('gauss-jacobi'), nodes: z.number().int().min(1).max(8) }),
        z.object({ kind: z.literal('diffusivity'), secant: z.number().min(1).max(3).default(1.66) }),
      ])
      .default({ kind: 'gauss-legendre', nodes: 3 }),
    layerSource: z.enum(['linear-in-tau', 'isothermal']).default('linear-in-tau'),
    waterVapourContinuum: z.boolean().default(true),
    co2SubLorentzianWings: z.boolean().default(true),
    /** Optional window kept at the calculation's own grid (full resolution). */
    detailWindow: z
      .object({ startCm: z.number().min(1).max(5000), endCm: z.number().min(1).max(5000) })
      .nullable()
      .optional(),
  })
  .refine((s) => s.startCm < s.endCm, { message: 'The range must start below its end.', path: ['endCm'] })
  .refine((s) => (s.endCm - s.startCm) / s.outputResolutionCm <= 200_000, {
    message: 'At most 200 000 output bins: choose a coarser output resolution.',
    path: ['outputResolutionCm'],
  })
  .refine((s) => !s.detailWindow || (s.detailWindow.startCm >= s.startCm && s.detailWindow.endCm <= s.endCm), {
    message: "The full-resolution window must lie inside the run's range.",
    path: ['detailWindow'],
  })
  .refine((s) => !s.detailWindow || s.detailWindow.startCm < s.detailWindow.endCm, {
    message: 'The full-resolution window must start below its end.',
    path: ['detailWindow', 'endCm'],
  })
  .refine((s) => !s.detailWindow || s.detailWindow.endCm - s.detailWindow.startCm <= MAX_DETAIL_WINDOW_WIDTH_CM, {
    message: `The full-resolution window can be at most ${MAX_DETAIL_WINDOW_WIDTH_CM} cm⁻¹ wide.`,
    path: ['detailWindow'],
  })
export type RunSettingsInput = z.input<typeof runSettingsSchema>

export const createRunSchema = z.object({
  name: z.string().trim().max(160).optional(),
  profileId: z.number().int().positive(),
  mixtureId: z.number().int().positive().nullable().default(null),
  /** 'builtin' or the id of an imported line catalogue. */
  catalogueId: z.union([z.literal('builtin'), z.number().int().positive()]).default('builtin'),
  settings: runSettingsSchema.default({} as never),
})
export type CreateRunInput = z.infer<typeof createRunSchema>

export const runListQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
  status: z.enum(RUN_STATUSES).optional(),
  mine: z.enum(['true', 'false']).optional(),
  search: z.string().trim().max(120).optional(),
})
export type RunListQuery = z.infer<typeof runListQuerySchema>

/** Everything a run was computed from, frozen at submission. */
export interface RunInputs {
  profile: { id: number; name: string; snapshot: AtmosphereProfile }
  mixture: { id: number; name: string; gases: MixtureGases } | null
  catalogue: { id: string; checksum: string; generatorVersion: string; lineCount: number }
  settings: ComputeSettings
  engineVersion: string
  /**
   * For a member of a sweep: the sweep it was computed with (its numbers depend slightly on the
   * other members, which share its grid), and its own amount, in `unit`.
   */
  sweep?: { gas: SweptGas; unit: string; amounts: number[]; amount: number }
}

export interface RunSummary {
  id: number
  name: string
  /** The sweep the run is a member of, if any. */
  sweepId: number | null
  status: RunStatus
  profileName: string
  mixtureName: string | null
  startCm: number
  endCm: number
  chunkCount: number
  chunksDone: number
  error: string | null
  inputHash: string
  engineVersion: string
  ownerId: number
  ownerName: string
  queuedAt: string
  startedAt: string | null
  finishedAt: string | null
  computeMs: number
  /** Seconds still expected, from the pace so far; null when unknown. */
  etaSeconds: number | null
  olrWPerM2: number | null
  /** A reviewer signed the run off: it is frozen (no more reviews, no delete). */
  signedOff: boolean
  /** Display name of the reviewer who signed it off. */
  signedOffBy: string | null
  signedOffAt: string | null
}

export interface RunDetail extends RunSummary {
  inputs: RunInputs
  mixtureWarnings?: unknown[]
}
