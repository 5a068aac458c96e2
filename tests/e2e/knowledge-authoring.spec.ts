import { type Browser, type Page } from '@playwright/test'
import { DESKTOP, expect, gotoReady, signIn, test } from './helpers'

// Runs in order: the review test publishes a version and rolls back, the impact test compares with
// whatever is published.
test.describe.configure({ mode: 'serial' })

async function newDraft(page: Page): Promise<number> {
  await gotoReady(page, '/knowledge')
  await page.getByRole('button', { name: 'Start a draft from it' }).click()
  await expect(page.getByTestId('version-status')).toHaveText('Draft')
  return Number(/\/knowledge\/versions\/(\d+)/.exec(page.url())![1])
}

async function engineerIn(browser: Browser, email: string): Promise<Page> {
  const context = await browser.newContext({ viewport: DESKTOP })
  const page = await context.newPage()
  await signIn(page, email)
  return page
}

test('an engineer adds a finding to a draft, gives it examples, deletes one example and then the finding, each after confirming', async ({ page }) => {
  await page.setViewportSize(DESKTOP)
  await signIn(page, 'engineer@rimecase.demo')
  const draftId = await newDraft(page)

  await page.getByRole('button', { name: 'New finding' }).click()
  const form = page.getByRole('form', { name: 'New finding' })
  // A name that is not lower-case words is refused with the field's own message; nothing is added.
  await form.getByLabel(/^Name/).fill('Door Ajar')
  await form.getByRole('button', { name: 'Add the finding' }).click()
  await expect(form.getByRole('alert')).toContainText('lower-case words joined by hyphens')
  await form.getByLabel(/^Name/).fill('door-left-ajar')
  await form.getByRole('button', { name: 'Add the finding' }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'Finding door-left-ajar' })).toBeVisible()
  await expect(page.getByLabel('Conditions as JSON')).toHaveValue(/"fact": "pulldownStalled"/)

  // Two examples; the second gets a wrong value and the schema names its field.
  const examples = page.getByRole('list', { name: 'Examples' })
  await page.getByRole('button', { name: 'Add an example' }).click()
  await page.getByLabel('Title of example 1').fill('Stalled pull-down')
  await page.getByLabel('Facts of example 1').fill('{ "pulldownStalled": true }')
  await page.getByLabel('Facts of example 1').blur()
  await page.getByRole('button', { name: 'Add an example' }).click()
  await page.getByLabel('Title of example 2').fill('')
  await page.getByLabel('Expected result of example 2').selectOption('does-not-fire')
  await page.getByLabel('Facts of example 2').fill('{ "pulldownStalled": false }')
  await page.getByLabel('Facts of example 2').blur()
  await expect(examples.getByRole('listitem', { name: 'Example 2' }).getByRole('alert')).toContainText('title')
  await page.getByLabel('Title of example 2').fill('Pulling down normally')
  await page.getByRole('button', { name: 'Save finding' }).click()
  await expect(page.getByRole('status').filter({ hasText: 'Saved.' })).toBeVisible()
  await page.reload()
  await expect(page.getByLabel('Title of example 2')).toHaveValue('Pulling down normally')
  await expect(page.getByLabel('Facts of example 1')).toHaveValue(/"pulldownStalled": true/)

  // Deleting asks first: dismissing keeps the example, accepting removes it.
  page.once('dialog', (d) => d.dismiss())
  await page.getByRole('button', { name: 'Delete example 1' }).click()
  await expect(examples.getByRole('listitem')).toHaveCount(2)
  page.once('dialog', (d) => {
    expect(d.message()).toContain('Stalled pull-down')
    return d.accept()
  })
  await page.getByRole('button', { name: 'Delete example 1' }).click()
  await expect(examples.getByRole('listitem')).toHaveCount(1)
  await expect(page.getByLabel('Title of example 1')).toHaveValue('Pulling down normally')
  await page.getByRole('button', { name: 'Save finding' }).click()
  await expect(page.getByRole('status').filter({ hasText: 'Saved.' })).toBeVisible()
  await page.reload()
  await expect(page.getByRole('list', { name: 'Examples' }).getByRole('listitem')).toHaveCount(1)

  // The finding itself: kept on dismissing, gone from the draft on accepting.
  page.once('dialog', (d) => d.dismiss())
  await page.getByRole('button', { name: 'Delete finding' }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'Finding door-left-ajar' })).toBeVisible()
  page.once('dialog', (d) => d.accept())
  await page.getByRole('button', { name: 'Delete finding' }).click()
  await expect(page).toHaveURL(new RegExp(`/knowledge/versions/${draftId}$`))
  await page.getByLabel('Search the knowledge base').fill('door-left-ajar')
  await expect(page.getByRole('list', { name: 'Findings' }).getByRole('link')).toHaveCount(0)
})

test('the Markdown preview follows the text as typed and runs nothing typed into it', async ({ page }) => {
  await page.setViewportSize(DESKTOP)
  await signIn(page, 'engineer@rimecase.demo')
  await newDraft(page)
  await page.getByRole('list', { name: 'Causes' }).getByRole('link').first().click()
  const field = page.getByLabel('Description', { exact: true })
  await expect(field).toBeVisible()
  const preview = page.getByTestId('markdown-preview')
  await field.fill([
    '## Check the **drier**',
    '',
    '- first item',
    '',
    '<script>window.__kbInjected = true</script>',
    '<img src="x" onerror="window.__kbInjected = true">',
    '[a link](javascript:window.__kbInjected=true)',
  ].join('\n'))
  await expect(preview.getByRole('heading', { level: 2 })).toHaveText('Check the drier')
  await expect(preview.locator('strong')).toHaveText('drier')
  await expect(preview.getByRole('listitem')).toHaveText('first item')
  // The markup shows as text; no element of it exists, and nothing ran.
  await expect(preview).toContainText('<script>window.__kbInjected = true</script>')
  await expect(preview.locator('script, img, [onerror]')).toHaveCount(0)
  await expect(preview.locator('a[href^="javascript"]')).toHaveCount(0)
  await page.waitForTimeout(200)
  expect(await page.evaluate(() => (window as unknown as { __kbInjected?: boolean }).__kbInjected)).toBeUndefined()
})

test('a draft is submitted, approved by someone else, published, and the earlier version published again', async ({ page, browser }) => {
  await page.setViewportSize(DESKTOP)
  await signIn(page, 'engineer@rimecase.demo')
  await gotoReady(page, '/knowledge')
  const inUse = page.getByRole('region', { name: 'In use' })
  const originalId = Number(/Version (\d+)/.exec((await inUse.getByRole('link').first().textContent()) ?? '')![1])
  const draftId = await newDraft(page)

  await page.getByRole('button', { name: 'Submit for review' }).click()
  await expect(page.getByTestId('version-status')).toHaveText(/review/i)
  // Its own author cannot approve it.
  await expect(page.getByText('Waiting for another engineer or an administrator to review it.')).toBeVisible()
  await expect(page.getByRole('button', { name: 'Approve' })).toHaveCount(0)

  const reviewer = await engineerIn(browser, 'admin@rimecase.demo')
  await gotoReady(reviewer, `/knowledge/versions/${draftId}`)
  await reviewer.getByLabel('Review comments').fill('Looks right; the copy is unchanged.')
  await reviewer.getByRole('button', { name: 'Approve' }).click()
  await expect(reviewer.getByText(/reviewed by/)).toBeVisible()
  await reviewer.context().close()

  await page.reload()
  await page.getByRole('button', { name: 'Publish', exact: true }).click()
  await expect(page.getByTestId('version-status')).toHaveText('Published, in use')
  await gotoReady(page, '/knowledge')
  await expect(inUse.getByRole('link').first()).toContainText(`Version ${draftId}`)

  // Rollback: the earlier version is published again.
  await gotoReady(page, `/knowledge/versions/${originalId}`)
  await page.getByRole('button', { name: 'Publish this version again' }).click()
  await expect(page.getByTestId('version-status')).toHaveText('Published, in use')
  await gotoReady(page, '/knowledge')
  await expect(inUse.getByRole('link').first()).toContainText(`Version ${originalId}`)
  await gotoReady(page, '/knowledge/audit')
  await expect(page.getByRole('list', { name: 'Knowledge-base changes' })).toContainText('published it again (rollback)')
})

test('the impact panel shows its progress, then the figures the job worked out; the knowledge-base page and the engineer home then show the version in use measured', async ({ page }) => {
  await page.setViewportSize(DESKTOP)
  await signIn(page, 'engineer@rimecase.demo')
  await newDraft(page)
  const panel = page.getByRole('region', { name: 'Impact on past cases' })
  await expect(panel).toContainText('default starting odds')
  const finished = page.waitForResponse(async (res) => {
    if (!/\/api\/jobs\//.test(res.url())) return false
    const body = await res.json().catch(() => null)
    return body?.state === 'done'
  })
  await panel.getByRole('button', { name: 'Replay past cases' }).click()
  await expect(panel.getByRole('progressbar', { name: 'Ranking past cases with both versions' })).toBeVisible()
  const job = await (await finished).json()
  const result = job.result
  expect(result.cases).toBeGreaterThan(0)
  const percent = (x: number) => `${Math.round(x * 100)} %`
  await expect(panel.getByRole('table', { name: 'First cause right' })).toContainText(`Over ${result.cases} cases`)
  await expect(panel.getByTestId('candidate-top1')).toContainText(`(${result.candidate.top1Cases})`)
  await expect(panel.getByTestId('published-top1')).toContainText(`(${result.published.top1Cases})`)
  await expect(panel.getByTestId('published-top1')).toContainText(percent(result.published.top1))
  // An unchanged copy ranks every case as the published version does.
  expect(result.candidate).toEqual(result.published)
  expect(result.changedFirst).toEqual([])
  await expect(panel.getByRole('heading', { name: 'Cases whose first cause changes (0)' })).toBeVisible()
  const rows = panel.getByRole('table', { name: 'Confusion table' }).locator('tbody tr')
  await expect(rows).toHaveCount(result.confusion.length)
  await expect(panel.getByRole('progressbar')).toHaveCount(0)

  await gotoReady(page, '/knowledge')
  const accuracy = page.getByRole('region', { name: 'Accuracy of the version in use' })
  await expect(accuracy.getByTestId('accuracy-cases')).toHaveText(String(result.cases))
  await expect(accuracy.getByTestId('accuracy-top1')).toContainText(percent(result.published.top1))
  await expect(accuracy).toContainText('default starting odds')
  // The engineer's home shows the same figures.
  await gotoReady(page, '/')
  const home = page.getByRole('region', { name: 'Accuracy of the version in use' })
  await expect(home.getByTestId('accuracy-cases')).toHaveText(String(result.cases))
  await expect(home.getByTestId('accuracy-top3')).toContainText(percent(result.published.top3))
})
