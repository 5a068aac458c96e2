// Outages on purpose, on a stack of its own: the server killed outright in the middle of 100
// concurrent changes to one case keeps every change it acknowledged and no half of any; PostgreSQL
// stopped (or killed and started again by the watcher `npm start` uses) under the running app makes
// the health probe say so, and the app recovers by itself once the database is back.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
// @ts-expect-error: plain JavaScript shared with `npm start`
import { watchCluster } from '../../../scripts/lib/postgres.mjs'
import type { AppProcess } from '../app-process'
import { DEMO, signedIn, type ApiClient } from '../helpers'
import { openCase } from '../uploads/fixtures'
import { appOn, killHard, ownDatabase, type OwnDatabase } from './stack'

let db: OwnDatabase
let app: AppProcess | undefined

beforeAll(async () => {
  db = await ownDatabase()
  app = await appOn(db)
}, 120_000)
afterAll(async () => {
  await app?.stop()
  db?.stop()
})

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms))

async function healthOf(baseUrl: string): Promise<{ status: number; body: unknown }> {
  const res = await fetch(`${baseUrl}/api/health`)
  return { status: res.status, body: await res.json() }
}

/** Polls the health probe until it answers `status`; returns how long that took. */
async function waitForHealth(baseUrl: string, status: number, timeoutMs: number): Promise<number> {
  const started = Date.now()
  while (Date.now() - started < timeoutMs) {
    try {
      if ((await healthOf(baseUrl)).status === status) return Date.now() - started
    } catch {
      // not answering at all
    }
    await sleep(200)
  }
  throw new Error(`health did not answer ${status} within ${timeoutMs} ms`)
}

/** A timeline event; a note's text is among its fields. */
interface NoteEvent {
  type: string
  text?: string
}

describe('the server killed during 100 concurrent updates of one case', () => {
  it('keeps every acknowledged note after a restart, and nothing half-written', async () => {
    const tech = await signedIn(DEMO.tech, undefined, app!.baseUrl)
    const { id: caseId } = await openCase(tech, 'Cabinet warming overnight; many hands on one case')
    const opened = (await tech.get(`/api/cases/${caseId}`)).body
    const run = `crash-${Date.now()}`
    const markers = Array.from({ length: 100 }, (_, i) => `${run}-note-${String(i).padStart(3, '0')}`)

    let acknowledged = 0
    let killed: Promise<void> | undefined
    const outcomes = await Promise.all(markers.map(async (marker) => {
      try {
        const res = await tech.post(`/api/cases/${caseId}/notes`, { text: `Checked gasket ${marker}` })
        if (res.status === 200) {
          // The kill comes once a fifth of the changes are acknowledged, with the rest in flight.
          if (++acknowledged === 20) killed = killHard(app!)
          return { marker, acked: true, status: res.status }
        }
        return { marker, acked: false, status: res.status }
      } catch {
        return { marker, acked: false, status: 0 }
      }
    }))
    await killed
    const acked = outcomes.filter((o) => o.acked).map((o) => o.marker)
    expect(killed, 'the server was killed mid-run').toBeDefined()
    expect(acked.length).toBeGreaterThanOrEqual(20)
    expect(acked.length, 'some changes were still in flight when it died').toBeLessThan(100)
    // Before the kill, a change is acknowledged (200) or refused as too contended (409, to enter
    // again); anything else (a 500) is a fault of its own.
    expect(outcomes.filter((o) => ![0, 200, 409].includes(o.status))).toEqual([])
    const refused = outcomes.filter((o) => o.status === 409).map((o) => o.marker)

    console.log(`server killed: ${acked.length} notes acknowledged, ${refused.length} refused (409), ${100 - acked.length - refused.length} cut off`)
    app = await appOn(db)
    const reader: ApiClient = await signedIn(DEMO.tech, undefined, app.baseUrl)
    const record = (await reader.get(`/api/cases/${caseId}`)).body
    const noteEvents = (record.events as NoteEvent[]).filter((e) => e.type === 'note')
    const inEvents = noteEvents.map((e) => /crash-\d+-note-\d{3}/.exec(e.text ?? '')?.[0])
    const inNotes = [...(record.notes as string).matchAll(/crash-\d+-note-\d{3}/g)].map((m) => m[0])

    // Every acknowledged change is there, once.
    for (const marker of acked) {
      expect(inEvents.filter((m) => m === marker), marker).toHaveLength(1)
      expect(inNotes.filter((m) => m === marker), marker).toHaveLength(1)
    }
    // A refused change left nothing.
    for (const marker of refused) expect(inEvents.includes(marker) || inNotes.includes(marker), marker).toBe(false)
    // Nothing half-written: each change is in the notes and on the timeline, or in neither; no
    // marker twice; the version went up once per change.
    expect(new Set(inEvents).size).toBe(inEvents.length)
    expect([...inEvents].sort()).toEqual([...inNotes].sort())
    expect(record.version).toBe(opened.version + noteEvents.length)
    expect(record.events.length).toBe(opened.events.length + noteEvents.length)
    // And the case takes changes again.
    const next = await reader.post(`/api/cases/${caseId}/notes`, { text: 'After the restart' })
    expect(next.status).toBe(200)
    expect(next.body.version).toBe(record.version + 1)
  }, 120_000)
})

describe('PostgreSQL restarted under the running app', () => {
  it('health answers 503 while it is down and 200 after; requests succeed again', async () => {
    const tech = await signedIn(DEMO.tech, undefined, app!.baseUrl)
    const { id: caseId } = await openCase(tech, 'Compressor short-cycling; database maintenance tonight')
    expect((await healthOf(app!.baseUrl)).status).toBe(200)

    db.cluster.stop()
    const down = await healthOf(app!.baseUrl)
    expect(down).toEqual({ status: 503, body: { status: 'unavailable', reason: 'database unreachable', db: false } })
    const read = await tech.get(`/api/cases/${caseId}`)
    expect(read.status).toBe(503)
    expect(read.headers.get('retry-after')).toBe('5')
    const write = await tech.post(`/api/cases/${caseId}/notes`, { text: 'Sent while the database was down' })
    expect(write.status).toBe(503)

    db.cluster.start()
    await waitForHealth(app!.baseUrl, 200, 30_000)
    const after = await tech.post(`/api/cases/${caseId}/notes`, { text: 'Sent after the database came back' })
    expect(after.status).toBe(200)
    const texts = (after.body.events as NoteEvent[]).filter((e) => e.type === 'note').map((e) => e.text)
    expect(texts).toEqual(['Sent after the database came back'])
  }, 90_000)

  it('is started again by the watcher when it is killed, and the app recovers', async () => {
    const tech = await signedIn(DEMO.tech, undefined, app!.baseUrl)
    const { id: caseId } = await openCase(tech, 'Evaporator iced; database server killed')
    const restarts: string[] = []
    const unwatch = watchCluster(db.cluster, { intervalMs: 500, log: (m: string) => restarts.push(m) })
    try {
      const pid = db.cluster.pid()
      expect(pid).toBeGreaterThan(0)
      process.kill(pid!, 'SIGKILL')
      // Started again by the watcher (once the killed server's processes are gone); the app's
      // pool reconnects by itself.
      const until = Date.now() + 45_000
      while (!restarts.some((m) => /running again/.test(m)) && Date.now() < until) await sleep(200)
      await waitForHealth(app!.baseUrl, 200, 30_000)
      expect(db.cluster.pid()).not.toBe(pid)
      expect(restarts.some((m) => /not running; starting it again/.test(m))).toBe(true)
      expect(restarts.some((m) => /running again/.test(m))).toBe(true)
      const note = await tech.post(`/api/cases/${caseId}/notes`, { text: 'Written after the kill' })
      expect(note.status).toBe(200)
    } finally {
      unwatch()
    }
  }, 90_000)
})
