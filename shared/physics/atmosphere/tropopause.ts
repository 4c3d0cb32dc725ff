/**
 * Lapse-rate tropopause of a profile.
 *
 * Method (WMO 1957 definition): the lowest level at which the lapse rate −dT/dz falls to 2 K/km or
 * less, provided the average lapse rate between that level and every higher level within 2 km does
 * not exceed 2 K/km. Levels above `maxPressurePa`-bounded search range only (default: between
 * 500 hPa and 50 hPa), so a surface inversion or the stratopause is never chosen.
 * Notes: returns the level index; when no level qualifies (e.g. an isothermal test column), returns
 * the level nearest to 100 hPa so forcing at "the tropopause" stays defined, and says so.
 * Source: WMO 1957, "Meteorology—A three-dimensional science", WMO Bulletin 6, 134–138 (from memory).
 */
import type { AtmosphereProfile } from '../types'

export interface TropopauseResult {
  levelIndex: number
  pressurePa: number
  heightM: number
  /** 'lapse-rate' when the WMO criterion found it, 'fallback-100hPa' otherwise. */
  method: 'lapse-rate' | 'fallback-100hPa'
}

const CRITICAL_LAPSE_K_PER_M = 2e-3
const CHECK_DEPTH_M = 2000

export function findTropopause(
  profile: AtmosphereProfile,
  searchPressurePa: { bottom: number; top: number } = { bottom: 50_000, top: 5_000 },
): TropopauseResult {
  const levels = profile.levels
  const lapse = (a: number, b: number) =>
    -(levels[b].temperatureK - levels[a].temperatureK) / (levels[b].heightM - levels[a].heightM)
  for (let i = 0; i < levels.length - 1; i++) {
    const p = levels[i].pressurePa
    if (p > searchPressurePa.bottom || p < searchPressurePa.top) continue
    if (!(levels[i + 1].heightM > levels[i].heightM)) continue
    if (lapse(i, i + 1) > CRITICAL_LAPSE_K_PER_M) continue
    let ok = true
    for (let j = i + 1; j < levels.length && levels[j].heightM - levels[i].heightM <= CHECK_DEPTH_M; j++) {
      if (lapse(i, j) > CRITICAL_LAPSE_K_PER_M) {
        ok = false
        break
      }
    }
    if (ok) {
      return { levelIndex: i, pressurePa: p, heightM: levels[i].heightM, method: 'lapse-rate' }
    }
  }
  let best = 0
  for (let i = 1; i < levels.length; i++) {
    if (Math.abs(Math.log(levels[i].pressurePa / 1e4)) < Math.abs(Math.log(levels[best].pressurePa / 1e4))) best = i
  }
  return {
    levelIndex: best,
    pressurePa: levels[best].pressurePa,
    heightM: levels[best].heightM,
    method: 'fallback-100hPa',
  }
}
