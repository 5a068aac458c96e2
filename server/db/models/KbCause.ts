import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { KbVersion } from './KbVersion'

/** A cause of a knowledge-base version (validated by the diagnosis domain before storing). */
export class KbCause extends Model<InferAttributes<KbCause>, InferCreationAttributes<KbCause>> {
  declare id: CreationOptional<number>
  declare versionId: ForeignKey<KbVersion['id']>
  declare slug: string
  declare title: string
  declare short: string | null
  declare description: string
  declare stages: unknown
  declare priors: unknown
  declare lockVersion: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    KbCause.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        slug: { type: DataTypes.STRING(60), allowNull: false },
        title: { type: DataTypes.STRING(200), allowNull: false },
        short: { type: DataTypes.STRING(120), allowNull: true },
        description: { type: DataTypes.TEXT, allowNull: false },
        stages: { type: DataTypes.JSONB, allowNull: false },
        priors: { type: DataTypes.JSONB, allowNull: false },
        lockVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'kb_causes', underscored: true },
    )
  }
}
