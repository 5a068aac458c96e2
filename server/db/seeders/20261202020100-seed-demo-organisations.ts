// Seeds the demo organisations, users and equipment. Skips an organisation that already exists,
// so running it again never duplicates anything.
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { Hash } from '@adonisjs/hash'
import type { QueryInterface } from 'sequelize'
import { Contact, Customer, Organisation, Site, Unit, UnitStage, User } from '../models'
import { DEMO_ORGANISATIONS, DEMO_PASSWORD } from './demo-equipment'

// Same scrypt driver and defaults as nuxt-auth-utils' hashPassword, so its verifyPassword accepts these.
const hasher = new Hash(new Scrypt({}))

export async function up({ context: qi }: { context: QueryInterface }) {
  const passwordHash = await hasher.make(DEMO_PASSWORD)
  await qi.sequelize.transaction(async (transaction) => {
    for (const demo of DEMO_ORGANISATIONS) {
      if (await Organisation.findOne({ where: { slug: demo.slug }, transaction })) continue
      const org = await Organisation.create({ slug: demo.slug, name: demo.name }, { transaction })
      const organisationId = org.id
      for (const u of demo.users) {
        await User.create({ ...u, organisationId, passwordHash }, { transaction })
      }
      for (const c of demo.customers) {
        const customer = await Customer.create({ organisationId, name: c.name, notes: c.notes }, { transaction })
        for (const s of c.sites) {
          const site = await Site.create(
            { organisationId, customerId: customer.id, name: s.name, address: s.address, altitudeM: s.altitudeM },
            { transaction },
          )
          for (const contact of s.contacts) await Contact.create({ organisationId, siteId: site.id, ...contact }, { transaction })
          for (const { stages, ...unit } of s.units) {
            const created = await Unit.create({ organisationId, siteId: site.id, ...unit }, { transaction })
            for (const stage of stages) {
              await UnitStage.create(
                { unitId: created.id, ...stage, referenceStandingPressureKpa: null, referenceAmbientC: null },
                { transaction },
              )
            }
          }
        }
      }
    }
  })
}

export async function down() {
  // Demo data is removed by dropping the database; there is nothing safe to undo piecemeal.
}
