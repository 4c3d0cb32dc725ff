import { http } from './http'

export interface Health {
  status: 'ok' | 'degraded'
  database: string
  engineVersion: string
}

export function fetchHealth(): Promise<Health> {
  return http.get<Health>('/health')
}
