// Benchmark of Tauline (npm run bench [-- --quick] [-- --cases A,D] [-- --json]).
//
// Fixed cases (scripts/bench/cases.ts): A the realistic full-range run (mid-latitude summer, 60
// layers, 10–3000 cm⁻¹, the built-in catalogue), B line-count and layer scaling, C forcing and a
// concentration sweep, D brute force against the adaptive method on a narrow window. Every run is
// single-threaded (chunks in order, as computeRadiation). Reported per run: wall and CPU time,
// peak resident memory (sampled after every chunk, and the process maximum), (line, layer) pairs
// and grid points per second of wall time, Voigt evaluations, slowest chunk. The table goes to
// stdout and everything to bench-results/bench-<date>.json (git-ignored). --quick runs smaller
// versions of every case (a few minutes in all).
// Case F (scripts/bench/api-latency-case.ts) measures API latency instead: 50 signed-in clients
// against list and detail endpoints of the real app on a throwaway database; its rows give the
// server's CPU and memory, and the latency percentiles, requests/s and failures in the notes.
// Case G (scripts/bench/queue-case.ts) runs case A through the run queue on one and on two
// standalone worker processes; case H (scripts/bench/client-spectrum-case.ts) measures the run
// page in Chromium with 200 000-bin spectra and a 500 000-point full-resolution window.
import { parseBenchArguments, runBench } from './bench/run-bench'

await runBench(parseBenchArguments(process.argv.slice(2)))
