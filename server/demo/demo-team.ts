import type { Role } from '../../shared/schemas/auth'

/** The invented organisation and people of the demo data. Any likeness to real ones is chance. */
export const DEMO_ORGANISATION = 'Northfell Climate Analytics'

export const DEMO_TEAM: { email: string; displayName: string; role: Role }[] = [
  { email: 'ines.varga@example.org', displayName: 'Ines Varga', role: 'analyst' },
  { email: 'tomas.okafor@example.org', displayName: 'Tomas Okafor', role: 'reviewer' },
  { email: 'maren.solbakk@example.org', displayName: 'Maren Solbakk', role: 'admin' },
]
