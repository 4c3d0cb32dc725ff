// Writes the invented demo soundings of the "Kestrel Bay 2026" campaign into data/demo/.
// Invented numbers with plausible physics: a climatology column, a moist boundary layer with a
// capping inversion, and a seeded random wobble. Deterministic: same files every time.
import { writeFileSync } from 'node:fs'
import { climatologyTemperatureK, getClimatologyPreset } from '../../shared/physics/atmosphere/climatology'
import { dewPointK, vapourPressureFromRelativeHumidityPa } from '../../shared/physics/atmosphere/humidity'
import { hypsometricHeightsM } from '../../shared/physics/atmosphere/hydrostatic'

function seeded(seed: number) {
  let s = seed >>> 0
  return () => {
    s = (s * 1664525 + 1013904223) >>> 0
    return s / 2 ** 32 - 0.5
  }
}

interface Launch {
  file: string
  title: string
  climatology: 'mid-latitude-summer' | 'subarctic-summer' | 'tropical'
  surfaceOffsetK: number
  inversionHpa: number
  surfaceRh: number
  seed: number
  topHpa: number
}

const LAUNCHES: Launch[] = [
  { file: 'kestrel-bay-2026-07-14T1100.csv', title: 'Kestrel Bay 2026, launch 07, 14 July 11:00 local', climatology: 'mid-latitude-summer', surfaceOffsetK: 1.5, inversionHpa: 880, surfaceRh: 0.78, seed: 7, topHpa: 12 },
  { file: 'kestrel-bay-2026-07-15T2300.csv', title: 'Kestrel Bay 2026, launch 12, 15 July 23:00 local', climatology: 'mid-latitude-summer', surfaceOffsetK: -3.5, inversionHpa: 960, surfaceRh: 0.9, seed: 12, topHpa: 15 },
  { file: 'kestrel-bay-2026-07-19T1100.csv', title: 'Kestrel Bay 2026, launch 21, 19 July 11:00 local (dry outflow)', climatology: 'subarctic-summer', surfaceOffsetK: 4, inversionHpa: 820, surfaceRh: 0.45, seed: 21, topHpa: 20 },
]

for (const launch of LAUNCHES) {
  const rand = seeded(launch.seed)
  const params = getClimatologyPreset(launch.climatology).parameters
  const pressures: number[] = []
  for (let p = 1010; p >= launch.topHpa; p *= p > 300 ? 0.965 : 0.92) pressures.push(Math.round(p * 10) / 10)
  const temps = pressures.map((pHpa) => {
    let t = climatologyTemperatureK(pHpa * 100, params) + launch.surfaceOffsetK * Math.max(0, (pHpa - 500) / 510)
    if (Math.abs(pHpa - launch.inversionHpa) < 25) t += 2.5 * (1 - Math.abs(pHpa - launch.inversionHpa) / 25)
    return t + 0.4 * rand()
  })
  const rh = pressures.map((pHpa) => {
    const below = pHpa > launch.inversionHpa
    const base = below ? launch.surfaceRh : launch.surfaceRh * 0.55 * Math.max(0.08, (pHpa / 1010) ** 1.5)
    return Math.min(0.98, Math.max(0.02, base + 0.05 * rand()))
  })
  // Above the tropopause the air is dry: a stratospheric mole fraction of 5 ppmv.
  const vapour = pressures.map((pHpa, i) =>
    pHpa * 100 < params.tropopausePressurePa ? 5e-6 * pHpa * 100 : vapourPressureFromRelativeHumidityPa(rh[i], temps[i], 'water'),
  )
  const waterVmr = vapour.map((e, i) => e / (pressures[i] * 100))
  const heights = hypsometricHeightsM(Float64Array.from(pressures, (p) => p * 100), Float64Array.from(temps), Float64Array.from(waterVmr), 4)
  const lines = [
    `# ${launch.title}`,
    '# Invented demo sounding for Tauline (made-up numbers, not an observation).',
    'PRES,HGHT,TEMP,DWPT,DRCT,SKNT',
    'hPa,m,C,C,deg,knot',
    ...pressures.map((p, i) =>
      [
        p.toFixed(1),
        Math.round(heights[i]),
        (temps[i] - 273.15).toFixed(1),
        (dewPointK(vapour[i]) - 273.15).toFixed(1),
        Math.round((230 + 40 * rand() + i * 2) % 360),
        Math.round(8 + i * 0.6 + 4 * rand()),
      ].join(','),
    ),
  ]
  writeFileSync(`data/demo/${launch.file}`, lines.join('\n') + '\n')
  process.stdout.write(`data/demo/${launch.file}: ${pressures.length} levels\n`)
}
