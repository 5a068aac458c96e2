// Registers every model and declares every association, in one place.
import type { Sequelize } from 'sequelize'
import { BackgroundJob } from './BackgroundJob'
import { CaseEvent } from './CaseEvent'
import { ComplianceCheck } from './ComplianceCheck'
import { Contact } from './Contact'
import { Customer } from './Customer'
import { Cylinder } from './Cylinder'
import { KbAuditEvent } from './KbAuditEvent'
import { KbCause } from './KbCause'
import { KbRule } from './KbRule'
import { KbTest } from './KbTest'
import { KbVersion } from './KbVersion'
import { LoggerFile } from './LoggerFile'
import { LoggerMapping } from './LoggerMapping'
import { Organisation } from './Organisation'
import { OutboundEmail } from './OutboundEmail'
import { RefrigerantTransaction } from './RefrigerantTransaction'
import { ServiceCase } from './ServiceCase'
import { Site } from './Site'
import { Unit } from './Unit'
import { UnitStage } from './UnitStage'
import { Upload } from './Upload'
import { User } from './User'

export {
  BackgroundJob, CaseEvent, Contact, Customer, KbAuditEvent, KbCause, KbRule, KbTest, KbVersion, Organisation, OutboundEmail,
  RefrigerantTransaction, ServiceCase, Site, Unit, UnitStage, Upload, User, Cylinder, ComplianceCheck, LoggerFile, LoggerMapping,
}

/** Initialises all models on `sequelize` and wires their associations. */
export function initModels(sequelize: Sequelize): void {
  for (const model of [
    Organisation, User, Customer, Site, Contact, Unit, UnitStage, KbVersion, KbCause, KbTest, KbRule,
    ServiceCase, CaseEvent, RefrigerantTransaction, Upload, OutboundEmail, BackgroundJob, KbAuditEvent,
    Cylinder, ComplianceCheck, LoggerFile, LoggerMapping,
  ]) model.initModel(sequelize)

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

  Organisation.hasMany(KbVersion, { foreignKey: 'organisationId' })
  for (const part of [KbCause, KbTest, KbRule]) KbVersion.hasMany(part as typeof KbCause, { foreignKey: 'versionId' })
  Organisation.hasMany(ServiceCase, { foreignKey: 'organisationId' })
  Unit.hasMany(ServiceCase, { foreignKey: 'unitId', as: 'cases' })
  ServiceCase.belongsTo(Unit, { foreignKey: 'unitId', as: 'unit' })
  ServiceCase.belongsTo(User, { foreignKey: 'technicianId', as: 'technician' })
  ServiceCase.hasMany(CaseEvent, { foreignKey: 'caseId', as: 'events' })
  ServiceCase.hasMany(RefrigerantTransaction, { foreignKey: 'caseId', as: 'transactions' })
  Unit.hasMany(RefrigerantTransaction, { foreignKey: 'unitId', as: 'transactions' })
}
