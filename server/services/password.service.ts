import { hash, verify } from '@node-rs/argon2'

// Argon2id with the library defaults (m = 19 MiB, t = 2, p = 1), the OWASP-recommended minimum.
export function hashPassword(plain: string): Promise<string> {
  return hash(plain)
}

export async function verifyPassword(passwordHash: string, plain: string): Promise<boolean> {
  try {
    return await verify(passwordHash, plain)
  } catch {
    return false
  }
}
