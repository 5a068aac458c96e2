import type { Stage as StageName, UnitKind } from './diagnosis'
import type { EquipmentClass } from './equipment'

export interface UnitStageDto {
  stage: StageName
  refrigerant: string
  chargeG: number | null
  volumeL: number | null
  referenceStandingPressureKpa: number | null
  referenceAmbientC: number | null
  ratedCurrentA: number | null
}

/** A unit as `GET /api/units` returns it; `customer` and `site` are names (contract). */
export interface UnitDto {
  id: number
  name: string
  kind: UnitKind
  equipmentClass: EquipmentClass
  model: string
  serial: string
  location: string
  customer: string
  customerId: number
  site: string
  siteId: number
  siteAltitudeM: number
  design: { cabinetC: number | null; cascadeHxC: number | null }
  stages: UnitStageDto[]
}
