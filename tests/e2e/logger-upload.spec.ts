import { isoTime, pullDownSeries } from '../unit/server/domain/logger/fixtures'
import { DESKTOP, expect, gotoReady, signIn, test } from './helpers'

// 6 h of minute readings with a 90 min plateau at -50 °C on the way to -80 °C (invented data).
const cabinet = pullDownSeries({ fromC: 20, toC: -80, rateKPerHour: 30, stall: { levelC: -50, minutes: 90 } }, 360)
const CSV = ['time,Cabinet (°C),Ambient (°C)', ...cabinet.map((c, m) => `${isoTime(m)},${c.toFixed(2)},21.0`)].join('\n') + '\n'

test('a technician uploads a logger file to a case, maps it, follows the analysis and takes its readings into the case', async ({ page }) => {
  await page.setViewportSize(DESKTOP)
  await signIn(page, 'tech@rimecase.demo')
  const units = (await (await page.request.get('/api/units')).json()) as { id: number }[]
  const opened = await page.request.post('/api/cases', { data: { unitId: units[0]!.id, complaint: 'Pulls down slowly, customer sent a logger file', symptoms: [] } })
  const caseId = ((await opened.json()) as { id: number }).id

  await gotoReady(page, `/cases/${caseId}`)
  await page.getByRole('link', { name: 'Logger files' }).click()
  await expect(page.getByRole('heading', { level: 1, name: /^Logger files/ })).toBeVisible()
  await page.getByLabel('Logger file (CSV)').setInputFiles({ name: 'cabinet-log.csv', mimeType: 'text/csv', buffer: Buffer.from(CSV) })
  await page.getByLabel('Logger model (remembers the column mapping)').fill(`E2E-${Date.now().toString(36)}`)
  await page.getByRole('button', { name: 'Upload' }).click()

  await expect(page.getByRole('heading', { name: 'Map the columns of cabinet-log.csv' })).toBeVisible()
  await expect(page.getByLabel('Quantity in Cabinet (°C)')).toHaveValue('cabinetTemperature')
  await page.getByLabel('Setpoint, °C (empty: the unit\'s design)').fill('-80')
  await page.getByRole('button', { name: 'Analyse the file' }).click()

  await expect(page.getByRole('heading', { name: 'What the logger shows' })).toBeVisible({ timeout: 30_000 })
  await expect(page.getByRole('article', { name: 'Stalls above the setpoint' })).toContainText('−50')
  await expect(page.getByRole('img', { name: /Chart of/ })).toBeVisible()
  const offered = page.getByRole('form', { name: 'Offered to the case' })
  await expect(offered.getByRole('checkbox').first()).toBeChecked()
  await offered.getByRole('button', { name: 'Add the ticked ones to the case' }).click()
  await expect(offered.getByRole('status')).toHaveText('Taken into the case.')

  const record = (await (await page.request.get(`/api/cases/${caseId}`)).json()) as { readings: { quantity: string }[] }
  expect(record.readings.map((r) => r.quantity)).toContain('cabinetTemperature')
})

test('a logger file without a header row is mapped by column position and analysed', async ({ page }) => {
  await page.setViewportSize(DESKTOP)
  await signIn(page, 'tech@rimecase.demo')
  const units = (await (await page.request.get('/api/units')).json()) as { id: number }[]
  const opened = await page.request.post('/api/cases', { data: { unitId: units[0]!.id, complaint: 'Logger export without column names', symptoms: [] } })
  const caseId = ((await opened.json()) as { id: number }).id
  // Ambient first, then time, then cabinet: positions the form must keep.
  const bare = cabinet.map((c, m) => `21.0,${isoTime(m)},${c.toFixed(2)}`).join('\n') + '\n'

  await gotoReady(page, `/cases/${caseId}/logger`)
  await page.getByLabel('Logger file (CSV)').setInputFiles({ name: 'bare-log.csv', mimeType: 'text/csv', buffer: Buffer.from(bare) })
  await page.getByRole('button', { name: 'Upload' }).click()
  await expect(page.getByRole('heading', { name: 'Map the columns of bare-log.csv' })).toBeVisible()
  await expect(page.getByTestId('mapping-by-position')).toBeVisible()
  await page.getByLabel('Time column').selectOption('column 2')
  await page.getByLabel('Use column column 3').check()
  await page.getByLabel('Quantity in column 3').selectOption('cabinetTemperature')
  await page.getByLabel('Setpoint, °C (empty: the unit\'s design)').fill('-80')
  await page.getByRole('button', { name: 'Analyse the file' }).click()

  await expect(page.getByRole('heading', { name: 'What the logger shows' })).toBeVisible({ timeout: 30_000 })
  await expect(page.getByRole('article', { name: 'Stalls above the setpoint' })).toContainText('−50')
  const file = (await (await page.request.get(`/api/cases/${caseId}/logger-files`)).json()) as { mapping: { hasHeader?: boolean; time: { column: unknown } } }[]
  expect(file[0]!.mapping).toMatchObject({ hasHeader: false, time: { column: 1 } })
})
