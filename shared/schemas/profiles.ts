import { z } from 'zod'
import { CLIMATOLOGY_IDS } from '../physics/atmosphere/climatology'

/** One level as stored: SI units fixed (Pa, K, m, mol/mol). */
export const levelSchema = z.object({
  pressurePa: z.number().finite().positive('pressure must be positive'),
  temperatureK: z.number().finite(),
  heightM: z.number().finite(),
  vmr: z
    .object({
      H2O: z.number().finite().min(0).optional(),
      O3: z.number().finite().min(0).optional(),
      CO2: z.number().finite().min(0).optional(),
      N2O: z.number().finite().min(0).optional(),
      CH4: z.number().finite().min(0).optional(),
    })
    .strict(),
})
export type LevelInput = z.infer<typeof levelSchema>

export const PROFILE_SOURCES = ['climatology', 'us-standard-1976', 'form', 'sounding'] as const
export const profileSourceSchema = z.enum(PROFILE_SOURCES)

export const PROFILE_LIMITS = { minLevels: 3, maxLevels: 500 } as const

export const profileInputSchema = z.object({
  name: z.string().trim().min(1, 'Give the profile a name.').max(120),
  description: z.string().trim().max(4000).default(''),
  source: profileSourceSchema,
  /** Free-form provenance: preset parameters, file name, repairs made, extension above the sounding. */
  sourceDetails: z.record(z.string(), z.unknown()).default({}),
  surfaceTemperatureK: z.number().finite().min(150).max(350),
  surfaceEmissivity: z.number().finite().min(0).max(1),
  levels: z.array(levelSchema).min(PROFILE_LIMITS.minLevels).max(PROFILE_LIMITS.maxLevels),
})
export type ProfileInput = z.infer<typeof profileInputSchema>

/** Quantities derived from the levels, cached with the profile. */
export interface ProfileDerived {
  levelCount: number
  surfacePressurePa: number
  topPressurePa: number
  topHeightM: number
  precipitableWaterCm: number
  ozoneColumnDu: number
  tropopausePressurePa: number
  tropopauseHeightM: number
  tropopauseMethod: string
  /** Gases with a non-zero amount somewhere in the column (missing in profiles saved before it existed). */
  gasesPresent?: string[]
}

export interface ProfileSummary {
  id: number
  name: string
  description: string
  source: z.infer<typeof profileSourceSchema>
  surfaceTemperatureK: number
  derived: ProfileDerived
  ownerId: number
  ownerName: string
  createdAt: string
  updatedAt: string
}

export interface ProfileDetail extends ProfileSummary {
  surfaceEmissivity: number
  sourceDetails: Record<string, unknown>
  levels: LevelInput[]
}

/** A preset atmosphere, adjustable before saving. */
export const presetIdSchema = z.enum(['us-standard-1976', ...CLIMATOLOGY_IDS])
export type PresetId = z.infer<typeof presetIdSchema>

export const presetRequestSchema = z.object({
  preset: presetIdSchema,
  levelCount: z.number().int().min(PROFILE_LIMITS.minLevels).max(PROFILE_LIMITS.maxLevels).default(61),
  topPressurePa: z.number().min(1).max(10000).default(10),
  surfaceTemperatureK: z.number().min(200).max(330).optional(),
  humidityScale: z.number().min(0).max(2).default(1),
  tropopausePressurePa: z.number().min(5000).max(40000).optional(),
  surfaceEmissivity: z.number().min(0).max(1).default(1),
})
export type PresetRequest = z.infer<typeof presetRequestSchema>
