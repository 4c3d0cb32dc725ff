import { createHash } from 'node:crypto'
import { applyMixture } from '../../shared/mixtures/apply-mixture'
import { resolveComputeSettings } from '../../shared/physics/engine/settings'
import type { AtmosphereProfile } from '../../shared/physics/types'
import type { CreateRunInput, RunInputs } from '../../shared/schemas/runs'
import { ENGINE_VERSION } from '../../shared/version'
import { AppError } from '../errors'
import { runCatalogueOf } from '../catalogue/run-catalogue'
import { GasMixture, Profile } from '../models/index'
import { canonicalJson } from './canonical-json'

/**
 * Freezes what a run is computed from: the profile with the mixture applied, the catalogue's
 * identity and checksum, the resolved settings and the engine version.
 */
export async function snapshotRunInputs(input: CreateRunInput): Promise<{ inputs: RunInputs; warnings: unknown[] }> {
  const profile = await Profile.findByPk(input.profileId)
  if (!profile) throw new AppError(400, 'VALIDATION_FAILED', `Profile ${input.profileId} does not exist.`, { fields: [{ field: 'profileId', message: 'not found' }] })
  const mixture = input.mixtureId ? await GasMixture.findByPk(input.mixtureId) : null
  if (input.mixtureId && !mixture) {
    throw new AppError(400, 'VALIDATION_FAILED', `Gas mixture ${input.mixtureId} does not exist.`, { fields: [{ field: 'mixtureId', message: 'not found' }] })
  }
  let settings
  try {
    settings = resolveComputeSettings(input.settings)
  } catch (err) {
    const field = (err as { details?: { field?: string } }).details?.field ?? 'settings'
    throw new AppError(400, 'VALIDATION_FAILED', (err as Error).message, { fields: [{ field: `settings.${field}`, message: (err as Error).message }] })
  }
  const base: AtmosphereProfile = {
    name: profile.name,
    surfaceTemperatureK: profile.surfaceTemperatureK,
    surfaceEmissivity: profile.surfaceEmissivity,
    levels: profile.levels,
  }
  let snapshot = base
  let warnings: unknown[] = []
  if (mixture) {
    try {
      const applied = applyMixture(base, mixture.gases)
      snapshot = applied.profile
      warnings = applied.warnings
    } catch (err) {
      throw new AppError(400, 'VALIDATION_FAILED', (err as Error).message, { fields: [{ field: 'mixtureId', message: (err as Error).message }] })
    }
  }
  const catalogue = await runCatalogueOf(input.catalogueId)
  return {
    inputs: {
      profile: { id: profile.id, name: profile.name, snapshot },
      mixture: mixture ? { id: mixture.id, name: mixture.name, gases: mixture.gases } : null,
      catalogue,
      settings,
      engineVersion: ENGINE_VERSION,
    },
    warnings,
  }
}

/**
 * SHA-256 of the canonical inputs that decide the numbers (the profile snapshot, catalogue
 * checksum, settings, engine version and, for a sweep member, the sweep) — not names or database
 * ids, so the same physics gives the same hash.
 */
export function runInputHash(inputs: RunInputs): string {
  const physics = {
    profile: inputs.profile.snapshot.levels,
    surface: [inputs.profile.snapshot.surfaceTemperatureK, inputs.profile.snapshot.surfaceEmissivity],
    catalogue: inputs.catalogue.checksum,
    settings: inputs.settings,
    engineVersion: inputs.engineVersion,
    // Only members of a sweep carry it, so the hashes of other runs stay as they were.
    ...(inputs.sweep ? { sweep: inputs.sweep } : {}),
  }
  return createHash('sha256').update(canonicalJson(physics)).digest('hex')
}
