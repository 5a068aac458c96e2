// The first administrator of a deployment that did not ask for the demo (`npm start` against an
// external database): from RIMECASE_ADMIN_EMAIL / RIMECASE_ADMIN_PASSWORD when given, otherwise a
// one-time set-up link. Runs from scripts/db.ts, outside Nitro, so it hashes with the same scrypt
// driver and defaults as nuxt-auth-utils' hashPassword.
import { randomBytes } from 'node:crypto'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import type { Sequelize } from 'sequelize'
import { loadKnowledgeBaseFromDirectory } from '#server/domain/diagnosis/content-loader'
import { passwordWeakness } from '#shared/utils/password-strength'
import { accountWithEmailExists, activeAdminExists, insertAdmin, organisationForFirstAdmin, setupTokenHash, storeSetupLink } from './repositories/first-admin'
import { hasAnyVersion, insertKnowledgeBaseVersion } from './repositories/knowledge'
import { CONTENT_DIR } from './seeders/20261202030200-import-knowledge-base'

/** How long a printed set-up link works. */
export const SETUP_LINK_HOURS = 24

export type FirstAdminOutcome =
  | { state: 'admin-exists' }
  | { state: 'created'; email: string }
  | { state: 'link'; token: string; expiresAt: string }

export interface FirstAdminSettings {
  email?: string
  password?: string
  name?: string
  organisation?: string
}

/** Reads RIMECASE_ADMIN_EMAIL, RIMECASE_ADMIN_PASSWORD, RIMECASE_ADMIN_NAME and RIMECASE_ORG_NAME. */
export function firstAdminSettingsFrom(env: NodeJS.ProcessEnv): FirstAdminSettings {
  const value = (key: string) => env[key]?.trim() || undefined
  return { email: value('RIMECASE_ADMIN_EMAIL')?.toLowerCase(), password: env.RIMECASE_ADMIN_PASSWORD || undefined, name: value('RIMECASE_ADMIN_NAME'), organisation: value('RIMECASE_ORG_NAME') }
}

/**
 * Makes sure the deployment has an administrator: nothing to do when one exists; the account from
 * the settings when they name one (the password must pass the strength check); otherwise a new
 * one-time set-up link (earlier unused links stop working). The organisation gets the knowledge
 * base of content-src/ as its published version when it has none.
 */
export async function ensureFirstAdmin(sequelize: Sequelize, settings: FirstAdminSettings, now = new Date()): Promise<FirstAdminOutcome> {
  if (await activeAdminExists()) return { state: 'admin-exists' }
  if ((settings.email && !settings.password) || (!settings.email && settings.password)) {
    throw new Error('Set both RIMECASE_ADMIN_EMAIL and RIMECASE_ADMIN_PASSWORD, or neither (then npm start prints a one-time set-up link)')
  }
  if (settings.email && !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(settings.email)) throw new Error(`RIMECASE_ADMIN_EMAIL is not an e-mail address: ${settings.email}`)
  const name = settings.name ?? 'Administrator'
  if (settings.password) {
    const weakness = passwordWeakness(settings.password, { email: settings.email, name: settings.name })
    if (weakness) throw new Error(`RIMECASE_ADMIN_PASSWORD is too weak: ${weakness}`)
  }
  const source = loadKnowledgeBaseFromDirectory(CONTENT_DIR)
  const passwordHash = settings.password ? await new Hash(new Scrypt({})).make(settings.password) : null
  return sequelize.transaction(async (t) => {
    const org = await organisationForFirstAdmin(settings.organisation ?? 'Our service team', t)
    if (!(await hasAnyVersion(org.id, t))) {
      await insertKnowledgeBaseVersion(org.id, source, { label: 'Base 1', status: 'published', notes: 'Imported from content-src' }, t)
    }
    if (settings.email && passwordHash) {
      if (await accountWithEmailExists(settings.email, t)) {
        throw new Error(`An account with ${settings.email} exists but is not an active administrator; make it one, or name another address in RIMECASE_ADMIN_EMAIL`)
      }
      await insertAdmin({ organisationId: org.id, email: settings.email, name, passwordHash }, t)
      return { state: 'created' as const, email: settings.email }
    }
    const token = randomBytes(32).toString('base64url')
    const expiresAt = new Date(now.getTime() + SETUP_LINK_HOURS * 3_600_000)
    await storeSetupLink(org.id, setupTokenHash(token), now, expiresAt, t)
    return { state: 'link' as const, token, expiresAt: expiresAt.toISOString() }
  })
}
