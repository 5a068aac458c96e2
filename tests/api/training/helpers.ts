// Shared set-up of the training API tests: a freshly worked and closed case, and people of the
// second organisation in training roles (made by copying its technician's demo password hash).
import pg from 'pg'
import { DEMO, signedIn, type ApiClient } from '../helpers'

/** Signs in a person of the second organisation with `role`, creating them on first use. */
export async function otherOrganisation(role: 'trainer' | 'engineer'): Promise<ApiClient> {
  const email = `${role}@bluefen.demo`
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL })
  await db.connect()
  try {
    await db.query(
      `INSERT INTO users (organisation_id, email, name, role, password_hash, active, created_at, updated_at)
       SELECT organisation_id, $1, $2, $3, password_hash, true, now(), now() FROM users WHERE email = $4
       ON CONFLICT DO NOTHING`,
      [email, `Other ${role}`, role, DEMO.otherTech],
    )
  } finally {
    await db.end()
  }
  return signedIn(email)
}

/** Opens, works and closes a case on a cascade unit whose low stage runs on R170; returns its id. */
export async function workedClosedCase(tech: ApiClient): Promise<number> {
  const units = (await tech.get('/api/units')).body as { id: number; kind: string; stages: { stage: string; refrigerant: string }[] }[]
  const unit = units.find((u) => u.kind === 'cascade' && u.stages.some((s) => s.stage === 'low' && s.refrigerant === 'R170'))!
  const opened = await tech.post('/api/cases', { unitId: unit.id, complaint: 'Cabinet at -40 °C, alarm overnight', symptoms: ['not-cooling'] })
  const id = opened.body.id as number
  await tech.post(`/api/cases/${id}/readings`, {
    readings: [
      { quantity: 'cabinetTemperature', value: -40, unit: 'C' },
      { quantity: 'cascadeHxTemperature', value: -33, unit: 'C' },
      { quantity: 'compressorRunning', stage: 'high', value: true, unit: 'bool' },
      { quantity: 'compressorRunning', stage: 'low', value: true, unit: 'bool' },
    ],
  })
  await tech.post(`/api/cases/${id}/notes`, { text: 'Door gasket checked, fine.' })
  await tech.post(`/api/cases/${id}/test-results`, { test: 'standing-pressure-check', stage: 'low', outcome: 'low' })
  await tech.post(`/api/cases/${id}/readings`, { readings: [{ quantity: 'standingPressure', stage: 'low', value: 1500, unit: 'kPa', phase: 'repair' }] })
  const closed = await tech.post(`/api/cases/${id}/close`, {
    confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }],
    workDone: 'Brazed a cracked flare on the low-stage drier; pressure tested with nitrogen, evacuated, recharged.',
    refrigerantTransactions: [{ stage: 'low', refrigerant: 'R170', grams: 180, direction: 'added', cylinder: 'ETH-0042' }],
  })
  if (closed.status !== 200) throw new Error(`closing failed: ${closed.status} ${JSON.stringify(closed.body)}`)
  return id
}
