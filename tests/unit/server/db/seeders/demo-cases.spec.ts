import { describe, expect, it } from 'vitest'
import type { RankRequest } from '#shared/types/diagnosis'
import { rankDiagnosis } from '#server/domain/diagnosis/rank'
import { deriveFacts } from '#server/domain/diagnosis/facts'
import { DEMO_ORGANISATIONS } from '#server/db/seeders/demo-equipment'
import { casesPerUnit, demoHistoryCounts, historyFor, openCaseFor, type DemoUnit } from '#server/db/seeders/demo-cases'
import { seedKb } from '../../domain/diagnosis/scenario-helpers'

const org = DEMO_ORGANISATIONS[0]!
const units = org.customers
  .flatMap((c) => c.sites.flatMap((site) => site.units.map((u) => ({ customer: c.name, unit: u, altitude: site.altitudeM }))))
  .sort((a, b) => a.customer.localeCompare(b.customer) || a.unit.name.localeCompare(b.unit.name))
const shapes: DemoUnit[] = units.map(({ unit, altitude }) => ({ name: unit.name, kind: unit.kind, equipmentClass: unit.equipmentClass, siteAltitudeM: altitude, design: { cabinetC: unit.designCabinetC, cascadeHxC: unit.designCascadeHxC }, stages: unit.stages }))

function requestFor(unit: DemoUnit, demo: ReturnType<typeof historyFor>[number]): RankRequest {
  return {
    unit: {
      kind: unit.kind,
      stages: unit.stages.map((s) => ({ stage: s.stage, refrigerant: s.refrigerant, ...(s.chargeG ? { chargeG: s.chargeG } : {}), ...(s.volumeL ? { volumeL: s.volumeL } : {}), ...(s.ratedCurrentA ? { ratedCurrentA: s.ratedCurrentA } : {}) })),
      design: { ...(unit.design.cabinetC !== null ? { cabinetC: unit.design.cabinetC } : {}), ...(unit.design.cascadeHxC !== null ? { cascadeHxC: unit.design.cascadeHxC } : {}) },
    },
    site: { altitudeM: unit.siteAltitudeM },
    symptoms: demo.symptoms,
    readings: demo.readings,
    testResults: demo.tests,
  }
}

describe('demo history', () => {
  const history = shapes.flatMap((unit, u) => historyFor(unit, casesPerUnit(shapes.length), u).map((demo) => ({ unit, demo })))

  it('closes every case with the cause it was built from, and the ranking with its diagnosis results agrees', async () => {
    expect(history.length).toBe(casesPerUnit(shapes.length) * shapes.length)
    for (const { unit, demo } of history) {
      const confirmed = demo.close?.confirmedCauses[0]
      const ranked = await rankDiagnosis(seedKb(), requestFor(unit, demo), { equipmentClass: unit.equipmentClass })
      const top = ranked.causes[0]
      expect(`${top?.cause}@${top?.stage}`, `${unit.name}: ${demo.complaint}`).toBe(`${confirmed?.cause}@${confirmed?.stage}`)
    }
  })

  it('has readings the property module can read without contradictions, at each site’s altitude', () => {
    for (const { unit, demo } of history) {
      const r = deriveFacts(requestFor(unit, demo))
      const unexpected = r.warnings.filter((w) => !/reported running, but the compressor draws 0\.0 A|fits R|is not compared with the nameplate charge/.test(w))
      expect(unexpected, `${unit.name}: ${demo.complaint}`).toEqual([])
    }
  })

  it('keeps repair tests in the repair phase', () => {
    const repair = history.flatMap(({ demo }) => demo.tests.filter((t) => t.test === 'nitrogen-pressure-test' || t.test === 'vacuum-decay-test'))
    expect(repair.length).toBeGreaterThan(5)
    expect(repair.every((t) => t.phase === 'repair')).toBe(true)
  })

  it('counts confirmed causes per equipment class in process, marking the ones nothing proved', () => {
    const counts = demoHistoryCounts()
    const all = [...counts.values()].flat()
    expect(all.reduce((a, c) => a + c.count, 0)).toBe(history.length)
    expect(all.some((c) => !c.definitive)).toBe(true)
    expect([...counts.keys()].sort()).toEqual(['cold-room', 'cold-trap', 'freezer', 'process-chiller', 'test-chamber', 'ult-freezer'])
  })

  it('leaves the standing-pressure check still to do in an open case', () => {
    const open = openCaseFor(shapes[1]!, 0)
    expect(open.close).toBeUndefined()
    expect(open.readings.some((r) => r.quantity === 'standingPressure')).toBe(false)
  })
})
