import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { KbVersion } from './KbVersion'

/** An evidence rule (json-rules-engine JSON, validated with zod before it is stored). */
export class KbRule extends Model<InferAttributes<KbRule>, InferCreationAttributes<KbRule>> {
  declare id: CreationOptional<number>
  declare versionId: ForeignKey<KbVersion['id']>
  declare name: string
  declare subject: string
  declare definition: unknown
  declare lockVersion: CreationOptional<number>
  declare examples: CreationOptional<unknown[]>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    KbRule.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        subject: { type: DataTypes.STRING(80), allowNull: false },
        definition: { type: DataTypes.JSONB, allowNull: false },
        lockVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        examples: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'kb_rules', underscored: true },
    )
  }
}
