import type { MeteringDevice, Stage as StageName, UnitKind } from './diagnosis'
import type { EquipmentClass } from './equipment'

export interface UnitStageDto {
  stage: StageName
  refrigerant: string
  chargeG: number | null
  volumeL: number | null
  referenceStandingPressureKpa: number | null
  referenceAmbientC: number | null
  ratedCurrentA: number | null
  /** Design (maximum allowable) pressure of the stage from its nameplate, kPa absolute. */
  designPressureKpa: number | null
  /** How the stage is fed (capillary tube or expansion valve); null or absent when not recorded. */
  meteringDevice?: MeteringDevice | null
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

/** How a new fill of a stage was planned: one of the substitution bases, or as found on site. */
export const NAMEPLATE_BASES = ['standing-pressure', 'mass', 'liquid-volume', 'as-found'] as const
export type NameplateBasis = (typeof NAMEPLATE_BASES)[number]

/** One change of a stage's refrigerant or charge: before and after, when, by whom, why, in which case. */
export interface NameplateRecordDto {
  id: number
  stage: StageName
  refrigerant: string
  chargeG: number | null
  previousRefrigerant: string
  previousChargeG: number | null
  basis: NameplateBasis
  note: string
  /** Where the new fill stands (absolute kPa) at `ambientC`: the stage's reference from then on; null when none was given. */
  standingPressureKpa: number | null
  ambientC: number | null
  caseId: number | null
  by: string | null
  at: string
}

/** One page of a list; `total` counts every match, not just this page. */
export interface Page<T> {
  items: T[]
  total: number
  page: number
  pageSize: number
}

/** A person at a site who may receive service reports. */
export interface ContactDto {
  id: number
  siteId: number
  name: string
  email: string
  phone: string
  receivesReports: boolean
}

/** A customer's site; `atmosphericPressureKpa` follows from the altitude (null if outside the formula's range). */
export interface SiteDto {
  id: number
  customerId: number
  customer: string
  name: string
  address: string
  altitudeM: number
  atmosphericPressureKpa: number | null
  unitCount: number
  contacts: ContactDto[]
}

export interface CustomerDto {
  id: number
  name: string
  notes: string
  createdAt: string
  unitCount: number
  sites: SiteDto[]
}

/** What a unit page needs to know about one refrigerant to warn the technician. */
export interface RefrigerantSafetyDto {
  designation: string
  name: string
  safetyClass: string
  flammable: boolean
  toxic: boolean
  highPressure: boolean
  cautions: string[]
}
