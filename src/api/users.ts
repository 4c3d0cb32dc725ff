import type { CreateUserInput, PublicUser, UpdateUserInput } from '@shared/schemas/auth'
import { http } from './http'

/** Every user account (administrators only). */
export async function fetchUsers(): Promise<PublicUser[]> {
  return (await http.get<{ users: PublicUser[] }>('/admin/users')).users
}

export async function createUser(input: CreateUserInput): Promise<PublicUser> {
  return (await http.post<{ user: PublicUser }>('/admin/users', input)).user
}

export async function updateUser(id: number, input: UpdateUserInput): Promise<PublicUser> {
  return (await http.patch<{ user: PublicUser }>(`/admin/users/${id}`, input)).user
}
