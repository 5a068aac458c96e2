import AxeBuilder from '@axe-core/playwright'
import { DESKTOP, PHONE, expect, showNavigation, signIn, test } from './helpers'

const ROLE_NAV: Record<string, { email: string; sees: string[]; hidden: string[] }> = {
  technician: { email: 'tech@rimecase.demo', sees: ['Home', 'Cases', 'Units', 'Calculator'], hidden: ['Users', 'Outbox'] },
  engineer: { email: 'engineer@rimecase.demo', sees: ['Home', 'Cases', 'Units', 'Calculator'], hidden: ['Users', 'Outbox'] },
  trainer: { email: 'trainer@rimecase.demo', sees: ['Home', 'Cases', 'Units', 'Calculator'], hidden: ['Users', 'Outbox'] },
  admin: { email: 'admin@rimecase.demo', sees: ['Home', 'Cases', 'Units', 'Calculator', 'Users', 'Outbox'], hidden: [] },
}

async function expectNoSeriousA11yIssues(page: import('@playwright/test').Page) {
  const results = await new AxeBuilder({ page }).analyze()
  const serious = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical')
  expect(serious.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([])
}

test('the sign-in page shows a clear error for a wrong password and passes axe', async ({ page }) => {
  await page.goto('/')
  await expect(page).toHaveURL(/\/login/)
  await expect(page.getByRole('heading', { name: 'Rimecase' })).toBeVisible()
  await page.getByLabel('E-mail').fill('tech@rimecase.demo')
  await page.getByLabel('Password').fill('wrong-password')
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.getByRole('alert')).toContainText('not right')
  await expectNoSeriousA11yIssues(page)
})

for (const [role, { email, sees, hidden }] of Object.entries(ROLE_NAV)) {
  for (const [size, viewport] of [['desktop', DESKTOP], ['phone', PHONE]] as const) {
    test(`${role} on ${size} sees the navigation for the role`, async ({ page }) => {
      await page.setViewportSize(viewport)
      await signIn(page, email)
      const nav = await showNavigation(page)
      for (const label of sees) await expect(nav.getByRole('link', { name: label, exact: true })).toBeVisible()
      for (const label of hidden) await expect(nav.getByRole('link', { name: label, exact: true })).toHaveCount(0)
      await expectNoSeriousA11yIssues(page)
    })
  }
}

test('signing out returns to the sign-in page and the session is gone', async ({ page }) => {
  await signIn(page, 'tech@rimecase.demo')
  await page.getByRole('button', { name: 'Sign out' }).click()
  await expect(page).toHaveURL(/\/login/)
  const me = await page.request.get('/api/auth/me')
  expect(me.status()).toBe(401)
})

test('fonts and assets come from the app itself', async ({ page }) => {
  const foreign: string[] = []
  page.on('request', (req) => {
    const url = new URL(req.url())
    if (url.hostname !== '127.0.0.1' && url.protocol.startsWith('http')) foreign.push(req.url())
  })
  await signIn(page, 'tech@rimecase.demo')
  await page.evaluate(() => document.fonts.ready)
  const family = await page.evaluate(() => getComputedStyle(document.body).fontFamily)
  expect(family).toContain('Atkinson Hyperlegible Next')
  expect(await page.evaluate(() => document.fonts.check('16px "Atkinson Hyperlegible Next"'))).toBe(true)
  expect(foreign).toEqual([])
})
