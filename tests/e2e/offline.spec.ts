import { PHONE, expect, signIn, test, waitForHydration } from './helpers'

// The only tests that let the app's service worker run (the others block it, see playwright.config.ts).
test.use({ serviceWorkers: 'allow' })

test('an open case loads after a reload without a connection, and a reading entered meanwhile is kept and sent later', async ({ page, context }) => {
  test.setTimeout(180_000)
  await page.setViewportSize(PHONE)
  const errors: string[] = []
  page.on('pageerror', (e) => errors.push(e.message))

  // A case of the technician's, opened before this visit to the home page.
  await signIn(page, 'tech@rimecase.demo')
  const units = (await (await page.request.get('/api/units')).json()) as { id: number; name: string }[]
  const { id } = (await (await page.request.post('/api/cases', { data: { unitId: units[0]!.id, complaint: 'Offline shell: plant room without signal' } })).json()) as { id: number }
  await page.reload()
  await waitForHydration(page)
  await expect(page.getByRole('link', { name: new RegExp(`case ${id}`) })).toBeVisible()

  // The worker takes the page over and keeps a copy of each open case listed on the home page.
  await page.waitForFunction(() => navigator.serviceWorker?.controller !== null && navigator.serviceWorker?.controller !== undefined, null, { timeout: 60_000 })
  await expect.poll(() => page.evaluate(async (caseId) => !!(await caches.match(`/cases/${caseId}`)) && !!(await caches.match(`/api/cases/${caseId}`)), id), { timeout: 60_000 }).toBe(true)

  await context.setOffline(true)
  // Truly offline, also for the worker: data it never stored cannot be had.
  expect(await page.evaluate(() => fetch(`/api/people?never-stored=${Date.now()}`).then(() => 'answered', () => 'failed'))).toBe('failed')

  await page.goto(`/cases/${id}`)
  await waitForHydration(page)
  await expect(page.locator('p', { hasText: 'Complaint: Offline shell: plant room without signal' })).toBeVisible()
  await expect(page.getByRole('heading', { name: 'Likely causes' })).toBeVisible()

  await page.getByRole('navigation', { name: 'Case actions' }).getByRole('button', { name: 'Add reading' }).click()
  const form = page.getByRole('form', { name: 'Add a reading' })
  await form.getByLabel('Where').selectOption({ label: 'Unit and room' })
  await form.getByLabel('Quantity').selectOption({ label: 'Cabinet temperature' })
  await form.getByLabel('Value').fill('41')
  await form.getByRole('button', { name: 'Change sign' }).click()
  await form.getByRole('button', { name: 'Add reading' }).click()
  await expect(page.getByTestId('sync-state')).toContainText('kept on this device')

  // A reload still without a connection: the page comes back, and so does the waiting change.
  await page.reload()
  await waitForHydration(page)
  await expect(page.locator('p', { hasText: 'Complaint: Offline shell: plant room without signal' })).toBeVisible()
  await expect(page.getByTestId('sync-state')).toContainText('1 change(s) kept on this device')
  await expect(page.getByTestId('sync-state')).not.toContainText('All changes saved')

  await context.setOffline(false)
  await expect(page.getByTestId('sync-state')).toContainText('All changes saved', { timeout: 30_000 })
  const record = (await (await page.request.get(`/api/cases/${id}`)).json()) as { readings: { quantity: string; value: number }[] }
  expect(record.readings.map((r) => [r.quantity, r.value])).toContainEqual(['cabinetTemperature', -41])
  expect(errors).toEqual([])

  // Signing out forgets the offline copies, so the next person on this device sees none of them.
  await page.getByRole('button', { name: 'Sign out' }).click()
  await expect(page).toHaveURL(/\/login/)
  expect(await page.evaluate(async () => (await caches.keys()).filter((k) => k.startsWith('rimecase-')))).toEqual([])
})
