import { guessColumnMapping, describeGuess } from '../../shared/profiles/sounding/columns'
import { parseSoundingText, type ParsedSounding } from '../../shared/profiles/sounding/parse'
import { SoundingError } from '../../shared/profiles/sounding/issues'
import { soundingToLevels } from '../../shared/profiles/sounding/to-levels'
import type { SoundingOptions } from '../../shared/schemas/soundings'
import type { ProfileDetail } from '../../shared/schemas/profiles'
import { AppError } from '../errors'
import type { Actor } from './access'
import { createProfile } from './profile.service'

/** Decodes an uploaded file as UTF-8 (a byte-order mark is dropped; bad bytes become U+FFFD). */
function decode(buffer: Buffer): string {
  return new TextDecoder('utf-8').decode(buffer)
}

function parseOrThrow(buffer: Buffer): ParsedSounding {
  try {
    return parseSoundingText(decode(buffer))
  } catch (err) {
    if (err instanceof SoundingError) {
      throw new AppError(400, 'SOUNDING_UNREADABLE', err.message, { issues: err.issues, issueCount: err.issueCount })
    }
    throw err
  }
}

/** First look at a file: its columns, a sample, and our guess of what each column holds. */
export function previewSounding(fileName: string, buffer: Buffer) {
  const parsed = parseOrThrow(buffer)
  const guess = guessColumnMapping(parsed.header, parsed.rows.slice(0, 50), {
    unitsRow: parsed.unitsRow,
    decimalSeparator: parsed.decimalSeparator,
  })
  return {
    fileName,
    delimiter: parsed.delimiter,
    header: parsed.header,
    unitsRow: parsed.unitsRow ?? null,
    rowCount: parsed.rows.length,
    sampleRows: parsed.rows.slice(0, 12),
    sampleLineNumbers: parsed.lineNumbers.slice(0, 12),
    comments: parsed.comments.slice(0, 20),
    guess,
    guessDescription: describeGuess(guess, parsed.header),
  }
}

/** Converts a file with the confirmed mapping; 400 naming every bad row and field, else levels + report. */
export function convertSounding(buffer: Buffer, options: SoundingOptions) {
  const parsed = parseOrThrow(buffer)
  for (const [field, index] of Object.entries(options.mapping)) {
    if (index !== undefined && index >= parsed.header.length) {
      throw new AppError(400, 'VALIDATION_FAILED', `Column ${index + 1} mapped to ${field} does not exist (the file has ${parsed.header.length} columns).`, {
        fields: [{ field: `mapping.${field}`, message: 'no such column' }],
      })
    }
  }
  const result = soundingToLevels(parsed, options.mapping, options.units, {
    surfaceHeightM: options.surfaceHeightM,
    fillMissingHumidity: options.fillMissingHumidity,
    fillMissingOzone: options.fillMissingOzone,
    thinToMaxLevels: options.thinToMaxLevels,
    extendAbove: options.extendAbove,
  })
  if (result.errors.length > 0) {
    throw new AppError(400, 'SOUNDING_INVALID', `${result.errorCount} problem(s) in the sounding: ${result.errors[0].message}`, {
      errors: result.errors,
      errorCount: result.errorCount,
    })
  }
  return result
}

/** Parses, converts and stores in one step; nothing is stored unless every row is good. */
export async function createProfileFromSounding(
  actor: Actor,
  fileName: string,
  buffer: Buffer,
  options: SoundingOptions,
): Promise<ProfileDetail & { warnings: unknown[] }> {
  const { levels, report } = convertSounding(buffer, options)
  return createProfile(actor, {
    name: options.name,
    description: options.description,
    source: 'sounding',
    sourceDetails: {
      fileName,
      mapping: options.mapping,
      units: options.units,
      droppedRows: report.dropped,
      repairedCells: report.repaired,
      heightsFilled: report.heightsFilled,
      order: report.order,
      humiditySource: report.humiditySource ?? null,
      thinnedFrom: report.thinnedFrom ?? null,
      extendedAbove: report.extendedAbove ?? null,
      ozoneFromClimatology: report.ozoneFromClimatology,
      levelLineNumbers: report.levelLineNumbers,
    },
    surfaceTemperatureK: options.surfaceTemperatureK ?? levels[0].temperatureK,
    surfaceEmissivity: options.surfaceEmissivity,
    levels,
  })
}
