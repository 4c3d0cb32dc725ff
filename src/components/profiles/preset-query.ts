import type { LocationQuery, LocationQueryRaw } from 'vue-router'
import { presetRequestSchema, type PresetRequest } from '@shared/schemas/profiles'

const NUMBER_KEYS = [
  'levelCount',
  'topPressurePa',
  'surfaceTemperatureK',
  'humidityScale',
  'tropopausePressurePa',
  'surfaceEmissivity',
] as const

/** The address of "new atmosphere from this preset": /profiles/new?preset=…&levelCount=… */
export function presetRequestToQuery(
  request: Partial<PresetRequest> & Pick<PresetRequest, 'preset'>,
): LocationQueryRaw {
  const query: LocationQueryRaw = { preset: request.preset }
  for (const key of NUMBER_KEYS) {
    const value = request[key]
    if (value !== undefined && Number.isFinite(value)) query[key] = String(value)
  }
  return query
}

/** Reads a preset request back from the address; null when there is no valid preset in it. */
export function presetRequestFromQuery(query: LocationQuery): PresetRequest | null {
  if (typeof query.preset !== 'string') return null
  const raw: Record<string, unknown> = { preset: query.preset }
  for (const key of NUMBER_KEYS) {
    const value = query[key]
    if (typeof value === 'string' && value !== '' && Number.isFinite(Number(value)))
      raw[key] = Number(value)
  }
  const parsed = presetRequestSchema.safeParse(raw)
  return parsed.success ? parsed.data : null
}
