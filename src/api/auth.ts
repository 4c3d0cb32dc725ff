import type { PublicUser, SignInInput } from '@shared/schemas/auth'
import { http, setCsrfToken } from './http'

/** Who is signed in, or null. */
export async function fetchCurrentUser(): Promise<PublicUser | null> {
  try {
    const { user } = await http.get<{ user: PublicUser }>('/auth/me')
    return user
  } catch {
    return null
  }
}

/** Signs in; keeps the fresh CSRF token of the new session. */
export async function signIn(input: SignInInput): Promise<PublicUser> {
  const { user, csrfToken } = await http.post<{ user: PublicUser; csrfToken: string }>('/auth/sign-in', input)
  setCsrfToken(csrfToken)
  return user
}

export async function signOut(): Promise<void> {
  await http.post('/auth/sign-out')
  setCsrfToken(null)
}
