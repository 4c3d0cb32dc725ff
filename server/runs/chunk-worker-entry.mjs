// Worker-thread entry of the chunk pool. tsx's ES-module loader is registered here, inside the
// thread, so the TypeScript worker loads as ES modules. (Through `--import tsx` in the pool's
// execArgv, Node 20 worker threads only get tsx's CommonJS hook; modules compiled to CommonJS
// reach every import through a getter, and chunks ran ≈ 35 % slower: docs/PERFORMANCE.md.)
import { register } from 'tsx/esm/api'

register()
const worker = await import('./chunk.worker.ts')

export default worker.default
