import AxeBuilder from '@axe-core/playwright'
import { type APIRequestContext, type Page } from '@playwright/test'
import { DEMO_PASSWORD, PHONE, expect, signIn, test } from './helpers'

async function expectNoSeriousA11yIssues(page: Page) {
  const results = await new AxeBuilder({ page }).analyze()
  const serious = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical')
  expect(serious.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([])
}

// The technician's part goes through the API, in its own session, so the browser is the admin's.
async function closedCaseByTechnician(request: APIRequestContext): Promise<number> {
  expect((await request.post('/api/auth/login', { data: { email: 'tech@rimecase.demo', password: DEMO_PASSWORD } })).status()).toBe(200)
  const units = (await (await request.get('/api/units')).json()) as { id: number }[]
  const opened = await request.post('/api/cases', { data: { unitId: units[0]!.id, complaint: 'Cabinet alarm at -58 °C overnight', symptoms: ['not-cooling'] } })
  expect(opened.status()).toBe(201)
  const { id } = (await opened.json()) as { id: number }
  await request.post(`/api/cases/${id}/readings`, { data: { readings: [{ quantity: 'cabinetTemperature', value: -58, unit: 'C' }] } })
  const closed = await request.post(`/api/cases/${id}/close`, {
    data: { confirmedCauses: [{ cause: 'condenser-airflow' }], workDone: 'Cleared lint from the condenser coil; fan checked.', refrigerantTransactions: [] },
  })
  expect(closed.status()).toBe(200)
  return id
}

test('an admin reads the report e-mail in the outbox and opens the printable report', async ({ page, playwright, baseURL }) => {
  const techApi = await playwright.request.newContext({ baseURL })
  const caseId = await closedCaseByTechnician(techApi)
  await techApi.dispose()

  await signIn(page, 'admin@rimecase.demo')
  const subject = `(case ${caseId})`
  await expect
    .poll(async () => ((await (await page.request.get('/api/outbox?pageSize=100')).json()) as { items: { subject: string }[] }).items.some((m) => m.subject.includes(subject)), { timeout: 15_000 })
    .toBe(true)

  await page.goto('/admin/outbox')
  await expect(page.getByRole('heading', { level: 1, name: 'Outbox' })).toBeVisible()
  await page.getByRole('link', { name: new RegExp(`case ${caseId}\\)`) }).first().click()
  await expect(page.getByRole('heading', { level: 2, name: new RegExp(`case ${caseId}\\)`) })).toBeVisible()
  const pdfLink = page.getByRole('link', { name: new RegExp(`rimecase-case-${caseId}-report\\.pdf`) })
  await expect(pdfLink).toBeVisible()
  // The same message opened straight from its address, rendered on the server.
  await page.reload()
  await expect(page.getByRole('heading', { level: 2, name: new RegExp(`case ${caseId}\\)`) })).toBeVisible()
  const pdf = await page.request.get((await pdfLink.getAttribute('href'))!)
  expect(pdf.headers()['content-type']).toBe('application/pdf')
  expect((await pdf.body()).subarray(0, 4).toString()).toBe('%PDF')
  await expectNoSeriousA11yIssues(page)

  await page.goto(`/cases/${caseId}/report`)
  await expect(page.getByRole('heading', { level: 1, name: /Service report/ })).toBeVisible()
  await expect(page.getByRole('heading', { level: 2, name: 'Findings' })).toBeVisible()
  await expect(page.getByRole('link', { name: 'Download PDF' })).toHaveAttribute('href', `/api/cases/${caseId}/report.pdf`)
  await expect(page.getByRole('button', { name: /Send the report to \d+ address/ })).toBeVisible()
  await expect(page.getByRole('link', { name: 'Preview the PDF' })).toHaveAttribute('href', `/api/cases/${caseId}/report.pdf`)
  await expect(page.getByText('Sent', { exact: true }).first()).toBeVisible()
  await expectNoSeriousA11yIssues(page)

  // On paper the app's navigation goes and the report stays.
  await page.emulateMedia({ media: 'print' })
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeHidden()
  await expect(page.getByRole('heading', { level: 1, name: /Service report/ })).toBeVisible()
})

test('the report page is readable on a phone and an upload states its limit', async ({ page, playwright, baseURL }) => {
  const techApi = await playwright.request.newContext({ baseURL })
  await techApi.post('/api/auth/login', { data: { email: 'tech@rimecase.demo', password: DEMO_PASSWORD } })
  const units = (await (await techApi.get('/api/units')).json()) as { id: number }[]
  const { id } = (await (await techApi.post('/api/cases', { data: { unitId: units[0]!.id, complaint: 'Door seal icing up' } })).json()) as { id: number }
  await techApi.dispose()

  await page.setViewportSize(PHONE)
  await signIn(page, 'tech@rimecase.demo')
  await page.goto(`/cases/${id}/report`)
  await expect(page.getByRole('heading', { level: 1, name: /Service report/ })).toBeVisible()
  await expect(page.getByText(/JPEG, PNG, WebP, HEIC or PDF, up to 25 MB per file/)).toBeVisible()
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)
  expect(overflow).toBeLessThanOrEqual(0)

  await page.getByLabel('Add a photo or PDF').setInputFiles({ name: 'note.jpg', mimeType: 'image/jpeg', buffer: Buffer.from('plain text pretending to be a photo') })
  await page.getByRole('button', { name: 'Add file' }).click()
  await expect(page.getByRole('alert')).toContainText('Allowed: JPEG, PNG, WebP, HEIC or PDF')
  await expectNoSeriousA11yIssues(page)
})
