import type { Sequelize } from 'sequelize'
import { createSweepSchema } from '../../shared/schemas/sweeps'
import { Profile, Run, User } from '../models/index'
import type { RunQueue } from '../runs/run-queue'
import { createSweep } from '../runs/sweep.service'
import { DEMO_TEAM } from './demo-team'

/** The demo's first computation: the invented team's CO₂ sweep over the 15 µm band. */
const DEMO_SWEEP = {
  name: 'Kestrel Bay study: CO₂ over the 15 µm band',
  gas: 'CO2',
  amounts: [280, 420, 560, 1120],
  referenceAmount: 280,
  settings: { startCm: 500, endCm: 850, outputResolutionCm: 1 },
} as const

/**
 * Queues the demo sweep on the demo "Mid-latitude summer" atmosphere, once: only while the demo
 * analyst has no runs. The app's workers compute it after start (real numbers, ≈ 15 s on two
 * cores), so a new installation opens with runs to read, compare and review. Returns the number
 * of member runs queued.
 */
export async function seedDemoSweep(sequelize: Sequelize, queue: RunQueue): Promise<number> {
  const analyst = await User.findOne({ where: { email: DEMO_TEAM.find((m) => m.role === 'analyst')!.email } })
  if (!analyst || (await Run.count({ where: { ownerId: analyst.id } })) > 0) return 0
  const profile = await Profile.findOne({ where: { ownerId: analyst.id, name: 'Mid-latitude summer' } })
  if (!profile) return 0
  const input = createSweepSchema.parse({ ...DEMO_SWEEP, profileId: profile.id, mixtureId: null })
  const sweep = await createSweep(sequelize, queue, { id: analyst.id, role: analyst.role }, input)
  return sweep.members.length
}
