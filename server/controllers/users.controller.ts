import type { Request, Response } from 'express'
import type { CreateUserInput, UpdateUserInput } from '../../shared/schemas/auth'
import { AppError } from '../errors'
import * as users from '../services/user.service'

export async function list(_req: Request, res: Response) {
  res.json({ users: await users.listUsers() })
}

export async function create(req: Request, res: Response) {
  res.status(201).json({ user: await users.createUser(req.body as CreateUserInput) })
}

export async function update(req: Request, res: Response) {
  const id = Number(req.params.id)
  if (!Number.isInteger(id) || id <= 0) throw AppError.badRequest('User id must be a positive integer.', { field: 'id' })
  if (!req.user) throw AppError.unauthorized()
  res.json({ user: await users.updateUser(req.user.id, id, req.body as UpdateUserInput) })
}
