import { DESKTOP, expect, signIn, test } from './helpers'

test('an engineer edits a finding of a new draft: structured and JSON views follow each other, a wrong value is refused with its field named', async ({ page }) => {
  await page.setViewportSize(DESKTOP)
  await signIn(page, 'engineer@rimecase.demo')
  await page.goto('/knowledge')
  await expect(page.getByRole('heading', { level: 1, name: 'Knowledge base' })).toBeVisible()
  await page.getByRole('button', { name: 'Start a draft from it' }).click()
  await expect(page.getByTestId('version-status')).toHaveText('Draft')

  await page.getByLabel('Search the knowledge base').fill('pull-down-stalled')
  await page.getByRole('list', { name: 'Findings' }).getByRole('link', { name: 'pull-down-stalled' }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'Finding pull-down-stalled' })).toBeVisible()

  // Structured → JSON.
  const json = page.getByLabel('Conditions as JSON')
  await expect(json).toHaveValue(/"fact": "pulldownStalled"/)
  await page.getByLabel('Fact conditions.all[0]', { exact: true }).selectOption('runtimeMin')
  await page.getByLabel('Operator conditions.all[0]', { exact: true }).selectOption('greaterThan')
  await page.getByLabel('Value conditions.all[0]', { exact: true }).fill('360')
  await page.getByLabel('Value conditions.all[0]', { exact: true }).blur()
  // The stored JSON keeps its own key order; each part of the comparison is checked.
  await expect(json).toHaveValue(/"fact": "runtimeMin"/)
  await expect(json).toHaveValue(/"operator": "greaterThan"/)
  await expect(json).toHaveValue(/"value": 360\b/)

  // JSON → structured.
  await json.fill(JSON.stringify({ any: [{ fact: 'pulldownStalled', operator: 'equal', value: true }, { all: [{ fact: 'runtimeMin', operator: 'between', value: [360, 2000] }] }] }, null, 2))
  await expect(page.getByLabel('Group conditions', { exact: true })).toHaveValue('any')
  await expect(page.getByLabel('Fact conditions.any[0]', { exact: true })).toHaveValue('pulldownStalled')
  await expect(page.getByLabel('Value conditions.any[1].all[0]', { exact: true })).toHaveValue('360, 2000')

  // A probability above 1 is refused, with the row of the table named.
  const other = page.getByLabel('Likelihood other', { exact: true })
  await other.fill('5')
  await other.blur()
  await expect(other).toHaveValue('5')
  await page.getByRole('button', { name: 'Save finding' }).click()
  await expect(page.getByRole('table', { name: 'Likelihood table' }).getByRole('alert').first()).toContainText(/between 0 and 1/)
  await expect(page.getByRole('alert').first()).toContainText(/likelihoods/)
  await other.fill('0.3')
  await other.blur()
  await expect(other).toHaveValue('0.3')
  await page.getByRole('button', { name: 'Save finding' }).click()
  await expect(page.getByRole('status').filter({ hasText: 'Saved.' })).toBeVisible()

  // The saved finding reads back as edited.
  await page.reload()
  await expect(page.getByLabel('Conditions as JSON')).toHaveValue(/"between"/)
  await expect(page.getByLabel('Likelihood other', { exact: true })).toHaveValue('0.3')
})
