/**
 * The column mapping of the upload wizard: one choice (field and unit) per file column, made from
 * the server's guess and edited by the analyst, turned into the mapping and units of
 * `SoundingOptions`.
 */
import {
  describeGuess,
  type ColumnGuess,
  type GuessDescription,
  type SoundingField,
} from '@shared/profiles/sounding/columns'
import { LEVEL_UNITS, type LevelQuantity } from '@shared/profiles/units'
import type { SoundingOptions } from '@shared/schemas/soundings'

/** What the analyst chose for one column of the file. */
export interface ColumnChoice {
  field: SoundingField | null
  unit: string | null
}

/** The fields a column can be mapped to, in menu order. */
export const SOUNDING_FIELDS: readonly SoundingField[] = [
  'pressure',
  'temperature',
  'height',
  'dewPoint',
  'relativeHumidity',
  'mixingRatio',
  'specificHumidity',
  'waterVmr',
  'ozone',
]

/** Options of the field menu above a column. */
export const FIELD_OPTIONS = [
  { label: 'Not used', value: '' },
  ...SOUNDING_FIELDS.map((f) => ({ label: LEVEL_UNITS[f].label, value: f })),
]

/** Options of the unit menu of a field. */
export function unitOptions(field: SoundingField | null): { label: string; value: string }[] {
  if (!field) return []
  return LEVEL_UNITS[field as LevelQuantity].units.map((u) => ({ label: u.symbol, value: u.id }))
}

/** One choice per column, pre-filled from the guess. */
export function choicesFromGuess(guess: ColumnGuess, columnCount: number): ColumnChoice[] {
  const choices: ColumnChoice[] = Array.from({ length: columnCount }, () => ({
    field: null,
    unit: null,
  }))
  for (const field of Object.keys(guess.mapping) as SoundingField[]) {
    const index = guess.mapping[field]
    if (index === undefined || index >= columnCount) continue
    choices[index] = {
      field,
      unit: (guess.units[field] as string | undefined) ?? LEVEL_UNITS[field].defaultUnit,
    }
  }
  return choices
}

/**
 * Maps column `index` to `field` (or to nothing). A field is used by one column only, so another
 * column holding it becomes unused. The unit is the guessed one when the guess put this field
 * here, else the field's usual unit.
 */
export function withField(
  choices: readonly ColumnChoice[],
  index: number,
  field: SoundingField | null,
  guess: ColumnGuess,
): ColumnChoice[] {
  return choices.map((c, i) => {
    if (i === index) {
      if (!field) return { field: null, unit: null }
      const guessedHere = guess.mapping[field] === index
      const unit = guessedHere ? ((guess.units[field] as string | undefined) ?? null) : null
      return { field, unit: unit ?? LEVEL_UNITS[field].defaultUnit }
    }
    return field && c.field === field ? { field: null, unit: null } : c
  })
}

/** Mapping and units for `SoundingOptions`; `missing` names what still has to be chosen. */
export function optionsFromChoices(choices: readonly ColumnChoice[]): {
  mapping: Partial<SoundingOptions['mapping']>
  units: SoundingOptions['units']
  missing: string[]
} {
  const mapping: Record<string, number> = {}
  const units: Record<string, string> = {}
  choices.forEach((c, i) => {
    if (!c.field) return
    mapping[c.field] = i
    if (c.unit) units[c.field] = c.unit
  })
  const missing: string[] = []
  if (mapping.pressure === undefined) missing.push('a pressure column')
  if (mapping.temperature === undefined) missing.push('a temperature column')
  return {
    mapping: mapping as Partial<SoundingOptions['mapping']>,
    units: units as SoundingOptions['units'],
    missing,
  }
}

/** The explanation of the current choices, column by column (the guess's reasons where they still apply). */
export function describeChoices(
  guess: ColumnGuess,
  choices: readonly ColumnChoice[],
  header: readonly string[],
): GuessDescription[] {
  const { mapping, units } = optionsFromChoices(choices)
  const ignored = guess.ignored.filter((c) => choices[c.columnIndex]?.field == null)
  return describeGuess({ ...guess, mapping, units, ignored }, header)
}
