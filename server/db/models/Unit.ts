import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { Organisation } from './Organisation'
import type { Site } from './Site'

import type { UnitKind } from '#shared/types/diagnosis'
import type { EquipmentClass } from '#shared/types/equipment'

/** A refrigeration unit at a site: one stage (single-stage) or two (cascade). */
export class Unit extends Model<InferAttributes<Unit>, InferCreationAttributes<Unit>> {
  declare id: CreationOptional<number>
  declare organisationId: ForeignKey<Organisation['id']>
  declare siteId: ForeignKey<Site['id']>
  declare name: string
  declare kind: UnitKind
  declare equipmentClass: EquipmentClass
  declare model: string
  declare serial: string
  declare location: CreationOptional<string>
  declare designCabinetC: number | null
  declare designCascadeHxC: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    Unit.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.STRING(200), allowNull: false },
        kind: { type: DataTypes.STRING(20), allowNull: false },
        equipmentClass: { type: DataTypes.STRING(40), allowNull: false },
        model: { type: DataTypes.STRING(120), allowNull: false },
        serial: { type: DataTypes.STRING(120), allowNull: false },
        location: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        designCabinetC: { type: DataTypes.DOUBLE, allowNull: true },
        designCascadeHxC: { type: DataTypes.DOUBLE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'units', underscored: true },
    )
  }
}
