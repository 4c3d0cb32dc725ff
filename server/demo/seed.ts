import { User } from '../models/index'
import { hashPassword } from '../services/password.service'
import { DEMO_TEAM } from './demo-team'

/** Creates the demo team when missing; leaves existing accounts (and changed passwords) alone. */
export async function seedDemoTeam(password: string): Promise<{ created: number }> {
  let created = 0
  const passwordHash = await hashPassword(password)
  for (const member of DEMO_TEAM) {
    const [, wasCreated] = await User.findOrCreate({
      where: { email: member.email },
      defaults: { ...member, passwordHash, lastSignInAt: null },
    })
    if (wasCreated) created++
  }
  return { created }
}
