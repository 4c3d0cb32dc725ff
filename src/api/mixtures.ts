import type { MixtureInput, MixtureSummary } from '@shared/schemas/mixtures'
import type { MixturePreset } from '@shared/mixtures/presets'
import type { Page } from '@shared/schemas/paging'
import { http, queryString } from './http'

/** A page of gas mixtures, newest first, optionally filtered by name. */
export function fetchMixtures(params: { page?: number; pageSize?: number; search?: string } = {}) {
  return http.get<Page<MixtureSummary>>(`/mixtures?${queryString(params)}`)
}

export async function fetchMixturePresets(): Promise<MixturePreset[]> {
  return (await http.get<{ presets: MixturePreset[] }>('/mixtures/presets')).presets
}

export async function createMixture(input: MixtureInput): Promise<MixtureSummary> {
  return (await http.post<{ mixture: MixtureSummary }>('/mixtures', input)).mixture
}

export async function updateMixture(id: number, input: MixtureInput): Promise<MixtureSummary> {
  return (await http.put<{ mixture: MixtureSummary }>(`/mixtures/${id}`, input)).mixture
}

export async function deleteMixture(id: number): Promise<void> {
  await http.delete(`/mixtures/${id}`)
}

export async function duplicateMixture(id: number): Promise<MixtureSummary> {
  return (await http.post<{ mixture: MixtureSummary }>(`/mixtures/${id}/duplicate`)).mixture
}
