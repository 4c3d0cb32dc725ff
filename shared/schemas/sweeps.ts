import { z } from 'zod'
import type { LogFitResult } from '../physics/diagnostics/log-fit'
import { createRunSchema, type RunStatus } from './runs'

/** Gases a sweep may vary: how they are written, the unit of their amounts and its mole fraction. */
export const SWEPT_GASES = {
  CO2: { label: 'CO₂', unit: 'ppmv', vmrPerUnit: 1e-6 },
  CH4: { label: 'CH₄', unit: 'ppbv', vmrPerUnit: 1e-9 },
  N2O: { label: 'N₂O', unit: 'ppbv', vmrPerUnit: 1e-9 },
} as const
export type SweptGas = keyof typeof SWEPT_GASES

/** Most members a sweep may have. */
export const MAX_SWEEP_MEMBERS = 12

/**
 * A sweep: the inputs of a run, and the amounts (uniform dry-air mole fractions, in the gas's unit)
 * the gas takes in its members. The reference amount is the one forcings are taken against.
 */
export const createSweepSchema = createRunSchema
  .extend({
    gas: z.enum(['CO2', 'CH4', 'N2O']),
    amounts: z
      .array(z.number().min(0).max(1e6))
      .min(2, 'A sweep needs at least two amounts.')
      .max(MAX_SWEEP_MEMBERS, `A sweep has at most ${MAX_SWEEP_MEMBERS} amounts.`),
    referenceAmount: z.number().min(0).max(1e6).optional(),
  })
  .refine((s) => new Set(s.amounts).size === s.amounts.length, {
    message: 'Each amount may appear only once.',
    path: ['amounts'],
  })
  .refine((s) => s.referenceAmount === undefined || s.amounts.includes(s.referenceAmount), {
    message: 'The reference amount must be one of the amounts.',
    path: ['referenceAmount'],
  })
export type CreateSweepInput = z.infer<typeof createSweepSchema>

/** Instantaneous forcing of a member against the reference member, W m⁻² (reduction of net upward flux). */
export interface SweepForcing {
  top: number
  tropopause: number
  surface: number
}

export interface SweepMember {
  runId: number
  amount: number
  status: RunStatus
  chunksDone: number
  chunkCount: number
  olrWPerM2: number | null
  /** Null until both this member and the reference have succeeded. */
  forcingWPerM2: SweepForcing | null
}

export interface SweepDetail {
  id: number
  name: string
  gas: SweptGas
  unit: string
  referenceAmount: number
  ownerId: number
  ownerName: string
  createdAt: string
  /** The status of the sweep as a whole: succeeded when every member has. */
  status: RunStatus
  members: SweepMember[]
  /**
   * ΔF = a ln(C/C₀) through the origin at each level, over the succeeded members; null when
   * fewer than two have succeeded or an amount is 0.
   */
  logarithmicFit: { top: LogFitResult; tropopause: LogFitResult; surface: LogFitResult } | null
}

/** A sweep in the list: what it varies and how far its members have got. */
export interface SweepListItem {
  id: number
  name: string
  gas: SweptGas
  unit: string
  amounts: number[]
  referenceAmount: number
  ownerName: string
  createdAt: string
  status: RunStatus
  /** Members that have ended (succeeded, failed or cancelled), of `memberCount`. */
  membersEnded: number
  memberCount: number
}
