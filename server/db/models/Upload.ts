import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

/** A photo or PDF stored for a case or a unit; the bytes live in Nitro storage under `storageKey`. */
export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: CreationOptional<number>
  declare organisationId: number
  declare caseId: number | null
  declare unitId: number | null
  declare purpose: CreationOptional<string>
  declare mime: string
  declare bytes: number
  declare originalName: string
  declare storageKey: string
  declare thumbKey: string | null
  declare uploadedBy: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    Upload.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        caseId: { type: DataTypes.INTEGER, allowNull: true },
        unitId: { type: DataTypes.INTEGER, allowNull: true },
        purpose: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'photo' },
        mime: { type: DataTypes.STRING(60), allowNull: false },
        bytes: { type: DataTypes.INTEGER, allowNull: false },
        originalName: { type: DataTypes.STRING(200), allowNull: false },
        storageKey: { type: DataTypes.STRING(200), allowNull: false },
        thumbKey: { type: DataTypes.STRING(200), allowNull: true },
        uploadedBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'uploads', underscored: true },
    )
  }
}
