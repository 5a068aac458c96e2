import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { Organisation } from './Organisation'

/** A version of an organisation's knowledge base: a draft, or the one published version. */
export class KbVersion extends Model<InferAttributes<KbVersion>, InferCreationAttributes<KbVersion>> {
  declare id: CreationOptional<number>
  declare organisationId: ForeignKey<Organisation['id']>
  declare label: string
  declare status: 'draft' | 'published' | 'retired'
  declare notes: CreationOptional<string>
  declare publishedAt: Date | null
  declare createdBy: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    KbVersion.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        label: { type: DataTypes.STRING(120), allowNull: false },
        status: { type: DataTypes.STRING(12), allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        publishedAt: { type: DataTypes.DATE, allowNull: true },
        createdBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'kb_versions', underscored: true },
    )
  }
}
