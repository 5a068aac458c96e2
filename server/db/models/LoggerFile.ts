import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

/** A data-logger CSV uploaded to a case: where its bytes are, its first look, its mapping and analysis. */
export class LoggerFile extends Model<InferAttributes<LoggerFile>, InferCreationAttributes<LoggerFile>> {
  declare id: CreationOptional<number>
  declare organisationId: number
  declare caseId: number
  declare originalName: string
  declare bytes: number
  declare storageKey: string
  declare preview: unknown
  declare loggerModel: string | null
  declare mapping: unknown
  declare jobId: string | null
  declare analysis: unknown
  declare acceptedAt: Date | null
  declare uploadedBy: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    LoggerFile.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        caseId: { type: DataTypes.INTEGER, allowNull: false },
        originalName: { type: DataTypes.STRING(200), allowNull: false },
        // BIGINT comes back from pg as a string; files stay far below 2^53 bytes.
        bytes: { type: DataTypes.BIGINT, allowNull: false, get() { return Number(this.getDataValue('bytes')) } },
        storageKey: { type: DataTypes.STRING(200), allowNull: false },
        preview: { type: DataTypes.JSONB, allowNull: false },
        loggerModel: { type: DataTypes.STRING(120), allowNull: true },
        mapping: { type: DataTypes.JSONB, allowNull: true },
        jobId: { type: DataTypes.UUID, allowNull: true },
        analysis: { type: DataTypes.JSONB, allowNull: true },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        uploadedBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'logger_files', underscored: true },
    )
  }
}
