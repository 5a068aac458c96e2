// Seeds the demo's service history: closed cases with readings, test outcomes, rankings, findings
// and refrigerant transactions on every unit, and two open cases, so the product looks lived-in.
// Skips an organisation that already has cases.
import type { QueryInterface, Transaction } from 'sequelize'
import { loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import { rankDiagnosis } from '#server/domain/diagnosis/rank'
import { planClose } from '#server/domain/cases/case-changes'
import { rankingEvents, rankRequestFor, type NewEvent } from '#server/domain/cases/case-record'
import type { CaseReading, CaseTestResult } from '#shared/types/cases'
import type { UnitDto } from '#shared/types/equipment-dto'
import { Organisation, ServiceCase, User } from '../models'
import { appendEvents, insertCase, insertTransactions, saveCase } from '../repositories/case-writes'
import { findUnits } from '../repositories/equipment'
import { findPublishedVersion } from '../repositories/knowledge'
import { historyFor, openCaseFor, type DemoCase } from './demo-cases'
import { CONTENT_DIR } from './20261202030200-import-knowledge-base'

const DAY = 86_400_000
const minutes = (d: Date, m: number) => new Date(d.getTime() + m * 60_000)

async function seedCase(unit: UnitDto, demo: DemoCase, ctx: { organisationId: number; technicianId: number; openedAt: Date; kb: Parameters<typeof rankDiagnosis>[0]; t: Transaction }) {
  const { organisationId, technicianId, openedAt, kb, t } = ctx
  const id = await insertCase(
    { organisationId, unitId: unit.id, technicianId, complaint: demo.complaint, symptoms: demo.symptoms, openedAt },
    [{ type: 'case-opened', payload: { complaint: demo.complaint, unitId: unit.id } }, ...(demo.symptoms.length ? [{ type: 'symptoms-set', payload: { symptoms: demo.symptoms } }] : [])],
    t,
  )
  let at = minutes(openedAt, 12)
  const readings: CaseReading[] = demo.readings.map((r) => ({ ...r, at: at.toISOString(), by: technicianId }))
  const testResults: CaseTestResult[] = []
  const events = (list: NewEvent[], when: Date) => appendEvents(id, technicianId, list, t, when)
  await events(readings.map((r) => ({ type: 'reading-entered', payload: { quantity: r.quantity, stage: r.stage, value: r.value, unit: r.unit } })), at)
  let ranking = await rankDiagnosis(kb, rankRequestFor(unit, { symptoms: demo.symptoms, readings, testResults }))
  await events(rankingEvents(null, ranking), at)
  for (const test of demo.tests) {
    at = minutes(at, 25)
    testResults.push({ ...test, at: at.toISOString(), by: technicianId })
    const next = await rankDiagnosis(kb, rankRequestFor(unit, { symptoms: demo.symptoms, readings, testResults }))
    await events([{ type: 'outcome-recorded', payload: { ...test } }, ...rankingEvents(ranking, next)], at)
    ranking = next
  }
  if (demo.note) await events([{ type: 'note', payload: { text: demo.note } }], minutes(at, 2))
  await saveCase(id, { readings, testResults, ranking, notes: demo.note ?? '' }, t)
  if (!demo.close) return
  const closedAt = minutes(at, 95)
  const closure = planClose(unit, demo.close, technicianId)
  await insertTransactions({ organisationId, caseId: id, unitId: unit.id, byUserId: technicianId, at: closedAt }, closure.refrigerantTransactions, t)
  await events([{ type: 'case-closed', payload: { ...closure } }], closedAt)
  await saveCase(id, { status: 'closed', closure, confirmedCauses: closure.confirmedCauses, closedAt }, t)
  await ServiceCase.update({ updatedAt: closedAt }, { where: { id }, transaction: t, silent: true })
}

export async function up({ context: qi }: { context: QueryInterface }) {
  const source = loadKnowledgeBaseFromDirectory(CONTENT_DIR)
  const now = Date.now()
  for (const org of await Organisation.findAll({ order: [['id', 'ASC']] })) {
    if (await ServiceCase.count({ where: { organisationId: org.id } })) continue
    const version = await findPublishedVersion(org.id)
    if (!version) continue
    const kb = { ...source, version: { id: version.id, label: version.label, status: 'published' as const } }
    const people = await User.findAll({ where: { organisationId: org.id }, order: [['id', 'ASC']] })
    const technicians = people.filter((p) => p.role === 'technician' || p.role === 'engineer')
    if (!technicians.length) continue
    const units = await findUnits(org.id)
    const perUnit = units.length >= 8 ? 4 : 2
    await qi.sequelize.transaction(async (t) => {
      let n = 0
      for (const [u, unit] of units.entries()) {
        for (const [i, demo] of historyFor(unit, perUnit, u).entries()) {
          const openedAt = new Date(now - (540 - i * 120 - u * 11) * DAY + (n % 5) * 3_600_000)
          await seedCase(unit, demo, { organisationId: org.id, technicianId: technicians[n++ % technicians.length]!.id, openedAt, kb, t })
        }
      }
      for (const [i, unit] of units.slice(0, units.length >= 8 ? 2 : 0).reverse().entries()) {
        await seedCase(unit, openCaseFor(unit, i), { organisationId: org.id, technicianId: technicians[0]!.id, openedAt: new Date(now - (i + 1) * 3_600_000), kb, t })
      }
    })
  }
}

export async function down() {
  // The demo history is removed with the database.
}
