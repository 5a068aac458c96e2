import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { Organisation } from './Organisation'

/** A version of an organisation's knowledge base: a draft, one in review, the one published version, or a retired one. */
export class KbVersion extends Model<InferAttributes<KbVersion>, InferCreationAttributes<KbVersion>> {
  declare id: CreationOptional<number>
  declare organisationId: ForeignKey<Organisation['id']>
  declare label: string
  declare status: 'draft' | 'in-review' | 'published' | 'retired'
  declare notes: CreationOptional<string>
  declare publishedAt: Date | null
  declare createdBy: number | null
  /** Moves on with every change of the version's content or status, for caches of a draft. */
  declare revision: CreationOptional<number>
  declare basedOnId: CreationOptional<number | null>
  declare submittedBy: CreationOptional<number | null>
  declare submittedAt: CreationOptional<Date | null>
  declare reviewedBy: CreationOptional<number | null>
  declare reviewedAt: CreationOptional<Date | null>
  declare reviewComment: CreationOptional<string | null>
  declare publishedBy: CreationOptional<number | null>
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
        revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        basedOnId: { type: DataTypes.INTEGER, allowNull: true },
        submittedBy: { type: DataTypes.INTEGER, allowNull: true },
        submittedAt: { type: DataTypes.DATE, allowNull: true },
        reviewedBy: { type: DataTypes.INTEGER, allowNull: true },
        reviewedAt: { type: DataTypes.DATE, allowNull: true },
        reviewComment: { type: DataTypes.TEXT, allowNull: true },
        publishedBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'kb_versions', underscored: true },
    )
  }
}
