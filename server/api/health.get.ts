// Readiness probe for start scripts and tests; says nothing about any organisation.
export default defineApiHandler(async () => {
  const [rows] = await useDb().query('SELECT 1 AS ok')
  return { status: 'ok', db: (rows as { ok: number }[])[0]?.ok === 1 }
})
