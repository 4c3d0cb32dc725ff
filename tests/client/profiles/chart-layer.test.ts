import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import ChartFrame from '@/components/charts/ChartFrame.vue'
import ChartLogPressureProfile from '@/components/charts/ChartLogPressureProfile.vue'
import { chartCsvText, csvFileName } from '@/components/charts/chart-csv'
import type { ChartOption } from '@/components/charts/echarts-setup'
import { layerPoints, logPressureRangeHpa, pressureTickLabel } from '@/components/charts/log-pressure-axis'

beforeEach(() => setActivePinia(createPinia()))
afterEach(() => vi.restoreAllMocks())

describe('chart helpers', () => {
  it('draws a layer value at the geometric-mean pressure of its two levels, with gaps for missing values', () => {
    // √(1000 × 100) = 316.2… hPa in Pa; a null becomes NaN, which the chart leaves out.
    const points = layerPoints([100_000, 10_000, 1_000], [1.5, null])
    expect(points[0]).toEqual({ pressurePa: Math.sqrt(100_000 * 10_000), value: 1.5 })
    expect(points[1].pressurePa).toBeCloseTo(Math.sqrt(10_000 * 1_000), 9)
    expect(points[1].value).toBeNaN()
  })

  it('when given a table, writes CSV with the header first and CRLF line ends (RFC 4180)', () => {
    const text = chartCsvText({
      fields: ['pressure (hPa)', 'temperature (K)'],
      rows: [
        [1000, 288.15],
        [500, 252],
      ],
    })
    expect(text).toBe('pressure (hPa),temperature (K)\r\n1000,288.15\r\n500,252')
    expect(csvFileName('Temperature · Tropical, 61 levels')).toBe(
      'temperature-tropical-61-levels.csv',
    )
  })

  it('when pressures span 1013 to 0.1 hPa, ranges the axis from the decade below the top to the surface', () => {
    expect(logPressureRangeHpa([1013.25, 500, 0.1])).toEqual({ minHpa: 0.1, maxHpa: 1013.25 })
    expect(logPressureRangeHpa([1000, 150])).toEqual({ minHpa: 100, maxHpa: 1000 })
    expect(logPressureRangeHpa([])).toBeUndefined()
    expect(pressureTickLabel(1000)).toBe('1000')
    expect(pressureTickLabel(0.01)).toBe('0.01')
  })
})

describe('the log-pressure profile chart', () => {
  const series = [
    {
      name: 'Sounding',
      points: [
        { pressurePa: 100000, value: 288 },
        { pressurePa: 50000, value: NaN },
        { pressurePa: 20000, value: 220 },
      ],
    },
    {
      name: 'Extension',
      points: [
        { pressurePa: 20000, value: 220 },
        { pressurePa: 100, value: 260 },
      ],
      lineStyle: 'dashed' as const,
    },
  ]

  function mountChart() {
    return mount(ChartLogPressureProfile, {
      props: {
        title: 'Temperature',
        quantity: 'Temperature',
        unit: 'K',
        series,
        tropopausePressurePa: 20000,
      },
      global: { stubs: { VChart: true } },
    })
  }

  it('when drawn, inverts a log pressure axis in hPa, names both axes with units and marks the tropopause', () => {
    const option = mountChart().findComponent(ChartFrame).props('option') as ChartOption
    const y = option.yAxis as Record<string, unknown>
    const x = option.xAxis as Record<string, unknown>
    expect(y).toMatchObject({
      type: 'log',
      inverse: true,
      name: 'Pressure (hPa)',
      min: 1,
      max: 1000,
    })
    expect(x).toMatchObject({ name: 'Temperature (K)' })
    const lines = option.series as Array<{
      data: number[][]
      lineStyle: { type: unknown }
      markLine?: { data: Array<{ yAxis: number }> }
    }>
    expect(lines[0].data).toEqual([
      [288, 1000],
      [220, 200],
    ])
    expect(lines[0].markLine!.data[0].yAxis).toBe(200)
    expect(lines[1].lineStyle.type).not.toBe('solid')
  })

  it('when Download is pressed, offers a CSV of exactly the plotted points', async () => {
    let blob: Blob | undefined
    vi.spyOn(URL, 'createObjectURL').mockImplementation((b) => ((blob = b as Blob), 'blob:x'))
    vi.spyOn(URL, 'revokeObjectURL').mockImplementation(() => undefined)
    const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined)
    const wrapper = mountChart()
    await wrapper.find('[data-test=chart-csv]').trigger('click')
    await flushPromises()
    expect(click).toHaveBeenCalledOnce()
    expect(await blob!.text()).toBe(
      'series,pressure (hPa),temperature (K)\r\nSounding,1000,288\r\nSounding,200,220\r\nExtension,200,220\r\nExtension,1,260',
    )
  })
})
