import type { Area } from '@shared/schemas/auth'

export interface AreaInfo {
  area: Area
  title: string
  /** One line in the navigation tooltip and page header. */
  summary: string
  /** What the area will hold, shown while it is still empty. */
  upcoming: string[]
  icon: IconName
}

export type IconName =
  | 'dashboard'
  | 'profiles'
  | 'mixtures'
  | 'catalogues'
  | 'runs'
  | 'comparisons'
  | 'observations'
  | 'reviews'
  | 'admin'
  | 'help'
  | 'sun'
  | 'moon'
  | 'signout'

/** The areas of Tauline in navigation order. */
export const AREAS: AreaInfo[] = [
  {
    area: 'dashboard',
    title: 'Overview',
    summary: 'Your recent work and the state of the workbench.',
    upcoming: [],
    icon: 'dashboard',
  },
  {
    area: 'profiles',
    title: 'Atmospheres',
    summary: 'Layered temperature, pressure, humidity and ozone profiles.',
    upcoming: [
      'Start from the U.S. Standard Atmosphere 1976 or one of five parametric climatologies and adjust it.',
      'Edit levels in a table with unit switches and live checks (monotonic pressure, physical ranges).',
      'Upload a radiosonde sounding, map its columns and units, preview it, and extend its top with a climatology.',
    ],
    icon: 'profiles',
  },
  {
    area: 'mixtures',
    title: 'Gas mixtures',
    summary: 'How much CO₂, CH₄, N₂O, O₃ and H₂O each scenario holds.',
    upcoming: [
      'Uniform mixing ratios, scale factors on a profile’s own amounts, or per-level columns.',
      'Presets for pre-industrial, present-day and doubled-CO₂ scenarios.',
    ],
    icon: 'mixtures',
  },
  {
    area: 'catalogues',
    title: 'Line catalogues',
    summary: 'Spectral line lists: the built-in synthesised catalogue and your imports.',
    upcoming: [
      'A built-in catalogue computed from published molecular constants, with its accuracy stated.',
      'Import of line lists in the standard 160-character record layout, with a summary before saving.',
      'Stick spectra, per-molecule line counts and provenance notes.',
    ],
    icon: 'catalogues',
  },
  {
    area: 'runs',
    title: 'Runs',
    summary: 'Line-by-line calculations: spectra, fluxes and heating rates.',
    upcoming: [
      'A new-run form: atmosphere, mixture, catalogue, spectral range, resolution, continuum, angles.',
      'Progress as spectral chunks finish on the worker pool; cancel and retry.',
      'Results: outgoing and downward spectra, brightness temperature, emission height, flux and heating-rate profiles, downloads.',
    ],
    icon: 'runs',
  },
  {
    area: 'comparisons',
    title: 'Comparisons',
    summary: 'Two runs side by side: forcing, difference spectra and heating-rate changes.',
    upcoming: [],
    icon: 'comparisons',
  },
  {
    area: 'observations',
    title: 'Observations',
    summary: 'Measured spectra held against model spectra.',
    upcoming: [
      'Upload a measured radiance spectrum, convolve the model with the instrument line shape, and see residuals.',
    ],
    icon: 'observations',
  },
  {
    area: 'reviews',
    title: 'Reviews',
    summary: 'Check runs and sign them off; signed runs are frozen.',
    upcoming: [
      'A queue of runs waiting for review, with their inputs, checks and results.',
      'Sign-off with a comment; signed runs cannot change and can be recomputed bit for bit.',
    ],
    icon: 'reviews',
  },
  {
    area: 'admin',
    title: 'People',
    summary: 'Accounts and roles.',
    upcoming: [],
    icon: 'admin',
  },
  {
    area: 'help',
    title: 'Method & help',
    summary: 'How Tauline computes, its sources and its limits.',
    upcoming: [],
    icon: 'help',
  },
]

export function areaInfo(area: Area): AreaInfo {
  const info = AREAS.find((a) => a.area === area)
  if (!info) throw new Error(`Unknown area ${area}`)
  return info
}
