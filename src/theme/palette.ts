/**
 * Tauline's own palette: deep ink for structure, an ember accent for action (infrared is warm),
 * and a cool spectral teal for secondary data. Chart series colours live here too.
 */
export const palette = {
  ink950: '#0b1220',
  ink900: '#111a2e',
  ink800: '#1a2540',
  ink700: '#27355a',
  ink500: '#55638a',
  ink300: '#a3adc7',
  ink100: '#e6e9f2',
  paper: '#f6f5f1',
  ember600: '#b4540a',
  ember500: '#d2680f',
  ember400: '#f08a24',
  ember300: '#f7ae5c',
  teal500: '#1f8a8a',
  teal400: '#3fb0aa',
  rose500: '#c2414b',
  moss500: '#4a8a3a',
} as const

/** Series colours for charts: distinguishable in light and dark, colour-blind aware ordering. */
export const chartSeriesColors = ['#d2680f', '#1f8a8a', '#5561c9', '#c2414b', '#4a8a3a', '#8a5a9e', '#a08a2a']
