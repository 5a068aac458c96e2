// Registers every model and declares every association, in one place.
import type { Sequelize } from 'sequelize'
import { Contact } from './Contact'
import { Customer } from './Customer'
import { Organisation } from './Organisation'
import { Site } from './Site'
import { Unit } from './Unit'
import { UnitStage } from './UnitStage'
import { User } from './User'

export { Contact, Customer, Organisation, Site, Unit, UnitStage, User }

/** Initialises all models on `sequelize` and wires their associations. */
export function initModels(sequelize: Sequelize): void {
  for (const model of [Organisation, User, Customer, Site, Contact, Unit, UnitStage]) model.initModel(sequelize)

  Organisation.hasMany(User, { foreignKey: 'organisationId' })
  User.belongsTo(Organisation, { foreignKey: 'organisationId' })
  Organisation.hasMany(Customer, { foreignKey: 'organisationId' })
  Organisation.hasMany(Site, { foreignKey: 'organisationId' })
  Organisation.hasMany(Contact, { foreignKey: 'organisationId' })
  Organisation.hasMany(Unit, { foreignKey: 'organisationId' })
  Customer.hasMany(Site, { foreignKey: 'customerId', as: 'sites' })
  Site.belongsTo(Customer, { foreignKey: 'customerId', as: 'customer' })
  Site.hasMany(Contact, { foreignKey: 'siteId', as: 'contacts' })
  Contact.belongsTo(Site, { foreignKey: 'siteId', as: 'site' })
  Site.hasMany(Unit, { foreignKey: 'siteId', as: 'units' })
  Unit.belongsTo(Site, { foreignKey: 'siteId', as: 'site' })
  Unit.hasMany(UnitStage, { foreignKey: 'unitId', as: 'stages' })
  UnitStage.belongsTo(Unit, { foreignKey: 'unitId', as: 'unit' })
}
