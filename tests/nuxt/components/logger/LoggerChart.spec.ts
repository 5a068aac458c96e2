import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it, vi } from 'vitest'
import { defineComponent, h } from 'vue'
import LoggerChart from '~/components/logger/LoggerChart.vue'
import JobProgress from '~/components/job/JobProgress.vue'
import { analysis } from './logger-fixtures'

// The canvas itself is chart.js's to draw (happy-dom has no canvas): the wrapper is checked on what
// it hands over, the series, the setpoint line, the axes and the accessible name.
vi.mock('vue-chartjs', () => ({
  Line: defineComponent({
    props: { data: { type: Object, required: true }, options: { type: Object, required: true } },
    setup: (props, { attrs }) => () => h('canvas', { ...attrs, 'data-chart': JSON.stringify({ data: props.data, options: props.options }) }),
  }),
}))

describe('LoggerChart', () => {
  it('draws each temperature series and the setpoint as a dashed line across the log, with a named image role', async () => {
    const wrapper = await mountSuspended(LoggerChart, { props: { analysis, label: 'Chart of Cabinet, Ambient over 1 h 50 min' } })
    const canvas = wrapper.get('canvas')
    expect(canvas.attributes('role')).toBe('img')
    expect(canvas.attributes('aria-label')).toBe('Chart of Cabinet, Ambient over 1 h 50 min')
    const { data, options } = JSON.parse(canvas.attributes('data-chart')!)
    expect(data.datasets.map((d: { label: string }) => d.label)).toEqual(['Cabinet (°C)', 'Ambient (°C)', 'Setpoint'])
    expect(data.datasets[0].data).toHaveLength(12)
    expect(data.datasets[0].data[3]).toEqual({ x: analysis.series[0]!.points[3]!.t, y: -10 })
    const setpoint = data.datasets[2]
    expect(setpoint.borderDash).toEqual([8, 4])
    expect(setpoint.data).toEqual([{ x: analysis.span!.startAt, y: -80 }, { x: analysis.span!.endAt, y: -80 }])
    expect(options.scales.x.title.text).toBe('Time (UTC)')
    expect(options.scales.y.title.text).toBe('Temperature (°C)')
  })

  it('leaves the setpoint out when none is known and labels elapsed time as such', async () => {
    const wrapper = await mountSuspended(LoggerChart, { props: { analysis: { ...analysis, setpointC: null, timeBase: 'elapsed' }, label: 'Chart' } })
    const { data, options } = JSON.parse(wrapper.get('canvas').attributes('data-chart')!)
    expect(data.datasets.map((d: { label: string }) => d.label)).toEqual(['Cabinet (°C)', 'Ambient (°C)'])
    expect(options.scales.x.title.text).toBe('Time since the start')
  })
})

describe('JobProgress of a logger analysis', () => {
  const job = { id: 'a1b2', kind: 'logger-analysis', result: null, createdAt: '', updatedAt: '' }

  it('shows the share done as a labelled bar', async () => {
    const wrapper = await mountSuspended(JobProgress, { props: { job: { ...job, state: 'running', progress: 0.734, error: null }, label: 'Analysing bare-log.csv' } })
    const bar = wrapper.get('[role="progressbar"]')
    expect(bar.attributes('aria-valuenow')).toBe('73')
    expect(bar.attributes('aria-label')).toBe('Analysing bare-log.csv')
  })

  it('says what went wrong when the analysis failed', async () => {
    const wrapper = await mountSuspended(JobProgress, { props: { job: { ...job, state: 'failed', progress: 0.2, error: 'Row 14, column "time": not a time' }, label: 'Analysing' } })
    expect(wrapper.text()).toContain('Row 14, column "time": not a time')
  })

  it('waits in words before the job has started', async () => {
    const wrapper = await mountSuspended(JobProgress, { props: { job: null, label: 'Analysing' } })
    expect(wrapper.text()).toContain('Waiting to start')
    expect(wrapper.get('[role="progressbar"]').attributes('aria-valuenow')).toBe('0')
  })
})
