import { Op, UniqueConstraintError, col, fn, where as sqlWhere, type Order, type Transaction, type WhereOptions } from 'sequelize'
import { FieldConflictError, NotFoundError } from '#server/domain/errors'
import type { UnitInput, UnitRegisterQuery, UnitStageInput } from '#shared/schemas/equipment'
import type { UnitDto } from '#shared/types/equipment-dto'
import { designationsMatching } from '#shared/utils/properties'
import { Customer, Site, Unit, UnitStage } from '../models'
import { containsPattern, requireSite } from './customers'

const STAGE_ORDER = { high: 0, low: 1, single: 2 } as const

type UnitWithSite = Unit & { site: Site & { customer: Customer } }
type UnitWithParts = UnitWithSite & { stages: UnitStage[] }

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
        designPressureKpa: s.designPressureKpa ?? null,
        meteringDevice: s.meteringDevice ?? null,
      })),
  }
}

const include = [
  { model: Site, as: 'site', include: [{ model: Customer, as: 'customer' }] },
  { model: UnitStage, as: 'stages' },
]

/** Every unit of the organisation, by customer then name. */
export async function findUnits(organisationId: number): Promise<UnitDto[]> {
  const units = (await Unit.findAll({ where: { organisationId }, include, order: [['name', 'ASC']] })) as UnitWithParts[]
  return units.map(toDto).sort((a, b) => a.customer.localeCompare(b.customer) || a.name.localeCompare(b.name))
}

/** One unit of the organisation, or null when it does not exist there. */
export async function findUnit(organisationId: number, id: number): Promise<UnitDto | null> {
  const unit = (await Unit.findOne({ where: { id, organisationId }, include })) as UnitWithParts | null
  return unit ? toDto(unit) : null
}

const SERIAL_TAKEN = 'This serial number is already on your register'

function registerOrder(sort: UnitRegisterQuery['sort'], direction: UnitRegisterQuery['direction']): Order {
  const dir = direction.toUpperCase()
  const site = { model: Site, as: 'site' }
  const customer = { model: Customer, as: 'customer' }
  // Ties fall back to the unit name and id so that a page boundary never splits or repeats a row.
  const columns: Record<UnitRegisterQuery['sort'], Order> = {
    name: [['name', dir], ['id', dir]],
    customer: [[site, customer, 'name', dir], [site, 'name', dir], ['name', 'ASC'], ['id', 'ASC']],
    kind: [['kind', dir], ['name', 'ASC'], ['id', 'ASC']],
    serial: [['serial', dir], ['id', dir]],
  }
  return columns[sort]
}

function registerWhere(organisationId: number, f: UnitRegisterQuery): WhereOptions {
  const where: WhereOptions[] = [{ organisationId }]
  if (f.kind) where.push({ kind: f.kind })
  if (f.customerId) where.push({ '$site.customer_id$': f.customerId })
  if (f.q) {
    const like = { [Op.iLike]: containsPattern(f.q) }
    // A refrigerant is found by its designation or by its name ("ethylene" finds the R1150 stages).
    const named = designationsMatching(f.q).map((d) => Unit.sequelize!.escape(d))
    const byName = named.length ? ` OR refrigerant IN (${named.join(', ')})` : ''
    const byRefrigerant = `(SELECT unit_id FROM unit_stages WHERE refrigerant ILIKE ${Unit.sequelize!.escape(containsPattern(f.q))}${byName})`
    where.push({
      [Op.or]: [
        { name: like }, { model: like }, { serial: like }, { location: like },
        { '$site.name$': like }, { '$site.customer.name$': like }, { id: { [Op.in]: Unit.sequelize!.literal(byRefrigerant) } },
      ],
    })
  }
  return { [Op.and]: where }
}

/** One page of the organisation's register: search over names, serials, places and refrigerants, sorted server-side. */
export async function findUnitPage(organisationId: number, f: UnitRegisterQuery): Promise<{ items: UnitDto[]; total: number }> {
  const { rows, count } = await Unit.findAndCountAll({
    where: registerWhere(organisationId, f),
    include: [{ model: Site, as: 'site', required: true, include: [{ model: Customer, as: 'customer', required: true }] }],
    order: registerOrder(f.sort, f.direction),
    limit: f.pageSize,
    offset: (f.page - 1) * f.pageSize,
  })
  // Stages are loaded separately: a hasMany include would make LIMIT count stage rows instead of units.
  const stages = rows.length ? await UnitStage.findAll({ where: { unitId: rows.map((u) => u.id) } }) : []
  const items = (rows as UnitWithSite[]).map((u) => {
    const withStages = u as UnitWithParts
    withStages.stages = stages.filter((s) => s.unitId === u.id)
    return toDto(withStages)
  })
  return { items, total: count }
}

async function assertSerialFree(organisationId: number, serial: string, exceptId: number | null, transaction: Transaction) {
  // Case-insensitive, because "dv5-19-3381" and "DV5-19-3381" on two units would be one machine.
  const clash = await Unit.findOne({
    where: {
      [Op.and]: [
        { organisationId },
        sqlWhere(fn('lower', col('serial')), serial.toLowerCase()),
        ...(exceptId ? [{ id: { [Op.ne]: exceptId } }] : []),
      ],
    },
    transaction,
  })
  if (clash) throw new FieldConflictError(SERIAL_TAKEN, 'serial')
}

function unitColumns(input: UnitInput) {
  return {
    siteId: input.siteId, name: input.name, kind: input.kind, equipmentClass: input.equipmentClass, model: input.model,
    serial: input.serial, location: input.location ?? '', designCabinetC: input.designCabinetC ?? null,
    designCascadeHxC: input.kind === 'cascade' ? input.designCascadeHxC ?? null : null,
  }
}

function stageRows(unitId: number, stages: UnitStageInput[]) {
  return stages.map((s) => ({
    unitId, stage: s.stage, refrigerant: s.refrigerant, chargeG: s.chargeG ?? null, volumeL: s.volumeL ?? null,
    referenceStandingPressureKpa: s.referenceStandingPressureKpa ?? null, referenceAmbientC: s.referenceAmbientC ?? null,
    ratedCurrentA: s.ratedCurrentA ?? null,
    designPressureKpa: s.designPressureKpa ?? null,
    meteringDevice: s.meteringDevice ?? null,
  }))
}

function serialRace(error: unknown): never {
  // Two saves of the same serial at once: the unique index decides, and the loser hears why.
  if (error instanceof UniqueConstraintError) throw new FieldConflictError(SERIAL_TAKEN, 'serial')
  throw error
}

/** Adds a unit with its stages in one transaction; returns the new id. */
export async function insertUnit(organisationId: number, input: UnitInput): Promise<number> {
  return Unit.sequelize!.transaction(async (transaction) => {
    await requireSite(organisationId, input.siteId, 'siteId', transaction)
    await assertSerialFree(organisationId, input.serial, null, transaction)
    const unit = await Unit.create({ organisationId, ...unitColumns(input) }, { transaction })
    await UnitStage.bulkCreate(stageRows(unit.id, input.stages), { transaction })
    return unit.id
  }).catch(serialRace)
}

/** Replaces a unit's fields and stages in one transaction (NotFoundError when not the organisation's). */
export async function saveUnit(organisationId: number, id: number, input: UnitInput): Promise<void> {
  await Unit.sequelize!.transaction(async (transaction) => {
    const unit = await Unit.findOne({ where: { id, organisationId }, transaction, lock: transaction.LOCK.UPDATE })
    if (!unit) throw new NotFoundError('Unit not found')
    await requireSite(organisationId, input.siteId, 'siteId', transaction)
    await assertSerialFree(organisationId, input.serial, id, transaction)
    await unit.update(unitColumns(input), { transaction })
    await UnitStage.destroy({ where: { unitId: id }, transaction })
    await UnitStage.bulkCreate(stageRows(id, input.stages), { transaction })
  }).catch(serialRace)
}
