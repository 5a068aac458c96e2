import { readFileSync, readdirSync } from 'node:fs'
import { join } from 'node:path'
import AxeBuilder from '@axe-core/playwright'
import { type Page } from '@playwright/test'
import { PHONE, expect, gotoReady, showNavigation, signIn, test, waitForHydration } from './helpers'

async function addReading(page: Page, where: string, quantity: string, value: string, unit?: string) {
  const form = page.getByRole('form', { name: 'Add a reading' })
  if (!(await form.isVisible())) await page.getByRole('navigation', { name: 'Case actions' }).getByRole('button', { name: 'Add reading' }).click()
  await form.getByLabel('Where').selectOption({ label: where })
  await form.getByLabel('Quantity').selectOption({ label: quantity })
  if (value === 'Yes' || value === 'No') await form.getByLabel('Value').selectOption({ label: value })
  else await form.getByLabel('Value').fill(value)
  if (unit) await form.getByLabel('Unit').selectOption({ label: unit })
  await form.getByRole('button', { name: 'Add reading' }).click()
  await expect(page.getByTestId('sync-state')).toContainText('All changes saved')
}

function outboxMessages(): string[] {
  const dir = process.env.RIMECASE_OUTBOX_DIR
  if (!dir) return []
  return readdirSync(dir).filter((f) => f.endsWith('.eml')).map((f) => readFileSync(join(dir, f), 'utf8'))
}

test('a technician diagnoses a cascade low stage on a phone, closes the case, and the report is e-mailed', async ({ page }) => {
  await page.setViewportSize(PHONE)
  await signIn(page, 'tech@rimecase.demo')

  await showNavigation(page)
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Units', exact: true }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'Units' })).toBeVisible()
  await page.getByRole('link', { name: /Freezer F-204/ }).filter({ visible: true }).first().click()
  await expect(page).toHaveURL(/\/units\/\d+$/)
  await expect(page.getByRole('heading', { level: 1, name: /Freezer F-204/ })).toBeVisible()
  await page.getByRole('link', { name: /Start a case/ }).filter({ visible: true }).first().click()
  await expect(page.getByLabel('Unit')).toHaveValue(/\d+/)
  expect(await page.getByLabel('Unit').locator('option:checked').innerText()).toContain('Freezer F-204')
  await page.getByLabel('Complaint').fill('Cabinet alarm: -41 °C and not pulling down since the weekend')
  await page.getByLabel('Not cooling').check()
  await page.getByRole('button', { name: 'Start the case' }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'Freezer F-204' })).toBeVisible()
  const caseId = page.url().split('/').pop()!

  // Readings that make the low stage's state clear: cascade HX at design, both compressors running, cabinet warm.
  await addReading(page, 'Unit and room', 'Cabinet temperature', '-41', '°C')
  await addReading(page, 'Unit and room', 'Cascade heat exchanger', '-33', '°C')
  await addReading(page, 'High stage (R404A)', 'Compressor running', 'Yes')
  await addReading(page, 'Low stage (R170)', 'Compressor running', 'Yes')

  // The value converts as it is typed: 15 psig of ethane is about -80 °C saturated (Bücker & Wagner 2006 EOS).
  const form = page.getByRole('form', { name: 'Add a reading' })
  await form.getByLabel('Where').selectOption({ label: 'Low stage (R170)' })
  await form.getByLabel('Quantity').selectOption({ label: 'Suction pressure' })
  await form.getByLabel('Unit').selectOption({ label: 'psig' })
  await form.getByLabel('Value').fill('15')
  await expect(page.locator('#reading-preview')).toContainText('°C sat.')

  await expect(page.getByRole('heading', { name: 'Likely causes' })).toBeVisible()
  await expect(page.getByTestId('next-test-title')).toHaveText('Standing pressure check · Low stage')
  const before = await page.getByTestId('cause').first().innerText()

  await page.getByRole('button', { name: 'Below the expected pressure' }).click()
  await expect(page.getByTestId('sync-state')).toContainText('All changes saved')
  await expect(page.getByTestId('cause').first()).toContainText('Refrigerant leak')
  await expect(page.getByTestId('cause').first()).toContainText('Low stage')
  expect(await page.getByTestId('cause').first().innerText()).not.toEqual(before)

  await page.getByRole('button', { name: 'Close case' }).click()
  const close = page.getByRole('form', { name: 'Close the case' })
  await close.getByLabel('Confirmed cause').selectOption('refrigerant-leak')
  await close.getByLabel('Stage', { exact: true }).selectOption('low')
  await close.getByLabel('Work done').fill('Leak at the low-stage drier flare repaired, nitrogen pressure test held, evacuated to 250 microns, recharged by weight.')
  await close.getByRole('button', { name: 'Add refrigerant line' }).click()
  await expect(close.getByRole('note', { name: 'Before charging or recovering' })).toBeVisible()
  await page.locator('#tx-stage-0').selectOption('low')
  await page.locator('#tx-grams-0').fill('205')
  await page.locator('#tx-cylinder-0').fill('ETH-0107')
  await close.getByRole('button', { name: 'Close case and preview the report' }).click()
  // Closing leads to the report's preview; it goes out once the technician sends it.
  await expect(page.getByRole('heading', { level: 1, name: /Service report/ })).toBeVisible()
  await page.getByRole('button', { name: /Send the report to [1-9]/ }).click()
  await expect(page.getByRole('status').filter({ hasText: 'Queued' })).toBeVisible()

  const axe = await new AxeBuilder({ page }).analyze()
  expect(axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => v.id)).toEqual([])

  // The service report, with its PDF, reaches the local mail catcher and the admin's outbox.
  await expect.poll(() => outboxMessages().some((m) => m.includes(`case ${caseId}`) && m.includes('application/pdf')), { timeout: 20_000 }).toBe(true)
  await page.getByRole('button', { name: 'Sign out' }).click()
  await signIn(page, 'admin@rimecase.demo')
  await page.goto('/admin/outbox')
  await page.getByRole('link', { name: new RegExp(`case ${caseId}\\)`) }).first().click()
  await expect(page.getByRole('link', { name: new RegExp(`rimecase-case-${caseId}-report\\.pdf`) })).toBeVisible()
})

test('a reading typed but not sent survives a reload, and one entered offline is sent when the connection returns', async ({ page, context }) => {
  await page.setViewportSize(PHONE)
  await signIn(page, 'tech@rimecase.demo')
  const opened = await page.request.post('/api/cases', { data: { unitId: (await (await page.request.get('/api/units')).json())[0].id, complaint: 'Offline drill: basement plant room' } })
  const { id } = await opened.json()
  await gotoReady(page, `/cases/${id}`)
  const bar = page.getByRole('navigation', { name: 'Case actions' })
  await bar.getByRole('button', { name: 'Add reading' }).click()
  const form = page.getByRole('form', { name: 'Add a reading' })
  await form.getByLabel('Where').selectOption({ label: 'Unit and room' })
  await form.getByLabel('Quantity').selectOption({ label: 'Cabinet temperature' })
  await form.getByLabel('Value').fill('-37.5')

  await page.reload()
  await waitForHydration(page)
  await bar.getByRole('button', { name: 'Add reading' }).click()
  await expect(form.getByLabel('Value')).toHaveValue('-37.5')

  await context.setOffline(true)
  await form.getByRole('button', { name: 'Add reading' }).click()
  await expect(page.getByTestId('sync-state')).toContainText('kept on this device')
  await context.setOffline(false)
  await expect(page.getByTestId('sync-state')).toContainText('All changes saved')
  const record = await (await page.request.get(`/api/cases/${id}`)).json()
  expect(record.readings.map((r: { quantity: string; value: number }) => [r.quantity, r.value])).toContainEqual(['cabinetTemperature', -37.5])
})

test('an edit based on an old copy of the case is explained, not lost', async ({ page }) => {
  await signIn(page, 'tech@rimecase.demo')
  const units = await (await page.request.get('/api/units')).json()
  const { id } = await (await page.request.post('/api/cases', { data: { unitId: units[0].id, complaint: 'Two technicians on one case' } })).json()
  await gotoReady(page, `/cases/${id}`)
  await expect(page.getByRole('form', { name: 'Add a reading' })).toBeVisible()
  // Someone else adds a reading with the current version, so this page's copy is now stale.
  const current = await (await page.request.get(`/api/cases/${id}`)).json()
  await page.request.post(`/api/cases/${id}/readings`, { data: { version: current.version, readings: [{ quantity: 'ambientTemperature', value: 24, unit: 'C' }] } })
  const form = page.getByRole('form', { name: 'Add a reading' })
  await form.getByLabel('Where').selectOption({ label: 'Unit and room' })
  await form.getByLabel('Quantity').selectOption({ label: 'Cabinet temperature' })
  await form.getByLabel('Value').fill('-50')
  await form.getByRole('button', { name: 'Add reading' }).click()
  await expect(page.getByRole('alert')).toContainText('changed by someone else')
  // The refused value is still in the form, ready to send again after the reload.
  await expect(form.getByLabel('Value')).toHaveValue('-50')
  await page.getByRole('button', { name: 'Reload the case' }).click()
  await expect(page.getByTestId('sync-state')).toContainText('All changes saved')
  await expect(page.getByRole('article', { name: 'Unit and room' }).getByText('Room (ambient) temperature')).toBeVisible()
  await form.getByRole('button', { name: 'Add reading' }).click()
  await expect(page.getByTestId('sync-state')).toContainText('All changes saved')
  await expect(page.getByRole('article', { name: 'Unit and room' }).getByText('Cabinet temperature')).toBeVisible()
})
