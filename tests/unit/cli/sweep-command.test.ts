import { describe, expect, it } from 'vitest'
import { parseAmounts } from '../../../scripts/cli/sweep-command'
import { tauline } from '../../support/tauline-cli'

// A narrow range on the CO₂ band and 11 levels keep the child processes quick.
const scenario = ['--gas', 'co2', '--range', '660:680', '--levels', '11', '--atmosphere', 'mid-latitude-summer', '--quiet', '--json']

describe('tauline sweep', () => {
  it('prints OLR, forcing against the reference and a logarithmic fit for every amount, with the optics shared', async () => {
    const { code, stdout } = await tauline(['sweep', ...scenario, '--amounts', '280,560,1120', '--reference', '400'])
    expect(code).toBe(0)
    const record = JSON.parse(stdout)
    expect(record.opticsShared).toBe(true)
    expect(record.amounts).toEqual([280, 560, 1120, 400]) // the reference is added as a member
    expect(record.forcingWPerM2.top[3]).toBe(0)
    // More CO₂ lowers OLR in its band: forcing at the tropopause grows with the amount.
    const tropopause = record.forcingWPerM2.tropopause
    expect(tropopause[0]).toBeLessThan(0)
    expect(tropopause[1]).toBeGreaterThan(0)
    expect(tropopause[2]).toBeGreaterThan(tropopause[1])
    expect(record.logarithmicFit.tropopause.points).toBe(4)
    expect(record.cautions.join(' ')).toMatch(/Clear sky only/)
  }, 60_000)

  it('with --independent, computes every amount on its own and agrees with the shared sweep within 2e-3 W m⁻²', async () => {
    const args = ['sweep', ...scenario, '--amounts', '280,560']
    const [shared, alone] = await Promise.all([tauline(args), tauline([...args, '--independent'])])
    const a = JSON.parse(shared.stdout)
    const b = JSON.parse(alone.stdout)
    expect(b.opticsShared).toBe(false)
    expect(b.independentReason).toMatch(/--independent/)
    for (const level of ['top', 'tropopause', 'surface']) {
      expect(Math.abs(a.forcingWPerM2[level][1] - b.forcingWPerM2[level][1])).toBeLessThan(2e-3)
    }
  }, 60_000)

  it('on two threads, gives the numbers of one thread bit for bit (chunks are independent and merged in order)', async () => {
    const args = ['sweep', ...scenario, '--range', '640:700', '--amounts', '280,560,1120']
    const [one, two] = await Promise.all([tauline([...args, '--threads', '1']), tauline([...args, '--threads', '2'])])
    const a = JSON.parse(one.stdout)
    const b = JSON.parse(two.stdout)
    expect(b.olrWPerM2).toEqual(a.olrWPerM2)
    expect(b.forcingWPerM2).toEqual(a.forcingWPerM2)
    const bad = await tauline(['sweep', ...scenario, '--amounts', '1,2', '--threads', '0'])
    expect(bad.code).toBe(2)
    expect(bad.stderr).toMatch(/--threads must be a whole number from 1 to 256, got "0"/)
  }, 90_000)

  it('names the bad item of --amounts and exits with code 2', async () => {
    expect(() => parseAmounts('280,,560')).toThrow('--amounts item 2 must be a number ≥ 0, got ""')
    expect(() => parseAmounts('280,-1')).toThrow(/item 2/)
    expect(() => parseAmounts('280,280')).toThrow(/at least two different amounts/)
    const { code, stderr } = await tauline(['sweep', '--gas', 'co2', '--amounts', '280,abc'])
    expect(code).toBe(2)
    expect(stderr).toMatch(/--amounts item 2 must be a number ≥ 0, got "abc"/)
    const wrongGas = await tauline(['sweep', '--gas', 'xe', '--amounts', '1,2'])
    expect(wrongGas.stderr).toMatch(/--gas must be co2, ch4 or n2o/)
  }, 60_000)
})
