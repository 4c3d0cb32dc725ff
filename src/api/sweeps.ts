import type { RunSettingsInput } from '@shared/schemas/runs'
import type { Page } from '@shared/schemas/paging'
import type { SweepDetail, SweepListItem, SweptGas } from '@shared/schemas/sweeps'
import { http, queryString } from './http'

export interface CreateSweepRequest {
  name?: string
  profileId: number
  mixtureId: number | null
  catalogueId?: 'builtin' | number
  settings: RunSettingsInput
  gas: SweptGas
  amounts: number[]
  referenceAmount?: number
}

/** Submits a sweep: one member run per amount, computed together. */
export async function createSweep(input: CreateSweepRequest): Promise<SweepDetail> {
  return (await http.post<{ sweep: SweepDetail }>('/sweeps', input)).sweep
}

/** A page of sweeps, newest first. */
export function fetchSweeps(params: { page?: number; pageSize?: number; search?: string } = {}): Promise<Page<SweepListItem>> {
  return http.get<Page<SweepListItem>>(`/sweeps?${queryString(params)}`)
}

export async function fetchSweep(id: number): Promise<SweepDetail> {
  return (await http.get<{ sweep: SweepDetail }>(`/sweeps/${id}`)).sweep
}

/** Link of the sweep's forcing table as CSV. */
export function sweepForcingCsvUrl(id: number): string {
  return `/api/sweeps/${id}/forcing.csv`
}
