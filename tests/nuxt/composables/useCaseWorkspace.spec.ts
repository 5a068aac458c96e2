import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { readBody, setResponseStatus } from 'h3'
import { describe, expect, it, vi } from 'vitest'
import { defineComponent, h } from 'vue'
import { useCaseWorkspace } from '~/composables/useCaseWorkspace'
import { cascadeUnit } from '../fixtures'

const record = (version: number, readings: unknown[] = []) => ({
  id: 41, unitId: cascadeUnit.id, status: 'open', complaint: 'Warm cabinet', symptoms: [], readings, testResults: [], ranking: null, events: [],
  version, technician: 'Ola Tech', openedAt: '2026-12-02T13:05:00.000Z', closedAt: null, notes: '', closure: null, unit: cascadeUnit,
  transactions: [], uploads: [], emails: [],
})

let sentBodies: Record<string, unknown>[] = []
registerEndpoint('/api/cases/41', () => record(3))
registerEndpoint('/api/cases/41/readings', {
  method: 'POST',
  handler: async (event) => {
    const body = (await readBody(event)) as { version?: number; readings: unknown[] }
    sentBodies.push(body)
    if (body.version !== 3) {
      // The API's error body, as the app's error mapper sends it.
      setResponseStatus(event, 409)
      return { statusCode: 409, statusMessage: 'Conflict', message: 'This case was changed by someone else.' }
    }
    return record(4, body.readings)
  },
})

async function workspace() {
  let api!: ReturnType<typeof useCaseWorkspace>
  await mountSuspended(defineComponent({ setup: () => { api = useCaseWorkspace(41); return () => h('div') } }))
  // The record is cached by key across mounts; start each test from the server's copy.
  await api.reload()
  await vi.waitFor(() => expect(api.record.value?.version).toBe(3))
  return api
}

describe('useCaseWorkspace', () => {
  it('sends a change with the version it saw and takes the stored record back', async () => {
    sentBodies = []
    const ws = await workspace()
    const reading = { quantity: 'cabinetTemperature', value: -41, unit: 'C' }
    expect(await ws.send('readings', { readings: [reading] }, 'Cabinet temperature −41 °C')).toBe(true)
    expect(sentBodies[0]).toMatchObject({ version: 3, readings: [reading] })
    expect(ws.record.value?.version).toBe(4)
    expect(ws.state.value).toBe('saved')
  })

  it('explains a change refused because the case moved on, and keeps the old record', async () => {
    const ws = await workspace()
    ws.record.value = { ...ws.record.value!, version: 2 }
    expect(await ws.send('readings', { readings: [] }, 'a reading')).toBe(false)
    expect(ws.state.value).toBe('conflict')
    expect(ws.message.value).toContain('changed by someone else')
    expect(ws.record.value?.version).toBe(2)
  })
})
