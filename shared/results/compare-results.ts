// Two stored run results side by side: forcing at the top, the tropopause and the surface, and
// where in the spectrum and in the column it comes from. Works on the stored, client-facing form
// (plain arrays, null where a value is undefined), so the server can compare runs from the
// database and a test can compare engine results directly.

/** A stored value: a number, or null where the engine had none (NaN, ±∞). */
export type StoredNumber = number | null

/** The parts of a run's stored results a comparison reads. */
export interface ComparableResults {
  summary: { tropopause: { levelIndex: number; pressurePa: number } }
  levels: {
    pressurePa: StoredNumber[]
    fluxUpWPerM2: StoredNumber[]
    fluxDownWPerM2: StoredNumber[]
    fluxNetUpWPerM2: StoredNumber[]
  }
  layers: { heatingRateKPerDay: StoredNumber[] }
  spectrum: { wavenumberCm: StoredNumber[]; olrSpectral: StoredNumber[]; surfaceDownSpectral: StoredNumber[] }
  /** Bin-major: value of bin b at level l is at b × levelCount + l. */
  spectralFluxes: { fluxUpBinned: StoredNumber[]; fluxDownBinned: StoredNumber[] }
}

/** Forcing at one level: the reduction of net upward flux from `before` to `after`. */
export interface LevelForcing {
  level: 'top' | 'tropopause' | 'surface'
  levelIndex: number
  pressurePa: number
  beforeNetUpWPerM2: number
  afterNetUpWPerM2: number
  forcingWPerM2: number
}

export interface ResultsComparison {
  /** At the top, the tropopause of `before`, and the surface. */
  forcing: LevelForcing[]
  /** Whether both runs have the same level pressures (within 1e-6 relative). */
  samePressures: boolean
  spectrum: {
    wavenumberCm: number[]
    olrBefore: StoredNumber[]
    olrAfter: StoredNumber[]
    surfaceDownBefore: StoredNumber[]
    surfaceDownAfter: StoredNumber[]
    /** Spectral forcing (reduction of net upward spectral flux) at the top, tropopause and surface, W m⁻² (cm⁻¹)⁻¹. */
    toaForcing: StoredNumber[]
    tropopauseForcing: StoredNumber[]
    surfaceForcing: StoredNumber[]
  }
  column: {
    /** Level pressures of `before`, Pa, surface first. */
    pressurePa: StoredNumber[]
    /** Forcing at every level (before − after net upward flux), W m⁻². */
    forcingWPerM2: StoredNumber[]
    /** after − before heating rate per layer, K/day (positive: the layer warms more). */
    heatingRateChangeKPerDay: StoredNumber[]
  }
}

/** The two results cannot be compared; `field` names what differs. */
export class ResultsNotComparableError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message)
    this.name = 'ResultsNotComparableError'
  }
}

const difference = (a: StoredNumber, b: StoredNumber): StoredNumber =>
  a === null || b === null ? null : a - b

const numberAt = (values: StoredNumber[], i: number, what: string): number => {
  const v = values[i]
  if (v === null || v === undefined) throw new ResultsNotComparableError(what, `${what}[${i}] has no value`)
  return v
}

function describeGrid(w: StoredNumber[]): string {
  return w.length === 0 ? 'no bins' : `${w.length} bins from ${w[0]} to ${w[w.length - 1]} cm⁻¹`
}

/** Same bins in both runs, to 1e-9 cm⁻¹ (the grid is computed from the settings, so it is exact). */
function checkSameBins(before: ComparableResults, after: ComparableResults): void {
  const a = before.spectrum.wavenumberCm
  const b = after.spectrum.wavenumberCm
  const same = a.length === b.length && a.every((v, i) => v !== null && b[i] !== null && Math.abs(v - (b[i] as number)) <= 1e-9)
  if (!same) {
    throw new ResultsNotComparableError(
      'spectrum.wavenumberCm',
      `The runs have different spectral bins (${describeGrid(a)} against ${describeGrid(b)}); compare runs with the same range and output resolution.`,
    )
  }
}

function checkSameLevelCount(before: ComparableResults, after: ComparableResults): void {
  const a = before.levels.pressurePa.length
  const b = after.levels.pressurePa.length
  if (a !== b) {
    throw new ResultsNotComparableError(
      'levels.pressurePa',
      `The runs have different numbers of levels (${a} against ${b}); forcing compares the same levels of one column.`,
    )
  }
}

/** Net upward spectral flux of bin b at level l. */
function netSpectral(r: ComparableResults, bin: number, level: number, levelCount: number): StoredNumber {
  const i = bin * levelCount + level
  return difference(r.spectralFluxes.fluxUpBinned[i], r.spectralFluxes.fluxDownBinned[i])
}

/**
 * Compares `after` with `before` (the reference). Forcing is the reduction of net upward flux,
 * F = N_before − N_after, as `compareRuns` in the engine: positive when `after` keeps more energy
 * in the column below that level. The tropopause is `before`'s.
 */
export function compareResults(before: ComparableResults, after: ComparableResults): ResultsComparison {
  checkSameBins(before, after)
  checkSameLevelCount(before, after)
  const levelCount = before.levels.pressurePa.length
  const top = levelCount - 1
  const tropopause = before.summary.tropopause.levelIndex
  const pressureOf = (level: number) => numberAt(before.levels.pressurePa, level, 'levels.pressurePa')
  const forcingAt = (level: number, name: LevelForcing['level']): LevelForcing => {
    const beforeNet = numberAt(before.levels.fluxNetUpWPerM2, level, 'levels.fluxNetUpWPerM2')
    const afterNet = numberAt(after.levels.fluxNetUpWPerM2, level, 'levels.fluxNetUpWPerM2')
    return {
      level: name,
      levelIndex: level,
      pressurePa: pressureOf(level),
      beforeNetUpWPerM2: beforeNet,
      afterNetUpWPerM2: afterNet,
      forcingWPerM2: beforeNet - afterNet,
    }
  }
  const samePressures = before.levels.pressurePa.every((p, i) => {
    const q = after.levels.pressurePa[i]
    return p !== null && q !== null && Math.abs(p - q) <= 1e-6 * Math.abs(p)
  })

  const binCount = before.spectrum.wavenumberCm.length
  const spectralForcingAt = (level: number): StoredNumber[] =>
    Array.from({ length: binCount }, (_, b) =>
      difference(netSpectral(before, b, level, levelCount), netSpectral(after, b, level, levelCount)),
    )

  return {
    forcing: [forcingAt(top, 'top'), forcingAt(tropopause, 'tropopause'), forcingAt(0, 'surface')],
    samePressures,
    spectrum: {
      wavenumberCm: before.spectrum.wavenumberCm as number[],
      olrBefore: before.spectrum.olrSpectral,
      olrAfter: after.spectrum.olrSpectral,
      surfaceDownBefore: before.spectrum.surfaceDownSpectral,
      surfaceDownAfter: after.spectrum.surfaceDownSpectral,
      toaForcing: spectralForcingAt(top),
      tropopauseForcing: spectralForcingAt(tropopause),
      surfaceForcing: spectralForcingAt(0),
    },
    column: {
      pressurePa: before.levels.pressurePa,
      forcingWPerM2: before.levels.fluxNetUpWPerM2.map((n, i) => difference(n, after.levels.fluxNetUpWPerM2[i])),
      heatingRateChangeKPerDay: after.layers.heatingRateKPerDay.map((h, i) =>
        difference(h, before.layers.heatingRateKPerDay[i] ?? null),
      ),
    },
  }
}

/** A leaf of the inputs that differs between two runs. */
export interface InputDifference {
  path: string
  before: unknown
  after: unknown
}

/** Paths whose whole value is compared as one (an atmosphere's levels would be hundreds of leaves). */
const COMPARED_WHOLE = new Set(['profile.snapshot'])

/**
 * The leaves of two runs' frozen inputs that differ, depth first, at most `limit` of them:
 * what changed from one scenario to the other. Arrays and `COMPARED_WHOLE` paths are one leaf.
 */
export function inputDifferences(before: unknown, after: unknown, limit = 30): InputDifference[] {
  const out: InputDifference[] = []
  const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v)
  const walk = (a: unknown, b: unknown, path: string) => {
    if (out.length >= limit) return
    if (isObject(a) && isObject(b) && !COMPARED_WHOLE.has(path)) {
      const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort()
      for (const key of keys) walk(a[key], b[key], path ? `${path}.${key}` : key)
      return
    }
    if (JSON.stringify(a) !== JSON.stringify(b)) {
      const whole = COMPARED_WHOLE.has(path)
      out.push({ path, before: whole ? '(differs)' : (a ?? null), after: whole ? '(differs)' : (b ?? null) })
    }
  }
  walk(before, after, '')
  return out
}
