// tauline bench: the benchmark of docs/PERFORMANCE.md from the command line.
import { CliError } from './args'

export const benchHelp = `tauline bench [--quick] [--cases A,B,…] [--json]   run the benchmark
  Cases: A full-range run on one thread, B growth with lines and layers, C forcing and a sweep,
  D brute force against the fast path, E the worker-thread pool, F API latency with 50 clients,
  G a run through the queue on 1 and 2 worker processes, H the run page in Chromium.
  Prints a table (or with --json the whole record) and writes bench-results/bench-<date>.json.
  F and G start a throwaway PostgreSQL unless DATABASE_URL is set; H needs Debian's Chromium.`

export async function benchCommand(argv: string[]): Promise<void> {
  // Loaded on demand: the benchmark pulls in the server, the database and the browser driver.
  const { parseBenchArguments, runBench } = await import('../bench/run-bench')
  let parsed
  try {
    parsed = parseBenchArguments(argv)
  } catch (err) {
    throw new CliError((err as Error).message)
  }
  await runBench(parsed)
}
