import * as m0001 from './0001-create-users'
import * as m0002 from './0002-create-session'
import * as m0003 from './0003-create-profiles'
import * as m0004 from './0004-create-gas-mixtures'
import * as m0005 from './0005-create-runs'
import * as m0006 from './0006-create-line-catalogues'
import * as m0007 from './0007-add-run-result-detail'
import * as m0008 from './0008-create-reviews'
import * as m0009 from './0009-store-results-as-json'
import * as m0010 from './0010-create-sweeps'
import * as m0011 from './0011-compress-results-with-lz4'

/** Every migration in order. Add new ones at the end; never edit one that has shipped. */
export const migrations = [
  { name: '0001-create-users', ...m0001 },
  { name: '0002-create-session', ...m0002 },
  { name: '0003-create-profiles', ...m0003 },
  { name: '0004-create-gas-mixtures', ...m0004 },
  { name: '0005-create-runs', ...m0005 },
  { name: '0006-create-line-catalogues', ...m0006 },
  { name: '0007-add-run-result-detail', ...m0007 },
  { name: '0008-create-reviews', ...m0008 },
  { name: '0009-store-results-as-json', ...m0009 },
  { name: '0010-create-sweeps', ...m0010 },
  { name: '0011-compress-results-with-lz4', ...m0011 },
]
