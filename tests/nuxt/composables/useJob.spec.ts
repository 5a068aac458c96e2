import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { describe, expect, it, vi } from 'vitest'
import { defineComponent, h, watch } from 'vue'
import JobProgress from '~/components/job/JobProgress.vue'
import { useJob } from '~/composables/useJob'

const ID = '0b6f7e4c-3f1a-4c8e-9f43-5b0d2a7e9c11'
let calls = 0
registerEndpoint(`/api/jobs/${ID}`, () => {
  calls++
  const done = calls >= 3
  return {
    id: ID, kind: 'report-email', state: done ? 'done' : 'running', progress: done ? 1 : 0.4, result: done ? { messageId: '<a@b>' } : null, error: null,
    createdAt: '2026-12-02T13:05:00.000Z', updatedAt: '2026-12-02T13:05:01.000Z',
  }
})

describe('useJob', () => {
  it('follows a job until it is done, then stops asking', async () => {
    let api!: ReturnType<typeof useJob>
    const seen: string[] = []
    await mountSuspended(defineComponent({
      setup: () => {
        api = useJob(ID, 20)
        watch(() => api.job.value, (job) => job && seen.push(`${job.state} ${job.progress}`))
        return () => h('div')
      },
    }))
    await vi.waitFor(() => expect(api.finished.value).toBe(true))
    expect(seen).toEqual(['running 0.4', 'running 0.4', 'done 1'])
    expect(api.job.value?.result).toEqual({ messageId: '<a@b>' })
    const after = calls
    await new Promise((r) => setTimeout(r, 120))
    expect(calls).toBe(after)
  })
})

describe('JobProgress', () => {
  it('shows the state in words and the progress as a labelled bar', async () => {
    const job = { id: ID, kind: 'report-email', state: 'running' as const, progress: 0.4, result: null, error: null, createdAt: '', updatedAt: '' }
    const wrapper = await mountSuspended(JobProgress, { props: { job, label: 'Delivery to lab@example.test' } })
    expect(wrapper.text()).toContain('In progress')
    const bar = wrapper.get('[role="progressbar"]')
    expect(bar.attributes('aria-valuenow')).toBe('40')
    expect(bar.attributes('aria-label')).toBe('Delivery to lab@example.test')
  })
})
