import { describe, expect, it } from 'vitest'
import { parseSweepAmounts } from '../../src/components/runs/sweep-amounts'

describe('parseSweepAmounts', () => {
  it('reads amounts separated by commas, semicolons or spaces', () => {
    expect(parseSweepAmounts('280, 420;560  1120')).toEqual({ amounts: [280, 420, 560, 1120], problem: null })
    expect(parseSweepAmounts(' 0, 1e3 ')).toEqual({ amounts: [0, 1000], problem: null })
  })

  it('names the first amount that is not a number ≥ 0, in the order typed', () => {
    expect(parseSweepAmounts('280, -5, x').problem).toBe('Amount 2 (“-5”) is not a number ≥ 0.')
    expect(parseSweepAmounts('280, 560, lots').problem).toBe('Amount 3 (“lots”) is not a number ≥ 0.')
  })

  it('asks for two to twelve different amounts', () => {
    expect(parseSweepAmounts('280').problem).toBe('Enter at least two amounts.')
    expect(parseSweepAmounts('').problem).toBe('Enter at least two amounts.')
    expect(parseSweepAmounts('1 2 3 4 5 6 7 8 9 10 11 12 13').problem).toBe('At most 12 amounts.')
    expect(parseSweepAmounts('280, 280').problem).toBe('Each amount may appear only once.')
  })
})
