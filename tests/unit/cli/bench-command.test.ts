import { describe, expect, it } from 'vitest'
import { parseBenchArguments } from '../../../scripts/bench/run-bench'
import { tauline } from '../../support/tauline-cli'

// The benchmark's command line; what it measures is read by people, not asserted here.
describe('tauline bench', () => {
  it('when --json is given, prints the whole record as JSON on stdout', async () => {
    const { code, stdout } = await tauline(['bench', '--quick', '--cases', 'D', '--json'])
    expect(code).toBe(0)
    const record = JSON.parse(stdout)
    expect(record.quick).toBe(true)
    expect(record.catalogue.lineCount).toBeGreaterThan(20_000)
    const cases = record.rows.map((r: { case: string }) => r.case)
    expect(cases.length).toBeGreaterThan(1)
    expect(new Set(cases)).toEqual(new Set(['D']))
    expect(record.rows[0].measurement.wallS).toBeGreaterThan(0)
  }, 120_000)

  it('when a case does not exist, exits with code 2 and lists the cases', async () => {
    const { code, stderr } = await tauline(['bench', '--cases', 'Z'])
    expect(code).toBe(2)
    expect(stderr).toMatch(/unknown case 'Z' \(A, B, C, D, E, F, G, H\)/)
  })

  it('when no case is named, runs every case', () => {
    expect(parseBenchArguments([]).cases).toEqual(['A', 'B', 'C', 'D', 'E', 'F', 'G', 'H'])
    expect(parseBenchArguments(['--cases', 'a,g', '--json'])).toEqual({
      quick: false,
      cases: ['A', 'G'],
      json: true,
    })
  })
})
