import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

/** A service report e-mail and its delivery state; a background job delivers it and retries failed sends. */
export class OutboundEmail extends Model<InferAttributes<OutboundEmail>, InferCreationAttributes<OutboundEmail>> {
  declare id: CreationOptional<number>
  declare organisationId: number
  declare caseId: number | null
  declare toAddress: string
  declare subject: string
  declare status: CreationOptional<'pending' | 'sent' | 'failed'>
  declare attempts: CreationOptional<number>
  declare lastError: string | null
  declare messageId: string | null
  declare nextAttemptAt: Date | null
  declare sentAt: Date | null
  declare jobId: CreationOptional<string | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    OutboundEmail.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        caseId: { type: DataTypes.INTEGER, allowNull: true },
        toAddress: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(300), allowNull: false },
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'pending' },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        lastError: { type: DataTypes.TEXT, allowNull: true },
        messageId: { type: DataTypes.STRING(300), allowNull: true },
        nextAttemptAt: { type: DataTypes.DATE, allowNull: true },
        sentAt: { type: DataTypes.DATE, allowNull: true },
        jobId: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'outbound_emails', underscored: true },
    )
  }
}
