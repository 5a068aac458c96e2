import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'
import type { Organisation } from './Organisation'
import type { Site } from './Site'

/** A person at a site who receives service reports. */
export class Contact extends Model<InferAttributes<Contact>, InferCreationAttributes<Contact>> {
  declare id: CreationOptional<number>
  declare organisationId: ForeignKey<Organisation['id']>
  declare siteId: ForeignKey<Site['id']>
  declare name: string
  declare email: string
  declare phone: CreationOptional<string>
  declare receivesReports: CreationOptional<boolean>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize) {
    Contact.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        phone: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
        receivesReports: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'contacts', underscored: true },
    )
  }
}
