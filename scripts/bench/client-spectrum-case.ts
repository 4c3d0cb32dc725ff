// Case H: the run page in the browser with very long spectra. The built client (dist/, built if
// missing) is served with a mock API from this process on a loopback port: a run whose binned
// spectrum has 200 000 bins (the most a run may store) and whose full-resolution window has
// 500 000 points on a non-uniform grid; the data are synthetic (line-like dips on smooth curves)
// and exist only here. Debian's Chromium (headless, playwright-core) loads /runs/1 and the page
// itself reports, with performance.now(): when the response arrived and when the window's chart
// was first painted, each Ctrl + wheel zoom step's time to the next frame, and the time until the
// points are re-cut for the zoomed window and painted. Long tasks and main-thread time come from
// the browser. Usage: node --import tsx scripts/bench/client-spectrum-case.ts [--quick]
import { execFileSync } from 'node:child_process'
import { existsSync, readFileSync } from 'node:fs'
import { createServer, type Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { dirname, extname, join, normalize } from 'node:path'
import { fileURLToPath } from 'node:url'
import type { Page } from 'playwright-core'
import { buildClimatologyProfile } from '../../shared/physics/atmosphere/climatology'
import { resolveComputeSettings } from '../../shared/physics/engine/settings'
import { planckRadianceWavenumber } from '../../shared/physics/planck'
import type { RunDetail } from '../../shared/schemas/runs'
import { ENGINE_VERSION } from '../../shared/version'
import { launchBrowser } from '../../tests/support/browser'
import type { BenchRow, CaseOptions } from './cases'

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..')
const DIST = join(ROOT, 'dist')
const RUN_ID = 1
const BINNED_POINTS = 200_000
const DETAIL_POINTS = 500_000
const DETAIL_WINDOW = { startCm: 620, endCm: 720 }
const ZOOM_STEPS = 14
/** Chart frames of the run page besides the window's: four spectra, two profiles. */
const BINNED_CHARTS = 6

// ---- synthetic data (deterministic) ----

/** Brightness temperature with narrow absorption lines every ~0.31 cm⁻¹ (depths vary). */
function syntheticBrightnessK(w: number): number {
  const spacing = 0.3137
  const k = Math.round(w / spacing)
  let dip = 0
  for (let j = k - 2; j <= k + 2; j++) {
    const depth = 25 + 35 * Math.abs(Math.sin(j * 12.9898))
    const halfWidth = 0.004 + 0.01 * Math.abs(Math.sin(j * 78.233))
    dip += depth / (1 + ((w - j * spacing) / halfWidth) ** 2)
  }
  return 288 - 40 * Math.exp(-(((w - 667) / 40) ** 2)) - dip
}

function column(n: number, f: (i: number) => number | null): (number | null)[] {
  return Array.from({ length: n }, (_, i) => {
    const v = f(i)
    return v === null || !Number.isFinite(v) ? null : Number(v.toPrecision(7))
  })
}

/** The run record, results and detail window as the API would send them (JSON text). */
function syntheticApi(): { run: string; results: string; detail: string; user: string } {
  const settings = resolveComputeSettings({
    startCm: 600,
    endCm: 2600,
    outputResolutionCm: 0.01,
    detailWindow: DETAIL_WINDOW,
  })
  const profile = buildClimatologyProfile('mid-latitude-summer', {
    levelCount: 61,
    topPressurePa: 10,
  })
  const now = new Date().toISOString()
  const run: RunDetail = {
    id: RUN_ID,
    name: 'Synthetic long spectrum (bench)',
    sweepId: null,
    status: 'succeeded',
    profileName: profile.name,
    mixtureName: null,
    startCm: settings.startCm,
    endCm: settings.endCm,
    chunkCount: 200,
    chunksDone: 200,
    error: null,
    inputHash: 'sha256:bench',
    engineVersion: ENGINE_VERSION,
    ownerId: 1,
    ownerName: 'Bench Analyst',
    queuedAt: now,
    startedAt: now,
    finishedAt: now,
    computeMs: 1000,
    etaSeconds: null,
    olrWPerM2: 250,
    signedOff: false,
    signedOffBy: null,
    signedOffAt: null,
    inputs: {
      profile: { id: 1, name: profile.name, snapshot: profile },
      mixture: null,
      catalogue: {
        id: 'builtin',
        checksum: 'sha256:bench-catalogue',
        generatorVersion: 'bench',
        lineCount: 1000,
      },
      settings,
      engineVersion: ENGINE_VERSION,
    },
  }

  const levels = profile.levels.length
  const wBinned = (i: number) => settings.startCm + (i + 0.5) * settings.outputResolutionCm
  const btBinned = (i: number) => syntheticBrightnessK(wBinned(i))
  const results = {
    runId: RUN_ID,
    inputHash: run.inputHash,
    engineVersion: ENGINE_VERSION,
    summary: {
      olrWPerM2: 250,
      surfaceDownWPerM2: 330,
      surfaceUpWPerM2: 390,
      toaNetUpWPerM2: 250,
      tropopause: {
        levelIndex: 20,
        pressurePa: 20_000,
        heightM: 12_000,
        method: 'bench',
        netUpWPerM2: 240,
      },
      gridPointCount: 40_000_000,
      lteRiskFromLevel: null,
    },
    levels: {
      pressurePa: column(levels, (i) => profile.levels[i].pressurePa),
      heightM: column(levels, (i) => profile.levels[i].heightM),
      temperatureK: column(levels, (i) => profile.levels[i].temperatureK),
      fluxUpWPerM2: column(levels, (i) => 390 - i * 2),
      fluxDownWPerM2: column(levels, (i) => 330 - i * 5),
      fluxNetUpWPerM2: column(levels, (i) => 60 + i * 3),
      lteRatio: column(levels, () => 1),
    },
    layers: { heatingRateKPerDay: column(levels - 1, (i) => -1.5 + Math.sin(i / 6)) },
    spectrum: {
      wavenumberCm: column(BINNED_POINTS, wBinned),
      olrSpectral: column(
        BINNED_POINTS,
        (i) => Math.PI * planckRadianceWavenumber(wBinned(i), btBinned(i)),
      ),
      surfaceDownSpectral: column(
        BINNED_POINTS,
        (i) => Math.PI * planckRadianceWavenumber(wBinned(i), 300 - btBinned(i) / 4),
      ),
      toaNadirRadiance: column(BINNED_POINTS, (i) =>
        planckRadianceWavenumber(wBinned(i), btBinned(i)),
      ),
      toaBrightnessTemperatureK: column(BINNED_POINTS, btBinned),
      surfaceZenithRadiance: column(BINNED_POINTS, (i) =>
        planckRadianceWavenumber(wBinned(i), 300 - btBinned(i) / 4),
      ),
      columnTransmittance: column(BINNED_POINTS, (i) => Math.max(0, (btBinned(i) - 200) / 90)),
      emissionPressurePa: column(
        BINNED_POINTS,
        (i) => 100_000 * Math.exp(-(288 - btBinned(i)) / 15),
      ),
      emissionHeightM: column(BINNED_POINTS, (i) => Math.max(0, (288 - btBinned(i)) * 150)),
    },
  }

  // A non-uniform grid: spacing swings by ±60 % along the window (ascending everywhere).
  const span = DETAIL_WINDOW.endCm - DETAIL_WINDOW.startCm
  const wDetail = (i: number) => {
    const t = i / (DETAIL_POINTS - 1)
    return (
      DETAIL_WINDOW.startCm +
      span * (t + (0.6 * Math.sin(2 * Math.PI * 300 * t)) / (2 * Math.PI * 300))
    )
  }
  const grid = Array.from({ length: DETAIL_POINTS }, (_, i) => wDetail(i))
  const bt = grid.map(syntheticBrightnessK)
  const detail = {
    runId: RUN_ID,
    inputHash: run.inputHash,
    engineVersion: ENGINE_VERSION,
    startCm: DETAIL_WINDOW.startCm,
    endCm: DETAIL_WINDOW.endCm,
    pointCount: DETAIL_POINTS,
    wavenumberCm: grid,
    olrSpectral: column(DETAIL_POINTS, (i) => Math.PI * planckRadianceWavenumber(grid[i], bt[i])),
    surfaceDownSpectral: column(
      DETAIL_POINTS,
      (i) => Math.PI * planckRadianceWavenumber(grid[i], 300 - bt[i] / 4),
    ),
    toaNadirRadiance: column(DETAIL_POINTS, (i) => planckRadianceWavenumber(grid[i], bt[i])),
    toaBrightnessTemperatureK: column(DETAIL_POINTS, (i) => bt[i]),
    surfaceZenithRadiance: column(DETAIL_POINTS, (i) =>
      planckRadianceWavenumber(grid[i], 300 - bt[i] / 4),
    ),
    columnTransmittance: column(DETAIL_POINTS, (i) => Math.max(0, (bt[i] - 200) / 90)),
  }
  const user = {
    id: 1,
    email: 'bench.analyst@example.org',
    displayName: 'Bench Analyst',
    role: 'analyst',
    active: true,
    lastSignInAt: now,
    createdAt: now,
  }
  return {
    run: JSON.stringify({ run }),
    results: JSON.stringify(results),
    detail: JSON.stringify(detail),
    user: JSON.stringify({ user }),
  }
}

// ---- the page server: dist/ and the mock API ----

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.woff': 'font/woff',
  '.json': 'application/json',
}

function startPageServer(api: ReturnType<typeof syntheticApi>): Promise<Server> {
  const routes: Record<string, string> = {
    '/api/auth/me': api.user,
    '/api/auth/csrf': JSON.stringify({ csrfToken: 'bench' }),
    [`/api/runs/${RUN_ID}`]: api.run,
    [`/api/runs/${RUN_ID}/results`]: api.results,
    [`/api/runs/${RUN_ID}/results/detail`]: api.detail,
    [`/api/runs/${RUN_ID}/reviews`]: JSON.stringify({ reviews: [] }),
  }
  const server = createServer((req, res) => {
    const path = new URL(req.url ?? '/', 'http://localhost').pathname
    if (path.startsWith('/api/')) {
      const body = routes[path]
      res.writeHead(body ? 200 : 404, { 'content-type': 'application/json' })
      res.end(
        body ?? JSON.stringify({ error: { code: 'NOT_FOUND', message: 'Not in the bench mock.' } }),
      )
      return
    }
    const file = normalize(join(DIST, path))
    const target =
      file.startsWith(DIST) && existsSync(file) && extname(file) ? file : join(DIST, 'index.html')
    res.writeHead(200, { 'content-type': TYPES[extname(target)] ?? 'application/octet-stream' })
    res.end(readFileSync(target))
  })
  return new Promise((resolve) => server.listen(0, '127.0.0.1', () => resolve(server)))
}

// ---- in the page ----

/**
 * Installed before the app (all times performance.now, ms since navigation): when the binned
 * charts and the window's chart are first on screen (checked every frame, stamped one frame
 * later, i.e. after their paint), long tasks, wheel-to-frame times, re-cut times.
 */
const PAGE_PROBE = `
  window.__bench = { longTasks: [], wheelFrames: [], lastWheelAt: 0, recutPaintedAt: 0, chartsPaintedAt: 0, detailPaintedAt: 0 }
  const watchFirstPaint = () => {
    const b = window.__bench
    const charts = document.querySelectorAll('[data-test=chart-frame] canvas').length
    const detail = Number(document.querySelector(${JSON.stringify('[data-test=run-detail-spectrum] [data-points-drawn]')})?.getAttribute('data-points-drawn') ?? 0)
    if (!b.chartsPaintedAt && charts >= ${BINNED_CHARTS}) requestAnimationFrame(() => (b.chartsPaintedAt = performance.now()))
    if (!b.detailPaintedAt && detail > 0) requestAnimationFrame(() => (b.detailPaintedAt = performance.now()))
    if (!b.detailPaintedAt || !b.chartsPaintedAt) requestAnimationFrame(watchFirstPaint)
  }
  requestAnimationFrame(watchFirstPaint)
  new MutationObserver(() => {
    requestAnimationFrame(() => requestAnimationFrame(() => (window.__bench.recutPaintedAt = performance.now())))
  }).observe(document, { subtree: true, attributes: true, attributeFilter: ['data-zoom-window'] })
  new PerformanceObserver((list) => {
    for (const e of list.getEntries()) window.__bench.longTasks.push({ start: e.startTime, duration: e.duration })
  }).observe({ type: 'longtask', buffered: true })
  window.addEventListener('wheel', () => {
    const at = performance.now()
    window.__bench.lastWheelAt = at
    requestAnimationFrame(() => requestAnimationFrame(() => window.__bench.wheelFrames.push(performance.now() - at)))
  }, { capture: true, passive: true })
`

interface PageNumbers {
  chartsPaintedMs: number
  detailResponseEndMs: number
  detailFirstPaintMs: number
  resultsResponseEndMs: number
  longTasks: { start: number; duration: number }[]
}

const DETAIL_CHART = '[data-test=run-detail-spectrum] [data-points-drawn]'

async function firstRender(page: Page): Promise<PageNumbers> {
  // Page code as text: tsx would wrap named functions in a helper the page does not have.
  await page.waitForFunction('window.__bench.detailPaintedAt > 0', undefined, { timeout: 120_000 })
  return page.evaluate<PageNumbers>(`(async () => {
    const responseEnd = (suffix) =>
      performance.getEntriesByType('resource').find((e) => e.name.endsWith(suffix))?.responseEnd ?? NaN
    return {
      detailResponseEndMs: responseEnd('/results/detail'),
      resultsResponseEndMs: responseEnd('/results'),
      chartsPaintedMs: window.__bench.chartsPaintedAt,
      detailFirstPaintMs: window.__bench.detailPaintedAt,
      longTasks: window.__bench.longTasks.slice(),
    }
  })()`)
}

/** Ctrl + wheel steps over the window's chart, then the wait for the re-cut points. */
interface PageZoomNumbers {
  wheelFramesMs: number[]
  recutMs: number
  pointsDrawn: number
  window: string
}

async function zoomIn(page: Page, steps: number): Promise<PageZoomNumbers> {
  const canvas = page.locator(`${DETAIL_CHART} canvas`).first()
  await canvas.scrollIntoViewIfNeeded()
  const box = await canvas.boundingBox()
  if (!box) throw new Error('the chart has no canvas')
  await page.mouse.move(box.x + box.width * 0.37, box.y + box.height * 0.4)
  await page.evaluate('window.__bench.wheelFrames = []')
  await page.keyboard.down('Control')
  for (let i = 0; i < steps; i++) {
    await page.mouse.wheel(0, -240)
    await page.waitForTimeout(30)
  }
  await page.keyboard.up('Control')
  // Done when the points were re-cut after the last wheel step (a loaded machine may re-cut mid-burst).
  await page.waitForFunction(
    'window.__bench.recutPaintedAt > window.__bench.lastWheelAt',
    undefined,
    {
      timeout: 30_000,
    },
  )
  return page.evaluate<PageZoomNumbers>(`(async () => {
    await new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)))
    const el = document.querySelector(${JSON.stringify(DETAIL_CHART)})
    return {
      wheelFramesMs: window.__bench.wheelFrames.slice(),
      recutMs: window.__bench.recutPaintedAt - window.__bench.lastWheelAt,
      pointsDrawn: Number(el.getAttribute('data-points-drawn')),
      window: el.getAttribute('data-zoom-window') ?? '',
    }
  })()`)
}

const round = (v: number, digits = 1) => Number(v.toFixed(digits))
const median = (v: number[]) => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)] ?? NaN

export async function caseH(options: CaseOptions): Promise<BenchRow[]> {
  const log = options.log
  if (!existsSync(join(DIST, 'index.html'))) {
    log('  G: building the client (npx vite build) …')
    execFileSync('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: ROOT, stdio: 'inherit' })
  }
  const t0 = performance.now()
  const api = syntheticApi()
  log(
    `  G: synthetic data ready in ${((performance.now() - t0) / 1000).toFixed(1)} s (detail JSON ${(api.detail.length / 2 ** 20).toFixed(0)} MiB, results ${(api.results.length / 2 ** 20).toFixed(0)} MiB)`,
  )
  const server = await startPageServer(api)
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
  const browser = await launchBrowser()
  const rows: BenchRow[] = []
  try {
    const repeats = options.quick ? 1 : 3
    for (let r = 0; r < repeats; r++) {
      const page = await browser.context.newPage()
      await page.addInitScript({ content: PAGE_PROBE })
      const cdp = await browser.context.newCDPSession(page)
      await cdp.send('Performance.enable')
      await page.goto(`${base}/runs/${RUN_ID}`)
      const first = await firstRender(page)
      const loadTasks = first.longTasks.map((t) => t.duration)
      const afterDetail = first.longTasks
        .filter((t) => t.start >= first.detailResponseEndMs)
        .map((t) => t.duration)
      const zoom1 = await zoomIn(page, ZOOM_STEPS)
      const zoom2 = await zoomIn(page, ZOOM_STEPS)
      const { metrics } = await cdp.send('Performance.getMetrics')
      const metric = (name: string) => metrics.find((m) => m.name === name)?.value ?? NaN
      const wheels = [...zoom1.wheelFramesMs, ...zoom2.wheelFramesMs]
      log(
        `    load: results at ${first.resultsResponseEndMs.toFixed(0)} ms, charts painted at ${first.chartsPaintedMs.toFixed(0)} ms, detail at ${first.detailResponseEndMs.toFixed(0)} ms, ` +
          `detail chart painted at ${first.detailFirstPaintMs.toFixed(0)} ms (${(first.detailFirstPaintMs - first.detailResponseEndMs).toFixed(0)} ms after its response); ` +
          `longest task ${Math.max(0, ...loadTasks).toFixed(0)} ms`,
      )
      log(
        `    zoom: wheel→frame median ${median(wheels).toFixed(0)} ms, max ${Math.max(...wheels).toFixed(0)} ms; ` +
          `last wheel→re-cut painted ${zoom1.recutMs.toFixed(0)} / ${zoom2.recutMs.toFixed(0)} ms; ` +
          `points drawn ${zoom1.pointsDrawn} (${zoom1.window}) → ${zoom2.pointsDrawn} (${zoom2.window})`,
      )
      rows.push({
        case: 'H',
        label: `run page, ${BINNED_POINTS.toLocaleString('en')} bins + ${DETAIL_POINTS.toLocaleString('en')}-point window (browser)`,
        measurement: {
          wallS: first.detailFirstPaintMs / 1000,
          cpuS: metric('TaskDuration'),
          peakRssMiB: metric('JSHeapUsedSize') / 2 ** 20,
          chunkCount: 0,
          gridPointCount: DETAIL_POINTS,
          lineLayerPairs: 0,
          voigtEvaluations: 0,
          lineLayerPairsPerS: 0,
          gridPointsPerS: 0,
          slowestChunk: { startCm: 0, cpuS: 0 },
        },
        notes: {
          resultsArrivedMs: round(first.resultsResponseEndMs, 0),
          chartsPaintedMs: round(first.chartsPaintedMs, 0),
          chartsClientMs: round(first.chartsPaintedMs - first.resultsResponseEndMs, 0),
          detailArrivedMs: round(first.detailResponseEndMs, 0),
          detailPaintedMs: round(first.detailFirstPaintMs, 0),
          detailClientMs: round(first.detailFirstPaintMs - first.detailResponseEndMs, 0),
          longestTaskMs: round(Math.max(0, ...loadTasks), 0),
          longestTaskAfterDetailMs: round(Math.max(0, ...afterDetail), 0),
          wheelFrameMedianMs: round(median(wheels), 0),
          wheelFrameMaxMs: round(Math.max(...wheels), 0),
          recutMs: round(Math.max(zoom1.recutMs, zoom2.recutMs), 0),
          pointsDrawnZoomed: zoom2.pointsDrawn,
        },
      })
      await page.close()
    }
  } finally {
    await browser.close()
    await new Promise((resolve) => server.close(resolve))
  }
  return rows
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const rows = await caseH({
    quick: process.argv.includes('--quick'),
    catalogue: undefined as never,
    log: (l) => process.stderr.write(l + '\n'),
  })
  process.stdout.write(
    JSON.stringify(
      rows.map((r) => ({
        label: r.label,
        wallS: r.measurement.wallS,
        cpuS: r.measurement.cpuS,
        heapMiB: r.measurement.peakRssMiB,
        ...r.notes,
      })),
      null,
      2,
    ) + '\n',
  )
}
