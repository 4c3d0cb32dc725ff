import * as m0001 from './0001-create-users'
import * as m0002 from './0002-create-session'

/** Every migration in order. Add new ones at the end; never edit one that has shipped. */
export const migrations = [
  { name: '0001-create-users', ...m0001 },
  { name: '0002-create-session', ...m0002 },
]
