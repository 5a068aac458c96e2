import { request, type APIRequestContext } from '@playwright/test'
import { DEMO_PASSWORD, DESKTOP, PHONE, expect, gotoReady, signIn, test, waitForHydration } from './helpers'

async function api(email: string, baseURL: string): Promise<APIRequestContext> {
  const context = await request.newContext({ baseURL })
  const res = await context.post('/api/auth/login', { data: { email, password: DEMO_PASSWORD } })
  expect(res.status()).toBe(200)
  return context
}

/** A closed cascade case with a low-stage leak found by the standing-pressure check, made into an exercise for the demo technician. */
async function exerciseForTechnician(baseURL: string): Promise<{ id: number; title: string }> {
  const tech = await api('tech@rimecase.demo', baseURL)
  const units = (await (await tech.get('/api/units')).json()) as { id: number; kind: string; stages: { stage: string; refrigerant: string }[] }[]
  const unit = units.find((u) => u.kind === 'cascade' && u.stages.some((s) => s.stage === 'low' && s.refrigerant === 'R170'))!
  const opened = await (await tech.post('/api/cases', { data: { unitId: unit.id, complaint: 'Cabinet at -40 °C after the weekend', symptoms: ['not-cooling'] } })).json()
  await tech.post(`/api/cases/${opened.id}/readings`, {
    data: { readings: [{ quantity: 'cabinetTemperature', value: -40, unit: 'C' }, { quantity: 'cascadeHxTemperature', value: -33, unit: 'C' }] },
  })
  await tech.post(`/api/cases/${opened.id}/test-results`, { data: { test: 'standing-pressure-check', stage: 'low', outcome: 'low' } })
  const closed = await tech.post(`/api/cases/${opened.id}/close`, { data: { confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }], workDone: 'Flare remade, pressure tested, recharged.' } })
  expect(closed.status()).toBe(200)
  const techId = (await (await tech.get('/api/auth/me')).json()).id
  const trainer = await api('trainer@rimecase.demo', baseURL)
  const created = await trainer.post('/api/exercises', {
    data: { caseId: opened.id, title: `Warm freezer drill ${opened.id}`, start: { complaint: true, symptoms: true, readings: [{ quantity: 'cabinetTemperature' }] }, assignees: [techId] },
  })
  expect(created.status()).toBe(201)
  return { id: (await created.json()).id, title: `Warm freezer drill ${opened.id}` }
}

test('a trainee works an exercise on a phone: asks for a reading and a test, names the causes and reads the score', async ({ page, baseURL }) => {
  const exercise = await exerciseForTechnician(baseURL!)
  await page.setViewportSize(PHONE)
  await signIn(page, 'tech@rimecase.demo')
  await gotoReady(page, '/training')
  await page.getByRole('link', { name: exercise.title }).click()
  await page.waitForURL(`**/exercises/${exercise.id}`)
  await waitForHydration(page)
  await expect(page.getByText('Practice unit')).toBeVisible()
  await expect(page.getByText('Cabinet at -40 °C after the weekend')).toBeVisible()
  await page.getByRole('button', { name: 'Start working' }).click()
  await page.waitForURL(/\/exercises\/attempts\/\d+$/)
  await waitForHydration(page)

  const ask = page.getByRole('form', { name: 'Ask for' })
  await ask.getByLabel('Reading (2 min each)').selectOption({ label: 'Cascade heat exchanger' })
  await ask.getByRole('button', { name: 'Ask' }).click()
  await expect(page.getByTestId('request')).toHaveCount(1)
  await expect(page.getByTestId('request').first()).toContainText('33 °C')
  await ask.getByText('A test').click()
  await ask.getByLabel('Test', { exact: true }).selectOption({ label: (await ask.getByLabel('Test', { exact: true }).locator('option').filter({ hasText: /standing/i }).first().textContent())!.trim() })
  await ask.getByLabel('Stage').selectOption({ label: 'Low stage' })
  await ask.getByRole('button', { name: 'Ask' }).click()
  await expect(page.getByTestId('request')).toHaveCount(2)
  await expect(page.getByTestId('minutes-spent')).toContainText('22 min')

  const answer = page.getByRole('form', { name: 'Name the cause' })
  await answer.getByLabel('High stage').selectOption({ label: 'No fault on this stage' })
  await answer.getByLabel('Low stage').selectOption({ label: (await answer.getByLabel('Low stage').locator('option').filter({ hasText: /leak/i }).first().textContent())!.trim() })
  await answer.getByRole('button', { name: 'Finish and see the score' }).click()
  await expect(page.getByTestId('score-points')).toBeVisible()
  await expect(page.getByTestId('verdict-low')).toContainText('right')
  await expect(page.getByTestId('verdict-high')).toContainText('right')
  // Nothing spills sideways on the phone.
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width)
})

test('a trainer makes an exercise from a closed case, assigns it, and replays the case with the answer hidden until the end', async ({ page, baseURL }) => {
  const tech = await api('tech@rimecase.demo', baseURL!)
  const units = (await (await tech.get('/api/units')).json()) as { id: number; kind: string; stages: { stage: string; refrigerant: string }[] }[]
  const unit = units.find((u) => u.kind === 'cascade' && u.stages.some((s) => s.stage === 'low' && s.refrigerant === 'R170'))!
  const opened = await (await tech.post('/api/cases', { data: { unitId: unit.id, complaint: 'Alarm at -55 °C', symptoms: ['not-cooling'] } })).json()
  await tech.post(`/api/cases/${opened.id}/readings`, { data: { readings: [{ quantity: 'cabinetTemperature', value: -55, unit: 'C' }] } })
  await tech.post(`/api/cases/${opened.id}/test-results`, { data: { test: 'standing-pressure-check', stage: 'low', outcome: 'low' } })
  await tech.post(`/api/cases/${opened.id}/close`, { data: { confirmedCauses: [{ cause: 'refrigerant-leak', stage: 'low' }], workDone: 'Leak repaired.' } })

  await page.setViewportSize(DESKTOP)
  await signIn(page, 'trainer@rimecase.demo')
  await gotoReady(page, `/training?case=${opened.id}`)
  const form = page.getByRole('form', { name: 'Make an exercise' })
  await expect(form.getByLabel('Closed case')).toHaveValue(String(opened.id))
  await form.getByLabel('Title').fill(`Replay drill ${opened.id}`)
  await form.getByLabel(/Cabinet temperature/).check()
  await form.getByLabel('Mara Quill').check()
  await form.getByRole('button', { name: 'Make the exercise' }).click()
  const item = page.getByTestId('exercise').filter({ hasText: `Replay drill ${opened.id}` })
  await expect(item).toContainText('assigned to Mara Quill')

  await item.getByRole('link', { name: 'Replay the case' }).click()
  await page.waitForURL(`**/cases/${opened.id}/replay`)
  await waitForHydration(page)
  await expect(page.getByRole('heading', { name: /Step 1 of \d+/ })).toBeVisible()
  const total = Number((await page.getByRole('heading', { name: /Step 1 of/ }).textContent())!.match(/of (\d+)/)![1])
  expect(total).toBe(5) // opened, symptoms, reading, outcome, closed
  await expect(page.getByRole('heading', { name: 'Confirmed at closing' })).toHaveCount(0)
  for (let i = 1; i < total; i++) await page.getByRole('button', { name: 'Next' }).click()
  await expect(page.getByRole('heading', { name: `Step ${total} of ${total}` })).toBeVisible()
  await expect(page.getByRole('heading', { name: 'Confirmed at closing' })).toBeVisible()
  await expect(page.getByRole('img', { name: /Probability of the leading causes/ }).or(page.locator('canvas[aria-label^="Probability"]'))).toHaveCount(1)

  // The trainer's home lists the exercise with its assignee, and the recent attempts.
  await gotoReady(page, '/')
  await expect(page.getByRole('link', { name: `Replay drill ${opened.id}` })).toBeVisible()
  await expect(page.getByRole('heading', { name: 'Recent attempts' })).toBeVisible()
})
