import AxeBuilder from '@axe-core/playwright'
import { expect, test, type Page } from '@playwright/test'
import { signIn, waitForHydration } from './helpers'

// Every page of the app, opened by full page load at a phone and a desk size: the server's HTML must
// hydrate without a mismatch, nothing may log an error, text is at least 14 px, selects show their
// whole choice, and axe finds no serious problem (colour contrast to WCAG AA among them) in the light
// and the dark theme.
const SIZES = { phone: { width: 390, height: 844 }, desk: { width: 1366, height: 900 } } as const

async function pathsFor(page: Page): Promise<string[]> {
  const units = (await (await page.request.get('/api/units')).json()) as { id: number; kind: string }[]
  const cases = (await (await page.request.get('/api/cases?pageSize=50')).json()) as { items: { id: number; status: string }[] }
  const unit = units.find((u) => u.kind === 'cascade') ?? units[0]!
  const open = cases.items.find((c) => c.status === 'open')!
  const closed = cases.items.find((c) => c.status === 'closed')!
  return [
    '/', '/cases', '/cases/new', `/cases/${open.id}`, `/cases/${closed.id}`, `/cases/${closed.id}/report`, '/units', '/units/new',
    `/units/${unit.id}`, `/units/${unit.id}/edit`, '/customers', '/calculator', '/admin/users', '/admin/outbox',
    '/training', '/training/accuracy', `/cases/${closed.id}/replay`,
  ]
}

/** Visible text smaller than 14 px, as "tag.class: text (size)". */
function smallText(page: Page) {
  return page.evaluate(() => {
    const found: string[] = []
    for (const el of Array.from(document.body.querySelectorAll<HTMLElement>('*'))) {
      const ownText = Array.from(el.childNodes).some((n) => n.nodeType === Node.TEXT_NODE && n.textContent!.trim() !== '')
      if (!ownText) continue
      const rect = el.getBoundingClientRect()
      // Hidden, or visually hidden for screen readers only.
      if (rect.width <= 1 || rect.height <= 1 || getComputedStyle(el).visibility === 'hidden') continue
      const size = parseFloat(getComputedStyle(el).fontSize)
      if (size < 14) found.push(`${el.tagName.toLowerCase()}: ${el.textContent!.trim().slice(0, 40)} (${size} px)`)
    }
    return found
  })
}

/** Dates written another way than the app's one format ("2026-12-02 14:05 CET"): US-style or raw ISO. */
function foreignDates(page: Page) {
  return page.evaluate(() => {
    const text = document.body.innerText
    return [...(text.match(/\b\d{1,2}\/\d{1,2}\/\d{2,4}\b/g) ?? []), ...(text.match(/\b\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/g) ?? [])]
  })
}

/** Visible selects whose chosen option is wider than the select can show. */
function clippedSelects(page: Page) {
  return page.evaluate(() => {
    const canvas = document.createElement('canvas').getContext('2d')!
    const found: string[] = []
    for (const select of Array.from(document.querySelectorAll('select'))) {
      const rect = select.getBoundingClientRect()
      if (rect.width === 0 || rect.height === 0) continue
      const style = getComputedStyle(select)
      canvas.font = `${style.fontWeight} ${style.fontSize} ${style.fontFamily}`
      const text = select.selectedOptions[0]?.text ?? ''
      // The drop-down arrow takes about 20 px beside the padding.
      const room = select.clientWidth - parseFloat(style.paddingLeft) - parseFloat(style.paddingRight) - 20
      const needed = canvas.measureText(text).width
      if (needed > room) found.push(`#${select.id || select.name}: "${text}" needs ${Math.round(needed)} px, has ${Math.round(room)} px`)
    }
    return found
  })
}

async function seriousAxe(page: Page) {
  const results = await new AxeBuilder({ page }).analyze()
  return results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join(', ')}`)
}

for (const [size, viewport] of Object.entries(SIZES)) {
  test(`every page opens at ${size} size (${viewport.width}×${viewport.height}) without a hydration mismatch or a console error`, async ({ page }) => {
    // Seventeen pages, each checked by axe twice: minutes on a busy two-core machine.
    test.setTimeout(600_000)
    await page.setViewportSize(viewport)
    const problems: string[] = []
    let current = ''
    page.on('console', (m) => {
      if (m.type() === 'error' || /hydration/i.test(m.text())) problems.push(`${current}: console ${m.type()}: ${m.text()}`)
    })
    page.on('pageerror', (e) => problems.push(`${current}: ${e.message}`))
    await signIn(page, 'admin@rimecase.demo')
    for (const path of await pathsFor(page)) {
      current = path
      await page.emulateMedia({ colorScheme: 'light' })
      const response = await page.goto(path)
      expect(response?.status(), path).toBe(200)
      await waitForHydration(page)
      await page.waitForLoadState('networkidle')
      expect(await smallText(page), `${path}: text under 14 px`).toEqual([])
      expect(await clippedSelects(page), `${path}: clipped selects`).toEqual([])
      expect(await foreignDates(page), `${path}: dates in another format`).toEqual([])
      expect(await seriousAxe(page), `${path}: axe, light theme`).toEqual([])
      await page.emulateMedia({ colorScheme: 'dark' })
      expect(await seriousAxe(page), `${path}: axe, dark theme`).toEqual([])
    }
    expect(problems).toEqual([])
  })
}

test('the case workspace stands in three columns at a desk and stacks causes first on a phone', async ({ page }) => {
  await signIn(page, 'tech@rimecase.demo')
  const cases = (await (await page.request.get('/api/cases?status=open&pageSize=1')).json()) as { items: { id: number }[] }
  const path = `/cases/${cases.items[0]!.id}`

  await page.setViewportSize(SIZES.desk)
  await page.goto(path)
  await waitForHydration(page)
  const readings = await page.getByTestId('case-column-readings').boundingBox()
  const causes = await page.getByTestId('case-column-causes').boundingBox()
  const next = await page.getByTestId('case-column-next').boundingBox()
  expect(readings && causes && next).toBeTruthy()
  expect(readings!.x).toBeLessThan(causes!.x)
  expect(causes!.x).toBeLessThan(next!.x)
  // Side by side: the three columns start at the same height.
  expect(Math.abs(readings!.y - causes!.y)).toBeLessThan(2)
  expect(Math.abs(causes!.y - next!.y)).toBeLessThan(2)
  await expect(page.getByRole('form', { name: 'Add a reading' })).toBeVisible()
  await expect(page.getByRole('navigation', { name: 'Case actions' })).toBeHidden()

  await page.setViewportSize(SIZES.phone)
  await page.goto(path)
  await waitForHydration(page)
  const causesTop = (await page.getByRole('heading', { name: 'Likely causes' }).boundingBox())!.y
  const nextTop = (await page.getByRole('heading', { name: 'Next test' }).boundingBox())!.y
  const readingsTop = (await page.getByRole('heading', { name: /Readings/ }).first().boundingBox())!.y
  expect(causesTop).toBeLessThan(nextTop)
  expect(nextTop).toBeLessThan(readingsTop)
  await expect(page.getByRole('form', { name: 'Add a reading' })).toBeHidden()
  await page.getByRole('navigation', { name: 'Case actions' }).getByRole('button', { name: 'Add reading' }).click()
  const form = page.getByRole('form', { name: 'Add a reading' })
  await expect(form).toBeVisible()
  expect((await form.boundingBox())!.y).toBeLessThan(causesTop)
})

test('a trainer is offered only what a trainer may do, and a closed case proposes no test', async ({ page }) => {
  await signIn(page, 'trainer@rimecase.demo')
  await expect(page.getByRole('link', { name: 'Start a case' })).toHaveCount(0)
  await page.goto('/cases')
  await waitForHydration(page)
  await expect(page.getByRole('heading', { level: 1, name: 'Cases' })).toBeVisible()
  await expect(page.getByRole('link', { name: 'Start a case' })).toHaveCount(0)
  await page.goto('/cases/new')
  await expect(page).toHaveURL(/\/$/)

  const cases = (await (await page.request.get('/api/cases?pageSize=50')).json()) as { items: { id: number; status: string }[] }
  for (const size of Object.values(SIZES)) {
    await page.setViewportSize(size)
    await page.goto(`/cases/${cases.items.find((c) => c.status === 'open')!.id}`)
    await waitForHydration(page)
    await expect(page.getByRole('heading', { name: 'Likely causes' })).toBeVisible()
    await expect(page.getByRole('navigation', { name: 'Case actions' })).toHaveCount(0)
    for (const name of ['Close case', 'Add reading', 'Add note', 'Record outcome', 'Save symptoms']) await expect(page.getByRole('button', { name })).toHaveCount(0)
  }

  await page.goto(`/cases/${cases.items.find((c) => c.status === 'closed')!.id}`)
  await waitForHydration(page)
  await expect(page.getByRole('heading', { name: 'Likely causes' })).toBeVisible()
  await expect(page.getByRole('heading', { name: 'Next test' })).toHaveCount(0)
})

test('every signed number field offers a ± key that flips the sign', async ({ page }) => {
  await page.setViewportSize(SIZES.phone)
  await signIn(page, 'tech@rimecase.demo')
  const cases = (await (await page.request.get('/api/cases?status=open&pageSize=1')).json()) as { items: { id: number }[] }
  await page.goto(`/cases/${cases.items[0]!.id}`)
  await waitForHydration(page)
  await page.getByRole('navigation', { name: 'Case actions' }).getByRole('button', { name: 'Add reading' }).click()
  const form = page.getByRole('form', { name: 'Add a reading' })
  await form.getByLabel('Where').selectOption({ label: 'Unit and room' })
  await form.getByLabel('Quantity').selectOption({ label: 'Cabinet temperature' })
  await form.getByLabel('Value').fill('80')
  await form.getByRole('button', { name: 'Change sign' }).click()
  await expect(form.getByLabel('Value')).toHaveValue('-80')
  await form.getByRole('button', { name: 'Change sign' }).click()
  await expect(form.getByLabel('Value')).toHaveValue('80')

  await page.goto('/units/new')
  await waitForHydration(page)
  for (const label of ['Cabinet', 'Ambient at that pressure']) {
    const field = page.getByLabel(label, { exact: true }).first()
    await field.fill('5')
    await page.locator(`button[aria-controls="${await field.getAttribute('id')}"]`).click()
    await expect(field).toHaveValue('-5')
  }
})
