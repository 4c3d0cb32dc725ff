import type { Role } from '../../shared/schemas/auth'
import { AppError } from '../errors'

/** Who is acting: enough to decide ownership questions without seeing req. */
export interface Actor {
  id: number
  role: Role
}

/** Owners change their own things; administrators may change anything. */
export function assertCanModify(actor: Actor, ownerId: number, what: string): void {
  if (actor.role !== 'admin' && actor.id !== ownerId) {
    throw AppError.forbidden(`Only the owner of this ${what} or an administrator can change it.`)
  }
}
