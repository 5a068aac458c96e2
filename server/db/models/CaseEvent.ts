import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { ServiceCase } from './ServiceCase'

/** One append-only step of a case's timeline (the database refuses updates and deletes). */
export class CaseEvent extends Model<InferAttributes<CaseEvent>, InferCreationAttributes<CaseEvent>> {
  declare id: CreationOptional<number>
  declare caseId: ForeignKey<ServiceCase['id']>
  declare at: CreationOptional<Date>
  declare type: string
  declare byUserId: number | null
  declare payload: CreationOptional<Record<string, unknown>>

  static initModel(sequelize: Sequelize) {
    CaseEvent.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        type: { type: DataTypes.STRING(40), allowNull: false },
        byUserId: { type: DataTypes.INTEGER, allowNull: true },
        payload: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      },
      { sequelize, tableName: 'case_events', underscored: true, timestamps: false },
    )
  }
}
