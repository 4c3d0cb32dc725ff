import { z } from 'zod'
import { GAS_IDS } from '../physics/types'

/**
 * How a mixture sets one gas: a uniform mole fraction (mol/mol), a scale factor on the profile's
 * own amount, or a value per level (mol/mol, as many values as the profile has levels).
 */
export const gasSettingSchema = z.discriminatedUnion('mode', [
  z.object({ mode: z.literal('uniform'), vmr: z.number().finite().min(0).max(0.05) }),
  z.object({ mode: z.literal('scale'), factor: z.number().finite().min(0).max(100) }),
  z.object({ mode: z.literal('per-level'), vmr: z.array(z.number().finite().min(0).max(0.05)).min(3).max(500) }),
])
export type GasSetting = z.infer<typeof gasSettingSchema>

export const mixtureGasesSchema = z
  .object(Object.fromEntries(GAS_IDS.map((g) => [g, gasSettingSchema.optional()])) as Record<
    (typeof GAS_IDS)[number],
    z.ZodOptional<typeof gasSettingSchema>
  >)
  .strict()
export type MixtureGases = z.infer<typeof mixtureGasesSchema>

export const mixtureInputSchema = z
  .object({
    name: z.string().trim().min(1, 'Give the mixture a name.').max(120),
    description: z.string().trim().max(4000).default(''),
    gases: mixtureGasesSchema,
  })
  .superRefine((m, ctx) => {
    // Trace gases only: all uniform fractions together must stay a small part of the air.
    const uniformTotal = Object.values(m.gases).reduce((sum, g) => sum + (g?.mode === 'uniform' ? g.vmr : 0), 0)
    if (uniformTotal > 0.05) {
      ctx.addIssue({ code: 'custom', path: ['gases'], message: `Uniform gases add up to ${(uniformTotal * 100).toFixed(2)} % of the air; trace gases cannot exceed 5 %.` })
    }
    const lengths = new Set(Object.values(m.gases).filter((g) => g?.mode === 'per-level').map((g) => (g as { vmr: number[] }).vmr.length))
    if (lengths.size > 1) {
      ctx.addIssue({ code: 'custom', path: ['gases'], message: 'Per-level gases must all have the same number of levels.' })
    }
  })
export type MixtureInput = z.infer<typeof mixtureInputSchema>

export interface MixtureSummary {
  id: number
  name: string
  description: string
  gases: MixtureGases
  ownerId: number
  ownerName: string
  createdAt: string
  updatedAt: string
}

/** Units the UI shows per gas (stored values are always mol/mol). */
export const GAS_DISPLAY: Record<(typeof GAS_IDS)[number], { label: string; unit: 'ppmv' | 'ppbv'; factor: number }> = {
  H2O: { label: 'H₂O', unit: 'ppmv', factor: 1e6 },
  CO2: { label: 'CO₂', unit: 'ppmv', factor: 1e6 },
  O3: { label: 'O₃', unit: 'ppmv', factor: 1e6 },
  N2O: { label: 'N₂O', unit: 'ppbv', factor: 1e9 },
  CH4: { label: 'CH₄', unit: 'ppbv', factor: 1e9 },
}
