import type { ProfileSummary } from '@shared/schemas/profiles'

type Source = ProfileSummary['source']

/** How each source of a profile is named in tags. */
export const SOURCE_LABELS: Record<Source, string> = {
  climatology: 'Climatology',
  'us-standard-1976': 'US Standard 1976',
  form: 'Typed in',
  sounding: 'Sounding',
}

/** naive-ui tag type per source, so the list reads at a glance. */
export const SOURCE_TAG_TYPES: Record<Source, 'default' | 'info' | 'success' | 'warning'> = {
  climatology: 'info',
  'us-standard-1976': 'info',
  form: 'default',
  sounding: 'success',
}
