import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

/** One change of an organisation's knowledge base: who, when, what (kept when the version is gone). */
export class KbAuditEvent extends Model<InferAttributes<KbAuditEvent>, InferCreationAttributes<KbAuditEvent>> {
  declare id: CreationOptional<number>
  declare organisationId: number
  declare versionId: number | null
  declare userId: number | null
  declare at: Date
  declare action: string
  declare itemKind: string | null
  declare itemKey: string | null
  declare details: CreationOptional<Record<string, unknown>>

  static initModel(sequelize: Sequelize) {
    KbAuditEvent.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        versionId: { type: DataTypes.INTEGER, allowNull: true },
        userId: { type: DataTypes.INTEGER, allowNull: true },
        at: { type: DataTypes.DATE, allowNull: false },
        action: { type: DataTypes.STRING(40), allowNull: false },
        itemKind: { type: DataTypes.STRING(20), allowNull: true },
        itemKey: { type: DataTypes.STRING(120), allowNull: true },
        details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      },
      { sequelize, tableName: 'kb_audit_events', underscored: true, timestamps: false },
    )
  }
}
