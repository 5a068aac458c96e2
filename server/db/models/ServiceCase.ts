import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { Organisation } from './Organisation'
import type { Unit } from './Unit'

/** A service case on one unit: what was seen, measured, tested, concluded and done. */
export class ServiceCase extends Model<InferAttributes<ServiceCase>, InferCreationAttributes<ServiceCase>> {
  declare id: CreationOptional<number>
  declare organisationId: ForeignKey<Organisation['id']>
  declare unitId: ForeignKey<Unit['id']>
  declare technicianId: number | null
  declare status: CreationOptional<'open' | 'closed'>
  declare complaint: string
  declare symptoms: CreationOptional<string[]>
  declare readings: CreationOptional<unknown[]>
  declare testResults: CreationOptional<unknown[]>
  declare steps: CreationOptional<unknown[]>
  declare reportPhotoIds: CreationOptional<number[]>
  declare notes: CreationOptional<string>
  declare ranking: unknown | null
  declare closure: unknown | null
  declare confirmedCauses: CreationOptional<{ cause: string; stage?: string }[]>
  declare lockVersion: CreationOptional<number>
  declare openedAt: CreationOptional<Date>
  declare closedAt: Date | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    ServiceCase.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        technicianId: { type: DataTypes.INTEGER, allowNull: true },
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'open' },
        complaint: { type: DataTypes.TEXT, allowNull: false },
        symptoms: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        readings: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        testResults: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        steps: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        reportPhotoIds: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        ranking: { type: DataTypes.JSONB, allowNull: true },
        closure: { type: DataTypes.JSONB, allowNull: true },
        confirmedCauses: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        lockVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        openedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        closedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'cases', underscored: true },
    )
  }
}
