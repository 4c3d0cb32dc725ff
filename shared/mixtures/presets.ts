import type { MixtureInput } from '../schemas/mixtures'

/**
 * Gas-mixture presets: scenarios of our own built on commonly quoted global-mean mole fractions.
 * Pre-industrial (1750) values 278 ppmv CO₂, 729 ppbv CH₄, 270 ppbv N₂O: IPCC AR6 WG1 ch. 2
 * (from memory). Present-day values 420 ppmv, 1920 ppbv, 336 ppbv: global means around 2023
 * (from memory). Water vapour and ozone keep the profile's own amounts unless a preset scales them.
 */
export interface MixturePreset {
  id: string
  title: string
  input: MixtureInput
}

const ppmv = (v: number) => ({ mode: 'uniform' as const, vmr: v * 1e-6 })
const ppbv = (v: number) => ({ mode: 'uniform' as const, vmr: v * 1e-9 })
const own = { mode: 'scale' as const, factor: 1 }

const preIndustrial = { CO2: ppmv(278), CH4: ppbv(729), N2O: ppbv(270), H2O: own, O3: own }
const presentDay = { CO2: ppmv(420), CH4: ppbv(1920), N2O: ppbv(336), H2O: own, O3: own }

export const MIXTURE_PRESETS: MixturePreset[] = [
  {
    id: 'pre-industrial',
    title: 'Pre-industrial (1750)',
    input: { name: 'Pre-industrial', description: 'CO₂ 278 ppmv, CH₄ 729 ppbv, N₂O 270 ppbv; water vapour and ozone from the profile.', gases: preIndustrial },
  },
  {
    id: 'present-day',
    title: 'Present day',
    input: { name: 'Present day', description: 'CO₂ 420 ppmv, CH₄ 1920 ppbv, N₂O 336 ppbv; water vapour and ozone from the profile.', gases: presentDay },
  },
  {
    id: 'doubled-co2',
    title: 'Doubled CO₂',
    input: { name: 'Doubled CO₂', description: 'Twice the pre-industrial CO₂ (556 ppmv), other gases pre-industrial.', gases: { ...preIndustrial, CO2: ppmv(556) } },
  },
  {
    id: 'quadrupled-co2',
    title: 'Quadrupled CO₂',
    input: { name: 'Quadrupled CO₂', description: 'Four times the pre-industrial CO₂ (1112 ppmv), other gases pre-industrial.', gases: { ...preIndustrial, CO2: ppmv(1112) } },
  },
  {
    id: 'no-co2',
    title: 'Without CO₂',
    input: { name: 'Without CO₂', description: 'Present day with all CO₂ removed: shows the whole CO₂ contribution to the greenhouse effect.', gases: { ...presentDay, CO2: ppmv(0) } },
  },
  {
    id: 'dry-column',
    title: 'Dry column',
    input: { name: 'Dry column', description: 'Present day with all water vapour removed.', gases: { ...presentDay, H2O: { mode: 'scale', factor: 0 } } },
  },
  {
    id: 'moister-column',
    title: 'Moister column (+20 % water)',
    input: { name: 'Moister column', description: 'Present day with 20 % more water vapour at every level (check for supersaturation).', gases: { ...presentDay, H2O: { mode: 'scale', factor: 1.2 } } },
  },
]
