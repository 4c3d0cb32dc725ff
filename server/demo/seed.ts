import { readdirSync, readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { MIXTURE_PRESETS } from '../../shared/mixtures/presets'
import { buildPresetProfile } from '../../shared/presets/atmosphere-presets'
import type { PresetId } from '../../shared/schemas/profiles'
import { GasMixture, Profile, User } from '../models/index'
import { createMixture } from '../services/mixture.service'
import { hashPassword } from '../services/password.service'
import { createProfile } from '../services/profile.service'
import { createProfileFromSounding } from '../services/sounding.service'
import { DEMO_TEAM } from './demo-team'

const DEMO_DIR = fileURLToPath(new URL('../../data/demo/', import.meta.url))

/** Creates the demo team when missing; leaves existing accounts (and changed passwords) alone. */
export async function seedDemoTeam(password: string): Promise<{ created: number }> {
  let created = 0
  const passwordHash = await hashPassword(password)
  for (const member of DEMO_TEAM) {
    const [, wasCreated] = await User.findOrCreate({
      where: { email: member.email },
      defaults: { ...member, passwordHash, lastSignInAt: null },
    })
    if (wasCreated) created++
  }
  return { created }
}

const DEMO_PRESETS: { preset: PresetId; name: string; description: string }[] = [
  { preset: 'us-standard-1976', name: 'U.S. Standard Atmosphere 1976', description: 'The 1976 standard column, 61 levels up to 0.1 hPa.' },
  { preset: 'mid-latitude-summer', name: 'Mid-latitude summer', description: 'Parametric climatology, 61 levels up to 0.1 hPa.' },
  { preset: 'tropical', name: 'Tropical', description: 'Parametric climatology, 61 levels up to 0.1 hPa.' },
  { preset: 'subarctic-winter', name: 'Subarctic winter', description: 'Parametric climatology, 61 levels up to 0.1 hPa.' },
]

/**
 * The demo workspace of the invented team: preset atmospheres, the soundings of the invented
 * "Kestrel Bay 2026" campaign (data/demo/), and a few gas mixtures. Only when the analyst has
 * nothing yet, so a restart never duplicates anything.
 */
export async function seedDemoWorkspace(): Promise<{ profiles: number; mixtures: number }> {
  const analyst = await User.findOne({ where: { email: DEMO_TEAM.find((m) => m.role === 'analyst')!.email } })
  if (!analyst) return { profiles: 0, mixtures: 0 }
  const actor = { id: analyst.id, role: analyst.role }
  let profiles = 0
  let mixtures = 0
  if ((await Profile.count({ where: { ownerId: analyst.id } })) === 0) {
    for (const p of DEMO_PRESETS) {
      const { profile, details } = buildPresetProfile({ preset: p.preset, levelCount: 61, topPressurePa: 10, humidityScale: 1, surfaceEmissivity: 1 })
      await createProfile(actor, {
        name: p.name,
        description: p.description,
        source: p.preset === 'us-standard-1976' ? 'us-standard-1976' : 'climatology',
        sourceDetails: details,
        surfaceTemperatureK: profile.surfaceTemperatureK,
        surfaceEmissivity: profile.surfaceEmissivity,
        levels: profile.levels,
      })
      profiles++
    }
    for (const file of readdirSync(DEMO_DIR).filter((f) => f.endsWith('.csv')).sort()) {
      const text = readFileSync(DEMO_DIR + file)
      const title = text.toString('utf8').split('\n')[0].replace(/^#\s*/, '')
      await createProfileFromSounding(actor, file, text, {
        name: title.split(',').slice(0, 2).join(',').trim(),
        description: `${title}. Invented demo sounding, extended above its top with the mid-latitude summer climatology.`,
        mapping: { pressure: 0, height: 1, temperature: 2, dewPoint: 3 },
        units: { pressure: 'hPa', height: 'm', temperature: 'degC', dewPoint: 'degC' },
        surfaceEmissivity: 0.98,
        surfaceHeightM: 0,
        fillMissingHumidity: false,
        fillMissingOzone: false,
        thinToMaxLevels: true,
        extendAbove: { climatology: 'mid-latitude-summer', topPressurePa: 10 },
      })
      profiles++
    }
  }
  if ((await GasMixture.count({ where: { ownerId: analyst.id } })) === 0) {
    for (const id of ['pre-industrial', 'present-day', 'doubled-co2', 'no-co2']) {
      const preset = MIXTURE_PRESETS.find((m) => m.id === id)!
      await createMixture(actor, preset.input)
      mixtures++
    }
  }
  return { profiles, mixtures }
}
