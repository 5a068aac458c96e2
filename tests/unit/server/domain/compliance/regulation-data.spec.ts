import { readFileSync, readdirSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import {
  F_GAS_REGIMES,
  F_GAS_REGIME_FILES,
  JURISDICTIONS,
  JURISDICTION_FILES,
  RegulationDataError,
  SUBSTANCES,
  fGasRegimeSchema,
  jurisdictionSchema,
  parseDataFile,
} from '#server/domain/compliance/regulation-data'
import { assessLeakRate } from '#server/domain/compliance/leak-rate'
import { findRefrigerant } from '#shared/utils/properties'

const DATA = fileURLToPath(new URL('../../../../../server/domain/compliance/data/', import.meta.url))
const readJson = (path: string) => JSON.parse(readFileSync(`${DATA}${path}`, 'utf8'))

describe('regulation data files', () => {
  it('lists every file of the data folders in the registry, so a dropped-in file is never ignored', () => {
    expect(Object.keys(JURISDICTION_FILES).sort()).toEqual(readdirSync(`${DATA}jurisdictions`).filter((f) => f.endsWith('.json')).sort())
    expect(Object.keys(F_GAS_REGIME_FILES).sort()).toEqual(readdirSync(`${DATA}f-gas`).filter((f) => f.endsWith('.json')).sort())
  })

  it('uses the US leak-rate limits exactly as the file on disk states them (40 CFR 82.157(c)(2))', () => {
    const onDisk = readJson('jurisdictions/us-federal.json')
    const rule = onDisk.leakRateRules.find((r: { id: string }) => r.id === 'epa-82-157-ods')
    // The file says 20 / 30 / 10 %, as 82.157(c)(2)(i)–(iii) do.
    expect(rule.thresholdsPercent).toMatchObject({ 'commercial-refrigeration': 20, 'industrial-process-refrigeration': 30, 'comfort-cooling': 10 })
    for (const [type, limit] of Object.entries(rule.thresholdsPercent) as [never, number][]) {
      const ctx = { jurisdiction: 'us-federal', date: '2026-03-01', designation: 'R22', fullChargeG: 60_000, applianceType: type }
      expect(assessLeakRate(limit, ctx).thresholdPercent).toBe(limit)
      expect(assessLeakRate(limit + 0.01, ctx).exceedsThreshold).toBe(true)
    }
  })

  it('uses the leak-check bands of the F-gas files as they stand on disk', () => {
    for (const id of ['eu-2014', 'eu-2024']) {
      const onDisk = readJson(`f-gas/${id}.json`)
      expect(F_GAS_REGIMES.get(id)!.leakChecks.tonnesBands).toEqual(onDisk.leakChecks.tonnesBands)
      expect(F_GAS_REGIMES.get(id)!.gases).toEqual(onDisk.gases)
    }
  })

  it('accepts a new jurisdiction that only supplies a file, and names the file and field of a broken one', () => {
    const draft = { ...readJson('jurisdictions/us-federal.json'), id: 'us-test' }
    expect(parseDataFile('jurisdictions/us-test.json', jurisdictionSchema, draft).leakRateRules).toHaveLength(4)
    const broken = structuredClone(draft)
    delete broken.leakRateRules[2].thresholdsPercent['comfort-cooling']
    expect(() => parseDataFile('jurisdictions/us-test.json', jurisdictionSchema, broken)).toThrow(RegulationDataError)
    expect(() => parseDataFile('jurisdictions/us-test.json', jurisdictionSchema, broken)).toThrow(/us-test\.json: leakRateRules\.2\.thresholdsPercent\.comfort-cooling/)
    const badSource = { ...readJson('f-gas/eu-2014.json') }
    badSource.leakChecks = { ...badSource.leakChecks, source: 'nowhere' }
    expect(() => parseDataFile('f-gas/eu-2014.json', fGasRegimeSchema, badSource)).toThrow(/unknown source "nowhere"/)
    const badInspection = structuredClone(draft)
    badInspection.leakRateRules[2].leakInspections[0].source = 'hearsay'
    expect(() => parseDataFile('jurisdictions/us-test.json', jurisdictionSchema, badInspection)).toThrow(/leakRateRules\.2\.leakInspections\.0\.source: unknown source "hearsay"/)
  })

  it('has a source with a status for every figure', () => {
    for (const j of JURISDICTIONS.values()) for (const s of Object.values(j.sources)) expect(s.status).toBeTruthy()
    for (const r of F_GAS_REGIMES.values()) for (const s of Object.values(r.sources)) expect(s.status).toBeTruthy()
  })

  // Reg. (EU) 517/2014 Annex IV: the GWP of a mixture is the mass-weighted sum of its components' GWPs.
  it('states blend GWPs that equal the rounded mass-weighted sums of their components', () => {
    for (const regime of F_GAS_REGIMES.values()) {
      for (const [d, gas] of Object.entries(regime.gases)) {
        if (!gas.components) continue
        const sum = gas.components.reduce((acc, c) => acc + (c.massPercent / 100) * regime.gases[c.designation]!.gwp!, 0)
        expect(gas.gwp, `${regime.id} ${d}`).toBe(Math.round(sum))
        expect(gas.components.reduce((a, c) => a + c.massPercent, 0), `${regime.id} ${d} adds up to 100 %`).toBe(100)
      }
    }
    for (const s of SUBSTANCES.substances) {
      if (!s.components) continue
      const byName = new Map(SUBSTANCES.substances.map((x) => [x.designation, x.gwpAR4]))
      expect(s.gwpAR4, s.designation).toBe(Math.round(s.components.reduce((a, c) => a + (c.massPercent / 100) * byName.get(c.designation)!, 0)))
    }
  })

  it('agrees with the refrigerant catalogue the app shows, wherever the catalogue gives an EU value', () => {
    for (const [basis, field] of [['eu-2014', 'gwpEu2014'], ['eu-2024', 'gwpEu2024']] as const) {
      for (const [d, gas] of Object.entries(F_GAS_REGIMES.get(basis)!.gases)) {
        const info = findRefrigerant(d)
        if (!info || info[field] === null || gas.gwp === null) continue
        expect(gas.gwp, `${basis} ${d}`).toBe(info[field])
      }
    }
  })
})
