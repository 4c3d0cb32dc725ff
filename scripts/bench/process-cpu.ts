// CPU time of other processes, read from /proc (Linux), for benchmarks that run a server or
// workers in child processes and want to say where the machine's time went.
import { existsSync, readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'

const TICKS_PER_S = 100 // USER_HZ on Linux

/** Fields after "pid (command) " of /proc/<pid>/stat, as numbers (proc(5): field 3 is index 0). */
function statFields(pid: number | string): number[] | undefined {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8')
    return stat
      .slice(stat.lastIndexOf(')') + 2)
      .split(' ')
      .map(Number)
  } catch {
    return undefined // the process ended while being read
  }
}

/** CPU seconds (user + system, every thread) used so far by one live process. */
export function processCpuS(pid: number): number | undefined {
  const f = statFields(pid)
  return f && (f[11] + f[12]) / TICKS_PER_S
}

/**
 * CPU seconds used so far by the PostgreSQL server of `clusterDir`: the postmaster, its live
 * backends, and (through the postmaster's children counters) every backend that has ended.
 */
export function postgresCpuS(clusterDir: string | undefined): number | undefined {
  const pidFile = clusterDir && join(clusterDir, 'data/postmaster.pid')
  if (!pidFile || !existsSync(pidFile)) return undefined
  const postmaster = Number(readFileSync(pidFile, 'utf8').split('\n')[0])
  let ticks = 0
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue
    const f = statFields(entry)
    if (!f) continue
    // utime stime cutime cstime are fields 14–17 of proc(5).
    if (Number(entry) === postmaster) ticks += f[11] + f[12] + f[13] + f[14]
    else if (f[1] === postmaster) ticks += f[11] + f[12]
  }
  return ticks / TICKS_PER_S
}
