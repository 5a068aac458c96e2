import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

/** The column mapping last used for a logger model, offered again for the next file of that model. */
export class LoggerMapping extends Model<InferAttributes<LoggerMapping>, InferCreationAttributes<LoggerMapping>> {
  declare id: CreationOptional<number>
  declare organisationId: number
  declare loggerModel: string
  declare mapping: unknown
  declare updatedBy: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    LoggerMapping.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        loggerModel: { type: DataTypes.STRING(120), allowNull: false },
        mapping: { type: DataTypes.JSONB, allowNull: false },
        updatedBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'logger_mappings', underscored: true },
    )
  }
}
