import { UniqueConstraintError } from 'sequelize'
import type { CreateUserInput, PublicUser, UpdateUserInput } from '../../shared/schemas/auth'
import { AppError } from '../errors'
import { User } from '../models/index'
import { hashPassword, verifyPassword } from './password.service'

// A hash of a password nobody has, so a sign-in for an unknown e-mail costs the same time.
let decoyHash: Promise<string> | undefined

/** Returns the user when e-mail and password match an active account, else null. */
export async function authenticate(email: string, password: string): Promise<User | null> {
  const user = await User.findOne({ where: { email: email.toLowerCase() } })
  if (!user) {
    decoyHash ??= hashPassword('decoy-password-for-timing')
    await verifyPassword(await decoyHash, password)
    return null
  }
  if (!(await verifyPassword(user.passwordHash, password))) return null
  if (!user.active) return null
  user.lastSignInAt = new Date()
  await user.save()
  return user
}

/**
 * Every signed-in request needs its user; remembering it for a few seconds spares one query per
 * request. A change made here (updateUser) is seen at once; one made by another server process
 * within ACTIVE_USER_TTL_MS.
 */
const ACTIVE_USER_TTL_MS = 5_000
const activeUsers = new Map<number, { user: User | null; atMs: number }>()

export async function findActiveUser(id: number): Promise<User | null> {
  const now = Date.now()
  const hit = activeUsers.get(id)
  if (hit && now - hit.atMs < ACTIVE_USER_TTL_MS) return hit.user
  const found = await User.findByPk(id)
  const user = found && found.active ? found : null
  if (activeUsers.size > 10_000) activeUsers.clear()
  activeUsers.set(id, { user, atMs: now })
  return user
}

export async function listUsers(): Promise<PublicUser[]> {
  const users = await User.findAll({ order: [['role', 'ASC'], ['displayName', 'ASC']] })
  return users.map((u) => u.toPublic())
}

export async function createUser(input: CreateUserInput): Promise<PublicUser> {
  try {
    const user = await User.create({
      email: input.email,
      displayName: input.displayName,
      role: input.role,
      passwordHash: await hashPassword(input.password),
      lastSignInAt: null,
    })
    return user.toPublic()
  } catch (err) {
    if (err instanceof UniqueConstraintError) {
      throw AppError.conflict(`A user with e-mail ${input.email} already exists.`, { field: 'email' })
    }
    throw err
  }
}

/** Changes name, role or active flag. An admin cannot demote or deactivate themself. */
export async function updateUser(actorId: number, id: number, input: UpdateUserInput): Promise<PublicUser> {
  const user = await User.findByPk(id)
  if (!user) throw AppError.notFound('User')
  if (actorId === id && ((input.role && input.role !== 'admin') || input.active === false)) {
    throw AppError.badRequest('You cannot remove your own administrator access.', { field: 'role' })
  }
  if (input.displayName !== undefined) user.displayName = input.displayName
  if (input.role !== undefined) user.role = input.role
  if (input.active !== undefined) user.active = input.active
  await user.save()
  activeUsers.delete(id)
  return user.toPublic()
}
