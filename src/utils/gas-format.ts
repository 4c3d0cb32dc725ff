import { GAS_DISPLAY, type GasSetting } from '@shared/schemas/mixtures'
import type { GasId } from '@shared/physics/types'

/** "420 ppmv", "×1.2 of profile", "per level", or "profile's own" for a missing setting. */
export function describeGasSetting(gas: GasId, setting: GasSetting | undefined): string {
  if (!setting) return 'profile’s own'
  const d = GAS_DISPLAY[gas]
  if (setting.mode === 'uniform') return `${formatAmount(setting.vmr * d.factor)} ${d.unit}`
  if (setting.mode === 'scale') return setting.factor === 1 ? 'profile’s own' : `×${setting.factor} of profile`
  return `per level (${setting.vmr.length})`
}

/** Up to 4 significant digits, no exponent for everyday magnitudes. */
export function formatAmount(value: number): string {
  if (value === 0) return '0'
  if (Math.abs(value) >= 0.01 && Math.abs(value) < 1e6) return Number(value.toPrecision(4)).toString()
  return value.toExponential(3)
}
