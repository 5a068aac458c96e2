import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { KbVersion } from './KbVersion'

/** A diagnostic test of a knowledge-base version, with its outcomes and their likelihoods. */
export class KbTest extends Model<InferAttributes<KbTest>, InferCreationAttributes<KbTest>> {
  declare id: CreationOptional<number>
  declare versionId: ForeignKey<KbVersion['id']>
  declare slug: string
  declare title: string
  declare procedure: string
  declare minutes: number
  declare opensSystem: boolean
  declare hotWork: boolean
  declare stages: unknown
  declare answeredBy: string | null
  declare meteringDevices: unknown
  declare sameMeasurementAs: unknown
  declare safetyNotes: unknown
  declare outcomes: unknown
  declare lockVersion: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    KbTest.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        slug: { type: DataTypes.STRING(60), allowNull: false },
        title: { type: DataTypes.STRING(200), allowNull: false },
        procedure: { type: DataTypes.TEXT, allowNull: false },
        minutes: { type: DataTypes.DOUBLE, allowNull: false },
        opensSystem: { type: DataTypes.BOOLEAN, allowNull: false },
        hotWork: { type: DataTypes.BOOLEAN, allowNull: false },
        stages: { type: DataTypes.JSONB, allowNull: false },
        answeredBy: { type: DataTypes.STRING(40), allowNull: true },
        meteringDevices: { type: DataTypes.JSONB, allowNull: true },
        sameMeasurementAs: { type: DataTypes.JSONB, allowNull: true },
        safetyNotes: { type: DataTypes.JSONB, allowNull: false },
        outcomes: { type: DataTypes.JSONB, allowNull: false },
        lockVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'kb_tests', underscored: true },
    )
  }
}
