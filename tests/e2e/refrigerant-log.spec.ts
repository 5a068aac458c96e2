import { DESKTOP, PHONE, expect, gotoReady, showNavigation, signIn, test } from './helpers'

test('a technician opens a unit\'s refrigerant log, sees its F-gas view and logs a recovery into a cylinder', async ({ page }) => {
  await page.setViewportSize(DESKTOP)
  await signIn(page, 'tech@rimecase.demo')
  const units = (await (await page.request.get('/api/units')).json()) as { id: number; name: string; kind: string }[]
  const unit = units.find((u) => u.kind === 'cascade')!
  await gotoReady(page, `/units/${unit.id}`)
  await page.getByRole('link', { name: /Refrigerant log, leak rates and F-gas view/ }).click()
  await expect(page.getByRole('heading', { level: 1, name: `Refrigerant log · ${unit.name}` })).toBeVisible()
  await expect(page.getByRole('heading', { name: 'EU F-gas view' })).toBeVisible()
  await expect(page.getByRole('article', { name: /517\/2014/ })).toContainText('t')

  const label = `E2E-REC-${Date.now().toString(36).toUpperCase()}`
  const form = page.getByRole('form', { name: 'Log refrigerant added or recovered' })
  await form.getByLabel('Stage', { exact: true }).selectOption({ index: 1 })
  await form.getByLabel('Added or recovered', { exact: true }).selectOption('recovered')
  await form.getByLabel('Grams').fill('120')
  await form.getByLabel('Cylinder label').fill(label)
  await form.getByRole('button', { name: 'Save to the log' }).click()
  await expect(page.getByRole('cell', { name: label }).first()).toBeVisible()

  await gotoReady(page, '/cylinders')
  await expect(page.getByRole('row', { name: new RegExp(label) })).toContainText('120 g')
})

test('on a phone the list of duties due is one tap from the menu', async ({ page }) => {
  await page.setViewportSize(PHONE)
  await signIn(page, 'tech@rimecase.demo')
  const nav = await showNavigation(page)
  await nav.getByRole('link', { name: 'Compliance', exact: true }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'Leak checks and repairs due' })).toBeVisible()
  await expect(page.getByLabel('Jurisdiction')).toBeDisabled()
})
