import { describe, expect, it } from 'vitest'
import { pageTotal } from '../../../server/services/page-total'

describe('pageTotal', () => {
  const counting = (n: number) => {
    const calls = { count: 0 }
    return { calls, count: async () => (calls.count++, n) }
  }

  it('when the page is short, returns the rows before it plus its own without counting', async () => {
    const c = counting(999)
    expect(await pageTotal({ page: 3, pageSize: 20 }, 7, c.count)).toBe(47)
    expect(await pageTotal({ page: 1, pageSize: 20 }, 0, c.count)).toBe(0)
    expect(c.calls.count).toBe(0)
  })

  it('when the page is full, or empty past the first page, returns the counted total', async () => {
    const c = counting(123)
    expect(await pageTotal({ page: 1, pageSize: 20 }, 20, c.count)).toBe(123)
    expect(await pageTotal({ page: 9, pageSize: 20 }, 0, c.count)).toBe(123)
    expect(c.calls.count).toBe(2)
  })
})
