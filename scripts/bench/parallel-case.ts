// Case E: case A's run on the worker-thread pool that runs use (chunk jobs spread over threads),
// with 1 and with 2 threads, giving the wall time on this machine's cores and the speed-up.
import { availableParallelism } from 'node:os'
import { buildClimatologyProfile } from '../../shared/physics/atmosphere/climatology'
import { planChunks } from '../../shared/physics/engine/prepare'
import { resolveComputeSettings } from '../../shared/physics/engine/settings'
import type { RunInputs } from '../../shared/schemas/runs'
import { ENGINE_VERSION } from '../../shared/version'
import { loadBuiltInCatalogue } from '../../server/catalogue/builtin-catalogue'
import { createChunkPool } from '../../server/runs/chunk-pool'
import { runInputHash } from '../../server/runs/run-inputs'
import type { BenchRow, CaseOptions } from './cases'

export async function caseE(options: CaseOptions): Promise<BenchRow[]> {
  const catalogue = loadBuiltInCatalogue()
  const settings = resolveComputeSettings(options.quick ? { startCm: 500, endCm: 1100, chunkWidthCm: 20 } : { startCm: 10, endCm: 3000, chunkWidthCm: 20 })
  const profile = buildClimatologyProfile('mid-latitude-summer', { levelCount: 61, topPressurePa: 10 })
  const inputs: RunInputs = {
    profile: { id: 0, name: profile.name, snapshot: profile },
    mixture: null,
    catalogue: { id: catalogue.id, checksum: catalogue.checksum, generatorVersion: catalogue.generatorVersion, lineCount: catalogue.lineCount },
    settings,
    engineVersion: ENGINE_VERSION,
  }
  const inputHash = runInputHash(inputs)
  const chunks = planChunks(settings)
  const rows: BenchRow[] = []
  const walls: number[] = []
  for (const threads of [1, Math.min(2, availableParallelism())]) {
    const pool = createChunkPool(threads)
    // Warm every thread (tsx start, catalogue load, preparation) before timing.
    await Promise.all(Array.from({ length: threads }, (_, i) => pool.run({ inputHash, inputs, chunkIndex: i })))
    options.log(`  E: ${chunks.length} chunks on ${threads} thread(s) …`)
    const cpu0 = process.cpuUsage()
    const t0 = performance.now()
    const results = await Promise.all(chunks.map((c) => pool.run({ inputHash, inputs, chunkIndex: c.index })))
    const wallS = (performance.now() - t0) / 1000
    const cpu = process.cpuUsage(cpu0)
    await pool.destroy()
    if (results.some((r) => !r.ok)) throw new Error('a chunk failed in case E')
    walls.push(wallS)
    const gridPointCount = results.reduce((s, r) => s + (r.ok ? r.result.gridPointCount : 0), 0)
    options.log(`    ${wallS.toFixed(2)} s wall`)
    rows.push({
      case: 'E',
      label: `case A on the run pool, ${threads} thread(s), ${settings.startCm}–${settings.endCm} cm⁻¹`,
      measurement: {
        wallS,
        // Worker threads' CPU is not in this process's main-thread count; report the main thread's.
        cpuS: (cpu.user + cpu.system) / 1e6,
        peakRssMiB: process.memoryUsage().rss / 2 ** 20,
        chunkCount: chunks.length,
        gridPointCount,
        lineLayerPairs: 0,
        voigtEvaluations: 0,
        lineLayerPairsPerS: 0,
        gridPointsPerS: gridPointCount / wallS,
        slowestChunk: { startCm: 0, cpuS: 0 },
      },
      notes: threads > 1 ? { speedupOverOneThread: Number((walls[0] / wallS).toFixed(2)) } : {},
    })
  }
  return rows
}
