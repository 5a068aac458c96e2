// An invented cascade freezer and a ranking for component tests.
import type { RankResponse } from '#shared/types/diagnosis'
import type { UnitDto } from '#shared/types/equipment-dto'

export const cascadeUnit: UnitDto = {
  id: 7, name: 'Freezer Q-17', kind: 'cascade', equipmentClass: 'ult-freezer', model: 'Icebox 9', serial: 'IB9-0001', location: 'Cell 4',
  customer: 'Harbour Cryo', customerId: 2, site: 'Quay lab', siteId: 3, siteAltitudeM: 0,
  design: { cabinetC: -86, cascadeHxC: -35 },
  stages: [
    { stage: 'high', refrigerant: 'R290', chargeG: 150, volumeL: 6, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: 3.1, designPressureKpa: null },
    { stage: 'low', refrigerant: 'R170', chargeG: 90, volumeL: 7.5, referenceStandingPressureKpa: null, referenceAmbientC: null, ratedCurrentA: 2.4, designPressureKpa: null },
  ],
}

const cause = (c: RankResponse['causes'][number]['cause'], stage: 'high' | 'low' | undefined, probability: number, title: string) => ({
  cause: c, ...(stage ? { stage } : {}), probability, title, prior: 0.1, evidence: [], evidenceAgainst: [],
})

export const ranking: RankResponse = {
  causes: [
    { ...cause('refrigerant-leak', 'low', 0.62, 'Refrigerant leak (undercharge)'), evidence: [{ rule: 'low-standing', text: 'Standing pressure is 60 % of expected.' }] },
    cause('restriction', 'low', 0.18, 'Restriction (filter-drier, strainer or capillary)'),
    cause('condenser-airflow', 'high', 0.12, 'Condenser airflow problem'),
    cause('other', undefined, 0.08, 'Something else'),
  ],
  tests: [
    {
      test: 'standing-pressure-check', stage: 'low', expectedGain: 0.62, minutes: 20, title: 'Standing pressure check', score: 0.03,
      opensSystem: false, hotWork: false, safetyNotes: ['Gauges rated for the stage.'], separates: [{ cause: 'refrigerant-leak', stage: 'low' }, { cause: 'restriction', stage: 'low' }],
      value: 'Settles a leak against a blockage on the low stage.',
    },
  ],
  derived: { low: { saturatedSuctionC: -80.1, superheatK: 12 } },
  warnings: ['Cabinet temperature: not derived (outside the range)'],
  priorNote: 'Starting odds from 12 closed cases of ultra-low freezers.',
  missingReadings: [{ quantity: 'standingPressure', stage: 'low', rulesWaiting: 4 }, { quantity: 'ambientTemperature', rulesWaiting: 2 }],
  knowledgeBaseVersion: { id: 1, label: 'shipped', status: 'published' },
  setAside: [],
}
