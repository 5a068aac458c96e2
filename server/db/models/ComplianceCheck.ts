import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

/** A leak check, repair, verification test or report on a unit (or one stage of it), with its outcome. */
export class ComplianceCheck extends Model<InferAttributes<ComplianceCheck>, InferCreationAttributes<ComplianceCheck>> {
  declare id: CreationOptional<number>
  declare organisationId: number
  declare unitId: number
  declare caseId: number | null
  declare stage: string | null
  declare kind: string
  declare passed: boolean
  declare at: Date
  declare note: CreationOptional<string>
  declare byUserId: number | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    ComplianceCheck.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        unitId: { type: DataTypes.INTEGER, allowNull: false },
        caseId: { type: DataTypes.INTEGER, allowNull: true },
        stage: { type: DataTypes.STRING(10), allowNull: true },
        kind: { type: DataTypes.STRING(30), allowNull: false },
        passed: { type: DataTypes.BOOLEAN, allowNull: false },
        at: { type: DataTypes.DATE, allowNull: false },
        note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
        byUserId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'compliance_checks', underscored: true },
    )
  }
}
