import AxeBuilder from '@axe-core/playwright'
import { type Page } from '@playwright/test'
import { expect, signIn, test, waitForHydration } from './helpers'
import { isDynamic, pageRoutes } from './page-routes'

// Every page of the app, opened by full page load at a phone and a desk size: the server's HTML must
// hydrate without a mismatch, nothing may log an error, text is at least 14 px, selects show their
// whole choice, and axe finds no serious problem (colour contrast to WCAG AA among them) in the light
// and the dark theme.
const SIZES = { phone: { width: 390, height: 844 }, desk: { width: 1366, height: 900 } } as const

const ROOT = process.cwd()

type Json = Record<string, unknown>
async function getJson<T>(page: Page, path: string): Promise<T> {
  const res = await page.request.get(path)
  expect(res.status(), path).toBe(200)
  return (await res.json()) as T
}

/** A small logger file (invented figures): two hours of a cabinet pulling down, minute by minute. */
function loggerCsv(): string {
  const start = Date.parse('2026-11-30T08:00:00Z')
  const rows = Array.from({ length: 120 }, (_, m) => `${new Date(start + m * 60_000).toISOString()},${(20 - m * 0.8).toFixed(1)},21.0`)
  return ['time,Cabinet (°C),Ambient (°C)', ...rows].join('\n') + '\n'
}

/** A logger file of the case that has been through the given state: 'mapping' (just uploaded) or 'analysis'. */
async function loggerFile(page: Page, caseId: number, state: 'mapping' | 'analysis'): Promise<number> {
  const files = await getJson<{ id: number; analysis: unknown; mapping: unknown; originalName: string }[]>(page, `/api/cases/${caseId}/logger-files`)
  const name = `every-page-${state}.csv`
  const found = files.find((f) => f.originalName === name && (state === 'analysis' ? f.analysis : !f.mapping))
  if (found) return found.id
  const uploaded = await page.request.post(`/api/cases/${caseId}/logger-files?name=${name}`, { data: loggerCsv(), headers: { 'content-type': 'text/csv' } })
  expect(uploaded.status(), 'logger upload').toBe(201)
  const id = ((await uploaded.json()) as { id: number }).id
  if (state === 'analysis') {
    const mapping = { time: { column: 'time' }, columns: [{ column: 'Cabinet (°C)', quantity: 'cabinetTemperature', unit: 'C' }], setpointC: -80 }
    expect((await page.request.post(`/api/logger-files/${id}/process`, { data: { mapping } })).status(), 'logger analysis').toBe(202)
    await expect.poll(async () => !!(await getJson<{ analysis: unknown }>(page, `/api/logger-files/${id}`)).analysis, { timeout: 60_000 }).toBe(true)
  }
  return id
}

/**
 * Every page under app/pages with its parameters filled from the demo data (the exercise and the
 * logger files are made from a demo case when none exists yet). A page whose parameters nobody
 * fills fails the check, so a new page cannot be left out.
 */
async function pathsFor(page: Page): Promise<string[]> {
  const units = await getJson<{ id: number; kind: string }[]>(page, '/api/units')
  const cases = await getJson<{ items: { id: number; status: string }[] }>(page, '/api/cases?pageSize=50')
  const unit = units.find((u) => u.kind === 'cascade') ?? units[0]!
  const open = cases.items.find((c) => c.status === 'open')!
  const closed = cases.items.find((c) => c.status === 'closed')!

  const versions = await getJson<{ id: number; status: string }[]>(page, '/api/knowledge-base/versions')
  const published = versions.find((v) => v.status === 'published')!
  const content = await getJson<{ causes: { slug: string }[]; tests: { slug: string }[]; findings: { finding: Json }[] }>(page, `/api/knowledge-base/versions/${published.id}/content`)
  const finding = encodeURIComponent(String(content.findings[0]!.finding.name))

  let exercises = await getJson<{ id: number }[]>(page, '/api/exercises')
  if (!exercises.length) {
    const made = await page.request.post('/api/exercises', { data: { caseId: closed.id, title: 'Every-page check: warm cabinet' } })
    expect(made.status(), 'exercise from a demo case').toBe(201)
    exercises = [(await made.json()) as { id: number }]
  }
  const exercise = exercises[0]!.id
  let attempts = await getJson<{ id: number }[]>(page, `/api/exercises/${exercise}/attempts`)
  if (!attempts.length) {
    const started = await page.request.post(`/api/exercises/${exercise}/attempts`)
    expect(started.status(), 'attempt at the exercise').toBe(201)
    attempts = [(await started.json()) as { id: number }]
  }

  const mapping = await loggerFile(page, open.id, 'mapping')
  const analysed = await loggerFile(page, open.id, 'analysis')

  const filled: Record<string, string[]> = {
    '/cases/[id]': [`/cases/${open.id}`, `/cases/${closed.id}`],
    '/cases/[id]/logger': [`/cases/${open.id}/logger`, `/cases/${open.id}/logger?file=${mapping}`, `/cases/${open.id}/logger?file=${analysed}`],
    '/cases/[id]/replay': [`/cases/${closed.id}/replay`],
    '/cases/[id]/report': [`/cases/${closed.id}/report`],
    '/exercises/[id]': [`/exercises/${exercise}`],
    '/exercises/attempts/[id]': [`/exercises/attempts/${attempts[0]!.id}`],
    '/training/exercises/[id]': [`/training/exercises/${exercise}`],
    // Opens the finding in the published version (the page forwards there).
    '/knowledge/findings/[name]': [`/knowledge/findings/${finding}`],
    '/knowledge/versions/[id]': [`/knowledge/versions/${published.id}`],
    '/knowledge/versions/[id]/causes/[slug]': [`/knowledge/versions/${published.id}/causes/${content.causes[0]!.slug}`],
    '/knowledge/versions/[id]/findings/[name]': [`/knowledge/versions/${published.id}/findings/${finding}`],
    '/knowledge/versions/[id]/tests/[slug]': [`/knowledge/versions/${published.id}/tests/${content.tests[0]!.slug}`],
    '/units/[id]': [`/units/${unit.id}`],
    '/units/[id]/edit': [`/units/${unit.id}/edit`],
    '/units/[id]/refrigerant-log': [`/units/${unit.id}/refrigerant-log`],
  }
  // /login is opened signed out, before this list. /setup is the one-time first-administrator page,
  // usable only with the link a fresh deployment prints; the demo has its administrator, so the page's
  // own request is refused and the browser logs that refusal.
  const patterns = pageRoutes(ROOT).filter((p) => p !== '/login' && p !== '/setup')
  const unfilled = patterns.filter((p) => isDynamic(p) && !filled[p])
  expect(unfilled, 'pages whose parameters the every-page check does not fill').toEqual([])
  expect(Object.keys(filled).filter((p) => !patterns.includes(p)), 'filled patterns with no page').toEqual([])
  return patterns.flatMap((p) => filled[p] ?? [p])
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

/**
 * Visible selects whose chosen option is wider than the select can show. (Each option reads in full
 * in the phone's own picker; the closed select shows only the chosen one.)
 */
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
      if (needed > room) found.push(`#${select.id || select.getAttribute('aria-label') || select.name}: "${text}" needs ${Math.round(needed)} px, has ${Math.round(room)} px`)
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
    // Some forty pages, each checked by axe twice: many minutes on a busy two-core machine.
    test.setTimeout(1_800_000)
    await page.setViewportSize(viewport)
    const problems: string[] = []
    let current = ''
    page.on('console', (m) => {
      if (m.type() === 'error' || /hydration/i.test(m.text())) problems.push(`${current}: console ${m.type()}: ${m.text()}`)
    })
    page.on('pageerror', (e) => problems.push(`${current}: ${e.message}`))
    // Each page's findings are gathered (soft) so one run names every page with a problem.
    const check = async (path: string) => {
      current = path
      await page.emulateMedia({ colorScheme: 'light' })
      const response = await page.goto(path)
      expect.soft(response?.status(), path).toBe(200)
      await waitForHydration(page)
      await page.waitForLoadState('networkidle')
      expect.soft(await smallText(page), `${path}: text under 14 px`).toEqual([])
      expect.soft(await clippedSelects(page), `${path}: clipped selects`).toEqual([])
      expect.soft(await foreignDates(page), `${path}: dates in another format`).toEqual([])
      expect.soft(await seriousAxe(page), `${path}: axe, light theme`).toEqual([])
      await page.emulateMedia({ colorScheme: 'dark' })
      expect.soft(await seriousAxe(page), `${path}: axe, dark theme`).toEqual([])
    }
    await check('/login')
    await signIn(page, 'admin@rimecase.demo')
    for (const path of await pathsFor(page)) await check(path)
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
