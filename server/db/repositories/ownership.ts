import { QueryTypes } from 'sequelize'
import { RECORD_TABLES, type RecordTableKind } from '#server/utils/route-rules'
import { User } from '../models'

/** True when the record of `kind` with this id exists in the organisation (one indexed lookup). */
export async function recordInOrganisation(kind: RecordTableKind, id: number | string, organisationId: number): Promise<boolean> {
  const { table } = RECORD_TABLES[kind]
  const rows = await User.sequelize!.query(`SELECT 1 FROM ${table} WHERE id = $1 AND organisation_id = $2`, {
    bind: [id, organisationId], type: QueryTypes.SELECT,
  })
  return rows.length > 0
}
