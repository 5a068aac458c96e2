// The first administrator of a deployment without the demo, through the one-time set-up link that
// `npm start` prints when no administrator exists (scripts/db.ts first-admin makes the link).
import { claimSetupLink, findUsableSetupLink, inTransaction, insertAdmin, renameOrganisation, setupTokenHash } from '#server/db/repositories/first-admin'
import { NotFoundError } from '#server/domain/errors'
import type { FirstAdminInput } from '#shared/schemas/setup'
import type { UserDto } from '#shared/types/api'

export const SETUP_LINK_UNUSABLE = 'This set-up link does not work: it was used already or has expired. Restart the server (npm start) for a new one while no administrator exists.'

/** `GET /api/setup?token=`: 200 while the link is usable, 404 once used or expired. */
export async function setupLinkState(token: string, now: Date): Promise<{ usable: true }> {
  if (!(await findUsableSetupLink(setupTokenHash(token), now))) throw new NotFoundError(SETUP_LINK_UNUSABLE)
  return { usable: true }
}

/**
 * `POST /api/setup`: uses the link up (once; a second use, or two at the same moment, gets 404),
 * names the organisation and creates its administrator. The caller signs in afterwards.
 */
export async function completeFirstAdminSetup(input: FirstAdminInput, now: Date): Promise<{ user: UserDto }> {
  const passwordHash = await hashPassword(input.password)
  return inTransaction(async (t) => {
    const organisationId = await claimSetupLink(setupTokenHash(input.token), now, t)
    if (organisationId === null) throw new NotFoundError(SETUP_LINK_UNUSABLE)
    await renameOrganisation(organisationId, input.organisation, t)
    const user = await insertAdmin({ organisationId, email: input.email, name: input.name, passwordHash }, t)
    return { user: { id: user.id, email: user.email, name: user.name, role: user.role } }
  })
}
