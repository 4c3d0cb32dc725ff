import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises } from '@vue/test-utils'
import type { AtmosphereLevel } from '@shared/physics/types'
import type { ProfileDetail } from '@shared/schemas/profiles'
import * as api from '@/api/profiles'
import { mountAt } from './mount-helpers'

vi.mock('@/api/profiles', () => ({
  fetchProfile: vi.fn(),
  createProfile: vi.fn(),
  updateProfile: vi.fn(),
  duplicateProfile: vi.fn(),
  previewPreset: vi.fn(),
}))

/** Four plausible levels in SI (Pa, K, m, mol/mol); values invented for the test. */
const LEVELS: AtmosphereLevel[] = [
  { pressurePa: 101325, temperatureK: 288.15, heightM: 0, vmr: { H2O: 0.01, O3: 3e-8 } },
  { pressurePa: 85000, temperatureK: 278, heightM: 1457, vmr: { H2O: 0.006, O3: 3.5e-8 } },
  { pressurePa: 50000, temperatureK: 252, heightM: 5574, vmr: { H2O: 0.001, O3: 6e-8 } },
  { pressurePa: 20000, temperatureK: 216.65, heightM: 11784, vmr: { H2O: 5e-5, O3: 2e-7 } },
]

function detail(ownerId = 7): ProfileDetail {
  return {
    id: 5,
    name: 'Test column',
    description: '',
    source: 'form',
    sourceDetails: {},
    surfaceTemperatureK: 288.15,
    surfaceEmissivity: 1,
    levels: structuredClone(LEVELS),
    derived: {
      levelCount: 4,
      surfacePressurePa: 101325,
      topPressurePa: 20000,
      topHeightM: 11784,
      precipitableWaterCm: 1,
      ozoneColumnDu: 100,
      tropopausePressurePa: 20000,
      tropopauseHeightM: 11784,
      tropopauseMethod: 'fallback-100hPa',
    },
    ownerId,
    ownerName: 'Some One',
    createdAt: '2026-01-01T00:00:00Z',
    updatedAt: '2026-01-01T00:00:00Z',
  }
}

const cell = (name: string) => document.querySelector<HTMLInputElement>(`input[name="${name}"]`)!

async function choose(dataTest: string) {
  const input = document.querySelector<HTMLInputElement>(`[data-test="${dataTest}"] input`)!
  input.checked = true
  input.dispatchEvent(new Event('change', { bubbles: true }))
  await flushPromises()
}

async function type(name: string, text: string) {
  const input = cell(name)
  input.value = text
  input.dispatchEvent(new Event('input', { bubbles: true }))
  input.dispatchEvent(new Event('change', { bubbles: true }))
  await flushPromises()
}

beforeEach(() => {
  vi.mocked(api.fetchProfile).mockResolvedValue(detail())
  vi.mocked(api.updateProfile).mockImplementation(async (_id, input) => ({
    ...detail(),
    ...input,
    warnings: [],
  }))
})
afterEach(() => {
  vi.clearAllMocks()
  document.body.innerHTML = ''
})

// The first mount compiles the editor and naive-ui; slow on a busy machine, not a timing assertion.
describe('the profile editor', { timeout: 30_000 }, () => {
  it('when the units switch to Pa and °C, shows the converted values and saves the same SI levels', async () => {
    const { wrapper } = await mountAt('/profiles/5')
    // hPa = 100 Pa, t/°C = T/K − 273.15 (SI Brochure, 9th ed.)
    expect(cell('pressure-0').value).toBe('1013.25')
    expect(cell('temperature-0').value).toBe('288.15')

    await choose('unit-pressure-Pa')
    await choose('unit-temperature-degC')
    expect(cell('pressure-0').value).toBe('101325')
    expect(cell('pressure-2').value).toBe('50000')
    expect(cell('temperature-0').value).toBe('15')
    expect(cell('temperature-3').value).toBe('-56.5')
    expect(document.querySelector('[data-column="pressure"]')!.textContent).toContain('Pa')

    await wrapper.find('[data-test=save-profile]').trigger('click')
    await flushPromises()
    expect(api.updateProfile).toHaveBeenCalledOnce()
    const [id, input] = vi.mocked(api.updateProfile).mock.calls[0]
    expect(id).toBe(5)
    expect(input.levels).toEqual(LEVELS)
    wrapper.unmount()
  })

  it('when a pressure is typed in the display unit, stores it in Pa', async () => {
    const { wrapper } = await mountAt('/profiles/5')
    await type('pressure-1', '860')
    await wrapper.find('[data-test=save-profile]').trigger('click')
    await flushPromises()
    const [, input] = vi.mocked(api.updateProfile).mock.calls[0]
    expect(input.levels[1].pressurePa).toBe(86000) // 860 hPa × 100 Pa/hPa
    expect(input.levels[0]).toEqual(LEVELS[0])
    wrapper.unmount()
  })

  it('when a level is not lower in pressure than the one below, marks that cell red, lists the message and does not save', async () => {
    const { wrapper } = await mountAt('/profiles/5')
    expect(document.querySelector('[data-test=validation-ok]')).not.toBeNull()

    await type('pressure-2', '900')
    const bad = cell('pressure-2')
    expect(bad.dataset.severity).toBe('error')
    expect(bad.getAttribute('aria-invalid')).toBe('true')
    expect(cell('pressure-1').dataset.severity).toBeUndefined()
    const summary = document.querySelector('[data-test=validation-errors]')!.textContent!
    expect(summary).toContain('1 problem')
    expect(summary).toContain(
      'Level 3: pressure 900 hPa is not lower than the level below (Level 2, 850 hPa)',
    )

    await wrapper.find('[data-test=save-profile]').trigger('click')
    await flushPromises()
    expect(api.updateProfile).not.toHaveBeenCalled()
    expect(document.querySelector('[data-test=save-error]')!.textContent).toMatch(
      /Fix the 1 problem/,
    )
    wrapper.unmount()
  })

  it('when the text typed is not a number, keeps it in the cell marked red and changes nothing', async () => {
    const { wrapper } = await mountAt('/profiles/5')
    await type('temperature-1', 'warm')
    expect(cell('temperature-1').value).toBe('warm')
    expect(cell('temperature-1').dataset.severity).toBe('error')
    await type('temperature-1', '280')
    expect(cell('temperature-1').dataset.severity).toBeUndefined()
    expect(cell('temperature-1').value).toBe('280')
    wrapper.unmount()
  })

  it('when a reviewer opens a profile, shows it read-only without a save button', async () => {
    const { wrapper } = await mountAt('/profiles/5', 'reviewer', 99)
    expect(document.querySelector('[data-test=read-only]')).not.toBeNull()
    expect(document.querySelector('[data-test=save-profile]')).toBeNull()
    expect(cell('pressure-0').readOnly).toBe(true)
    wrapper.unmount()
  })

  it('when the server answers INVALID_LEVELS, marks the named level', async () => {
    const { ApiError } = await import('@/api/http')
    vi.mocked(api.updateProfile).mockRejectedValueOnce(
      new ApiError(
        400,
        'INVALID_LEVELS',
        '1 problem(s) in the levels: Level 4: something the server found.',
        {
          issues: [
            {
              levelIndex: 3,
              field: 'temperatureK',
              value: 216.65,
              code: 'TEMPERATURE_OUT_OF_RANGE',
              expected: 'x',
              message: 'Level 4: something the server found.',
            },
          ],
          warnings: [],
        },
      ),
    )
    const { wrapper } = await mountAt('/profiles/5')
    await wrapper.find('[data-test=save-profile]').trigger('click')
    await flushPromises()
    expect(cell('temperature-3').dataset.severity).toBe('error')
    expect(document.querySelector('[data-test=save-error]')!.textContent).toContain(
      'Level 4: something the server found.',
    )
    wrapper.unmount()
  })
})
