import { z } from 'zod'

/** ?page=&pageSize=&search= for list endpoints. */
export const listQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
  search: z.string().trim().max(120).optional(),
})
export type ListQuery = z.infer<typeof listQuerySchema>

export interface Page<T> {
  items: T[]
  total: number
  page: number
  pageSize: number
}
