import type { ColumnSummary } from '@shared/physics/atmosphere/column-summary'
import type { AtmosphereLevel } from '@shared/physics/types'
import type { AtmospherePresetInfo } from '@shared/presets/atmosphere-presets'
import type { SoundingDelimiter } from '@shared/profiles/sounding/cells'
import type { ColumnGuess, GuessDescription } from '@shared/profiles/sounding/columns'
import type { RowError } from '@shared/profiles/sounding/issues'
import type { SoundingConversionReport } from '@shared/profiles/sounding/to-levels'
import type { LevelIssue } from '@shared/profiles/level-checks'
import type { Page } from '@shared/schemas/paging'
import type {
  PresetRequest,
  ProfileDetail,
  ProfileInput,
  ProfileSummary,
} from '@shared/schemas/profiles'
import type { SoundingOptions } from '@shared/schemas/soundings'
import { http, queryString } from './http'

/** A stored profile as the server answers a write: the detail plus warnings of the level checks. */
export type SavedProfile = ProfileDetail & { warnings?: LevelIssue[] }

/** `details` of a 400 INVALID_LEVELS answer: every error by level and field, and the warnings. */
export interface InvalidLevelsDetails {
  issues: LevelIssue[]
  warnings: LevelIssue[]
}

/** A preset built with its adjustments, not stored. */
export interface PresetPreview {
  profile: {
    name: string
    surfaceTemperatureK: number
    surfaceEmissivity: number
    levels: AtmosphereLevel[]
    sourceDetails: Record<string, unknown>
  }
  derived: ColumnSummary
}

/** The first look at an uploaded sounding: its columns, a sample, and the server's guess. */
export interface SoundingPreview {
  fileName: string
  delimiter: SoundingDelimiter
  header: string[]
  unitsRow: string[] | null
  rowCount: number
  sampleRows: string[][]
  sampleLineNumbers: number[]
  comments: string[]
  guess: ColumnGuess
  guessDescription: GuessDescription[]
}

/** A sounding converted with the confirmed mapping, not stored. */
export interface SoundingConversion {
  levels: AtmosphereLevel[]
  report: SoundingConversionReport
}

/** `details` of a 400 SOUNDING_INVALID answer. */
export interface SoundingInvalidDetails {
  errors: RowError[]
  errorCount: number
}

/** `details` of a 400 SOUNDING_UNREADABLE answer. */
export interface SoundingUnreadableDetails {
  issues: RowError[]
  issueCount: number
}

/** A page of atmosphere profiles, most recently updated first, optionally filtered by name or description. */
export function fetchProfiles(params: { page?: number; pageSize?: number; search?: string } = {}) {
  return http.get<Page<ProfileSummary>>(`/profiles?${queryString(params)}`)
}

/** One profile with all its levels (SI units). */
export async function fetchProfile(id: number): Promise<ProfileDetail> {
  return (await http.get<{ profile: ProfileDetail }>(`/profiles/${id}`)).profile
}

/** Stores a new profile; a 400 INVALID_LEVELS ApiError carries `InvalidLevelsDetails`. */
export async function createProfile(input: ProfileInput): Promise<SavedProfile> {
  return (await http.post<{ profile: SavedProfile }>('/profiles', input)).profile
}

/** Replaces a profile (owner or administrator only). */
export async function updateProfile(id: number, input: ProfileInput): Promise<SavedProfile> {
  return (await http.put<{ profile: SavedProfile }>(`/profiles/${id}`, input)).profile
}

export async function deleteProfile(id: number): Promise<void> {
  await http.delete(`/profiles/${id}`)
}

/** Copies a profile; the copy belongs to the caller. */
export async function duplicateProfile(id: number): Promise<SavedProfile> {
  return (await http.post<{ profile: SavedProfile }>(`/profiles/${id}/duplicate`)).profile
}

/** The preset atmospheres an analyst can start from. */
export async function fetchPresets(): Promise<AtmospherePresetInfo[]> {
  return (await http.get<{ presets: AtmospherePresetInfo[] }>('/profiles/presets')).presets
}

/** Builds a preset with its adjustments without storing it. */
export function previewPreset(request: Partial<PresetRequest> & Pick<PresetRequest, 'preset'>) {
  return http.post<PresetPreview>('/profiles/presets/preview', request)
}

function soundingForm(file: File, options?: SoundingOptions): FormData {
  const form = new FormData()
  // Fields before the file, so the server has the options when the file arrives.
  if (options) form.append('options', JSON.stringify(options))
  form.append('file', file, file.name)
  return form
}

/** Reads an uploaded file: header, sample rows, and the guessed column mapping and units. */
export function previewSounding(file: File) {
  return http.upload<SoundingPreview>('/profiles/soundings/preview', soundingForm(file))
}

/** Converts a sounding with the confirmed mapping, without storing; SOUNDING_INVALID names every bad row. */
export function convertSounding(file: File, options: SoundingOptions) {
  return http.upload<SoundingConversion>('/profiles/soundings/convert', soundingForm(file, options))
}

/** Converts and stores a sounding as a new profile. */
export async function saveSounding(file: File, options: SoundingOptions): Promise<SavedProfile> {
  return (
    await http.upload<{ profile: SavedProfile }>('/profiles/soundings', soundingForm(file, options))
  ).profile
}
