import type { UnitDto } from '#shared/types/equipment-dto'
import { Customer, Site, Unit, UnitStage } from '../models'

const STAGE_ORDER = { high: 0, low: 1, single: 2 } as const

type UnitWithParts = Unit & { site: Site & { customer: Customer }; stages: UnitStage[] }

function toDto(unit: UnitWithParts): UnitDto {
  return {
    id: unit.id,
    name: unit.name,
    kind: unit.kind,
    equipmentClass: unit.equipmentClass,
    model: unit.model,
    serial: unit.serial,
    location: unit.location,
    customer: unit.site.customer.name,
    customerId: unit.site.customer.id,
    site: unit.site.name,
    siteId: unit.site.id,
    siteAltitudeM: unit.site.altitudeM,
    design: { cabinetC: unit.designCabinetC, cascadeHxC: unit.designCascadeHxC },
    stages: [...unit.stages]
      .sort((a, b) => STAGE_ORDER[a.stage] - STAGE_ORDER[b.stage])
      .map((s) => ({
        stage: s.stage,
        refrigerant: s.refrigerant,
        chargeG: s.chargeG,
        volumeL: s.volumeL,
        referenceStandingPressureKpa: s.referenceStandingPressureKpa,
        referenceAmbientC: s.referenceAmbientC,
        ratedCurrentA: s.ratedCurrentA,
      })),
  }
}

const include = [
  { model: Site, as: 'site', include: [{ model: Customer, as: 'customer' }] },
  { model: UnitStage, as: 'stages' },
]

/** Every unit of the organisation, by customer then name. */
export async function listUnits(organisationId: number): Promise<UnitDto[]> {
  const units = (await Unit.findAll({ where: { organisationId }, include, order: [['name', 'ASC']] })) as UnitWithParts[]
  return units.map(toDto).sort((a, b) => a.customer.localeCompare(b.customer) || a.name.localeCompare(b.name))
}

/** One unit of the organisation, or null when it does not exist there. */
export async function findUnit(organisationId: number, id: number): Promise<UnitDto | null> {
  const unit = (await Unit.findOne({ where: { id, organisationId }, include })) as UnitWithParts | null
  return unit ? toDto(unit) : null
}
