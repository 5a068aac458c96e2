// Whether the server can do its work: the database answers. Says nothing about any organisation.
import { QueryTypes } from 'sequelize'

export type Health = { ok: true } | { ok: false; reason: string }

const PROBE_TIMEOUT_MS = 3_000

/** Asks the database for one row, once and without retries, within a few seconds. */
export async function checkHealth(): Promise<Health> {
  let timer: ReturnType<typeof setTimeout> | undefined
  const timeout = new Promise<Health>((resolve) => {
    timer = setTimeout(() => resolve({ ok: false, reason: 'database not answering' }), PROBE_TIMEOUT_MS)
  })
  const probe = useDb()
    .query('SELECT 1 AS ok', { type: QueryTypes.SELECT, retry: { max: 1 } })
    .then((rows): Health => ((rows as { ok: number }[])[0]?.ok === 1 ? { ok: true } : { ok: false, reason: 'database answered wrongly' }))
    .catch((): Health => ({ ok: false, reason: 'database unreachable' }))
  try {
    return await Promise.race([probe, timeout])
  } finally {
    clearTimeout(timer)
  }
}
