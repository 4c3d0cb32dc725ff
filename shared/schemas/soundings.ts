import { z } from 'zod'
import { CLIMATOLOGY_IDS } from '../physics/atmosphere/climatology'

const columnIndex = z.number().int().min(0).max(200)

/** What the analyst confirmed in the upload wizard: which column is which, in which unit. */
export const soundingOptionsSchema = z.object({
  name: z.string().trim().min(1, 'Give the profile a name.').max(120),
  description: z.string().trim().max(4000).default(''),
  mapping: z
    .object({
      pressure: columnIndex,
      temperature: columnIndex,
      height: columnIndex.optional(),
      relativeHumidity: columnIndex.optional(),
      dewPoint: columnIndex.optional(),
      mixingRatio: columnIndex.optional(),
      specificHumidity: columnIndex.optional(),
      waterVmr: columnIndex.optional(),
      ozone: columnIndex.optional(),
    })
    .strict(),
  units: z
    .object({
      pressure: z.enum(['hPa', 'Pa', 'kPa']).optional(),
      temperature: z.enum(['degC', 'K']).optional(),
      height: z.enum(['m', 'km']).optional(),
      relativeHumidity: z.enum(['percent', 'fraction']).optional(),
      dewPoint: z.enum(['degC', 'K']).optional(),
      mixingRatio: z.enum(['gPerKg', 'kgPerKg']).optional(),
      specificHumidity: z.enum(['gPerKg', 'kgPerKg']).optional(),
      waterVmr: z.enum(['ppmv', 'molPerMol']).optional(),
      ozone: z.enum(['ppmv', 'ppbv', 'molPerMol']).optional(),
    })
    .strict(),
  surfaceTemperatureK: z.number().min(150).max(350).optional(),
  surfaceEmissivity: z.number().min(0).max(1).default(1),
  surfaceHeightM: z.number().min(-500).max(9000).default(0),
  fillMissingHumidity: z.boolean().default(false),
  fillMissingOzone: z.boolean().default(false),
  thinToMaxLevels: z.boolean().default(true),
  extendAbove: z
    .object({ climatology: z.enum(CLIMATOLOGY_IDS), topPressurePa: z.number().min(1).max(20000).default(10) })
    .optional(),
})
export type SoundingOptions = z.infer<typeof soundingOptionsSchema>
