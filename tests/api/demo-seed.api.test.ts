import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { seedDemoSweep } from '../../server/demo/demo-sweep'
import { seedDemoTeam, seedDemoWorkspace } from '../../server/demo/seed'
import { GasMixture, Profile, Run, Sweep, User } from '../../server/models/index'
import { createTestApp, TEST_PASSWORD, type TestApp } from '../support/test-app'

let t: TestApp
beforeAll(async () => {
  // The queue without workers: the demo sweep is queued, not computed, here.
  t = await createTestApp({ seedWorkspace: true, runs: { threads: 0 } })
})
afterAll(async () => {
  await t.close()
})

describe('demo seed', () => {
  it('creates one invented person per role at example.org', async () => {
    const users = await User.findAll()
    expect(users.map((u) => u.role).sort()).toEqual(['admin', 'analyst', 'reviewer'])
    expect(users.every((u) => u.email.endsWith('@example.org'))).toBe(true)
  })

  it('creates preset atmospheres, the invented campaign soundings (extended to 0.1 hPa) and mixtures', async () => {
    const profiles = await Profile.findAll()
    expect(profiles.filter((p) => p.source === 'sounding')).toHaveLength(3)
    for (const p of profiles.filter((x) => x.source === 'sounding')) {
      expect(p.name).toMatch(/Kestrel Bay 2026/)
      expect(p.derived.topPressurePa).toBeCloseTo(10, 6)
      expect((p.sourceDetails.extendedAbove as { climatology: string }).climatology).toBe('mid-latitude-summer')
    }
    expect(profiles.some((p) => p.source === 'us-standard-1976')).toBe(true)
    expect(await GasMixture.count()).toBe(4)
  })

  it('queues the demo CO₂ sweep once, on the mid-latitude summer atmosphere, for the workers to compute', async () => {
    expect(await seedDemoSweep(t.sequelize, t.runSystem!.queue)).toBe(4)
    const sweep = await Sweep.findOne()
    expect(sweep).toMatchObject({ gas: 'CO2', unit: 'ppmv', amounts: [280, 420, 560, 1120], referenceAmount: 280 })
    const members = await Run.findAll({ where: { sweepId: sweep!.id } })
    expect(members.map((r) => r.status)).toEqual(['queued', 'queued', 'queued', 'queued'])
    expect(members.every((r) => r.inputs.profile.name === 'Mid-latitude summer')).toBe(true)
    expect(members[0].inputs.settings).toMatchObject({ startCm: 500, endCm: 850, outputResolutionCm: 1 })
    // Once the analyst has runs, seeding again queues nothing.
    expect(await seedDemoSweep(t.sequelize, t.runSystem!.queue)).toBe(0)
    expect(await Run.count()).toBe(4)
  })

  it('when run again, creates nothing new', async () => {
    const before = [await User.count(), await Profile.count(), await GasMixture.count()]
    await seedDemoTeam(TEST_PASSWORD)
    await seedDemoWorkspace()
    expect([await User.count(), await Profile.count(), await GasMixture.count()]).toEqual(before)
  })
})
