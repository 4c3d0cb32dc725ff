import { z } from 'zod'

/** Roles: analysts compute, reviewers sign runs off, admins manage people. */
export const ROLES = ['analyst', 'reviewer', 'admin'] as const
export const roleSchema = z.enum(ROLES)
export type Role = z.infer<typeof roleSchema>

export const ROLE_TITLES: Record<Role, string> = {
  analyst: 'Analyst',
  reviewer: 'Reviewer',
  admin: 'Administrator',
}

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address.'),
  password: z.string().min(1, 'Enter your password.').max(512),
})
export type SignInInput = z.infer<typeof signInSchema>

/** A user as the API shows it (never the password hash). */
export const publicUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  role: roleSchema,
  active: z.boolean(),
  lastSignInAt: z.string().nullable(),
  createdAt: z.string(),
})
export type PublicUser = z.infer<typeof publicUserSchema>

export const PASSWORD_MIN_LENGTH = 10

export const createUserSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address.'),
  displayName: z.string().trim().min(2, 'Name must have at least 2 characters.').max(120),
  role: roleSchema,
  password: z
    .string()
    .min(PASSWORD_MIN_LENGTH, `Password must have at least ${PASSWORD_MIN_LENGTH} characters.`)
    .max(512),
})
export type CreateUserInput = z.infer<typeof createUserSchema>

export const updateUserSchema = z
  .object({
    displayName: z.string().trim().min(2).max(120).optional(),
    role: roleSchema.optional(),
    active: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change.')
export type UpdateUserInput = z.infer<typeof updateUserSchema>

/** Which areas of the app each role sees in the navigation (the server enforces the same rules). */
export const AREA_ROLES = {
  dashboard: ['analyst', 'reviewer', 'admin'],
  profiles: ['analyst', 'reviewer', 'admin'],
  mixtures: ['analyst', 'reviewer', 'admin'],
  catalogues: ['analyst', 'reviewer', 'admin'],
  runs: ['analyst', 'reviewer', 'admin'],
  comparisons: ['analyst', 'reviewer', 'admin'],
  observations: ['analyst', 'reviewer', 'admin'],
  reviews: ['reviewer', 'admin'],
  admin: ['admin'],
  help: ['analyst', 'reviewer', 'admin'],
} as const satisfies Record<string, readonly Role[]>
export type Area = keyof typeof AREA_ROLES

export function canSeeArea(role: Role, area: Area): boolean {
  return (AREA_ROLES[area] as readonly Role[]).includes(role)
}
