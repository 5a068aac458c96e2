import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { Customer } from './Customer'
import type { Organisation } from './Organisation'

/** A customer's location; its altitude sets the local atmospheric pressure for gauge readings. */
export class Site extends Model<InferAttributes<Site>, InferCreationAttributes<Site>> {
  declare id: CreationOptional<number>
  declare organisationId: ForeignKey<Organisation['id']>
  declare customerId: ForeignKey<Customer['id']>
  declare name: string
  declare address: string
  declare altitudeM: number
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    Site.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.STRING(200), allowNull: false },
        address: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        altitudeM: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sites', underscored: true },
    )
  }
}
