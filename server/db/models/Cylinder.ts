import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

/** A refrigerant cylinder of the organisation: recovered refrigerant is tracked to the cylinder it went into. */
export class Cylinder extends Model<InferAttributes<Cylinder>, InferCreationAttributes<Cylinder>> {
  declare id: CreationOptional<number>
  declare organisationId: number
  declare label: string
  declare refrigerant: string | null
  declare purpose: CreationOptional<'recovery' | 'supply'>
  declare note: CreationOptional<string>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    Cylinder.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        label: { type: DataTypes.STRING(80), allowNull: false },
        refrigerant: { type: DataTypes.STRING(12), allowNull: true },
        purpose: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'recovery' },
        note: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'cylinders', underscored: true },
    )
  }
}
