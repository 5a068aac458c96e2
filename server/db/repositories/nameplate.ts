// The nameplate history of units' stages, and the change of a stage's refrigerant and charge that
// each record goes with (one transaction, so the two never disagree).
import { QueryTypes, type Transaction } from 'sequelize'
import type { NameplateRecordDto } from '#shared/types/equipment-dto'
import { ServiceCase } from '../models'

export interface NewNameplateRecord {
  organisationId: number
  unitId: number
  stage: string
  refrigerant: string
  chargeG: number | null
  previousRefrigerant: string
  previousChargeG: number | null
  basis: string
  note: string
  /** The figures given with the refill, kept on its record. */
  standingPressureKpa: number | null
  ambientC: number | null
  /** The stage's reference standing pressure after the refill (null clears it). */
  referenceStandingPressureKpa: number | null
  referenceAmbientC: number | null
  caseId: number | null
  byUserId: number | null
  at: Date
}

/** Sets the stage's refrigerant, charge and reference standing pressure and records the change; returns the record's id. */
export async function insertRefill(r: NewNameplateRecord, transaction: Transaction): Promise<number> {
  const db = ServiceCase.sequelize!
  await db.query(
    `UPDATE unit_stages SET refrigerant = :refrigerant, charge_g = :chargeG,
            reference_standing_pressure_kpa = :referenceStandingPressureKpa, reference_ambient_c = :referenceAmbientC, updated_at = now()
      WHERE unit_id = :unitId AND stage = :stage AND unit_id IN (SELECT id FROM units WHERE organisation_id = :organisationId)`,
    { replacements: { ...r }, transaction },
  )
  const [row] = await db.query<{ id: number }>(
    `INSERT INTO nameplate_records (organisation_id, unit_id, stage, refrigerant, charge_g, previous_refrigerant, previous_charge_g, basis, note,
                                   standing_pressure_kpa, ambient_c, case_id, by_user_id, at)
     VALUES (:organisationId, :unitId, :stage, :refrigerant, :chargeG, :previousRefrigerant, :previousChargeG, :basis, :note,
             :standingPressureKpa, :ambientC, :caseId, :byUserId, :at) RETURNING id`,
    { replacements: { ...r }, transaction, type: QueryTypes.SELECT },
  )
  return row!.id
}

/** A unit's nameplate history, newest first. */
export async function nameplateHistory(organisationId: number, unitId: number): Promise<NameplateRecordDto[]> {
  const rows = await ServiceCase.sequelize!.query<{
    id: number; stage: string; refrigerant: string; charge_g: number | null; previous_refrigerant: string; previous_charge_g: number | null
    basis: string; note: string; standing_pressure_kpa: number | null; ambient_c: number | null; case_id: number | null; by: string | null; at: Date
  }>(
    `SELECT n.id, n.stage, n.refrigerant, n.charge_g, n.previous_refrigerant, n.previous_charge_g, n.basis, n.note, n.standing_pressure_kpa, n.ambient_c,
            n.case_id, u.name AS by, n.at
       FROM nameplate_records n LEFT JOIN users u ON u.id = n.by_user_id
      WHERE n.organisation_id = :organisationId AND n.unit_id = :unitId ORDER BY n.at DESC, n.id DESC`,
    { replacements: { organisationId, unitId }, type: QueryTypes.SELECT },
  )
  return rows.map((r) => ({
    id: r.id, stage: r.stage as NameplateRecordDto['stage'], refrigerant: r.refrigerant, chargeG: r.charge_g, previousRefrigerant: r.previous_refrigerant,
    previousChargeG: r.previous_charge_g, basis: r.basis as NameplateRecordDto['basis'], note: r.note,
    standingPressureKpa: r.standing_pressure_kpa, ambientC: r.ambient_c, caseId: r.case_id, by: r.by, at: new Date(r.at).toISOString(),
  }))
}
