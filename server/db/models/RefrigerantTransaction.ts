import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { ServiceCase } from './ServiceCase'
import type { Unit } from './Unit'

/** Refrigerant added to or recovered from one stage of a unit, with the cylinder used. */
export class RefrigerantTransaction extends Model<InferAttributes<RefrigerantTransaction>, InferCreationAttributes<RefrigerantTransaction>> {
  declare id: CreationOptional<number>
  declare organisationId: number
  declare caseId: ForeignKey<ServiceCase['id']> | null
  declare unitId: ForeignKey<Unit['id']>
  declare stage: string
  declare refrigerant: string
  declare grams: number
  declare direction: 'added' | 'recovered'
  declare cylinder: CreationOptional<string>
  declare at: CreationOptional<Date>
  declare cylinderId: CreationOptional<number | null>
  /** Why refrigerant was added (top-up, recharge, initial charge, retrofit, seasonal variance), when said. */
  declare purpose: CreationOptional<string | null>
  declare note: CreationOptional<string>
  declare byUserId: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    RefrigerantTransaction.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        stage: { type: DataTypes.STRING(10), allowNull: false },
        refrigerant: { type: DataTypes.STRING(12), allowNull: false },
        grams: { type: DataTypes.DOUBLE, allowNull: false },
        direction: { type: DataTypes.STRING(10), allowNull: false },
        cylinder: { type: DataTypes.STRING(80), allowNull: false, defaultValue: '' },
        at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        byUserId: { type: DataTypes.INTEGER, allowNull: true },
        cylinderId: { type: DataTypes.INTEGER, allowNull: true },
        purpose: { type: DataTypes.STRING(20), allowNull: true },
        note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'refrigerant_transactions', underscored: true },
    )
  }
}
