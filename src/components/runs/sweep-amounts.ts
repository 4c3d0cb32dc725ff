import { MAX_SWEEP_MEMBERS } from '@shared/schemas/sweeps'

/**
 * Reads the amounts of a sweep as an analyst types them ("280, 400, 560" — commas, semicolons or
 * spaces between them) and says what is wrong in the analyst's terms; `problem` is null when
 * they can be submitted.
 */
export function parseSweepAmounts(text: string): { amounts: number[]; problem: string | null } {
  const items = text
    .split(/[\s,;]+/)
    .map((s) => s.trim())
    .filter((s) => s !== '')
  const amounts: number[] = []
  for (const [i, item] of items.entries()) {
    const value = Number(item)
    if (!Number.isFinite(value) || value < 0) {
      return { amounts, problem: `Amount ${i + 1} (“${item}”) is not a number ≥ 0.` }
    }
    amounts.push(value)
  }
  if (amounts.length < 2) return { amounts, problem: 'Enter at least two amounts.' }
  if (amounts.length > MAX_SWEEP_MEMBERS)
    return { amounts, problem: `At most ${MAX_SWEEP_MEMBERS} amounts.` }
  if (new Set(amounts).size !== amounts.length)
    return { amounts, problem: 'Each amount may appear only once.' }
  return { amounts, problem: null }
}
