import { test as base, expect, type Page } from '@playwright/test'

/**
 * Every browser test runs with this `test`: it watches each page of the test's browser context for
 * Content Security Policy violations (the `securitypolicyviolation` event, and the browser's own
 * console message when it refuses something) and fails the test when there was any, naming them.
 */
export const test = base.extend<{ cspViolations: string[] }>({
  cspViolations: [
    async ({ context }, use) => {
      const violations: string[] = []
      await context.addInitScript(() => {
        document.addEventListener('securitypolicyviolation', (e) => {
          console.error(`[csp-violation] ${e.violatedDirective} refused ${e.blockedURI || 'inline code'} (${e.sourceFile || 'page'}:${e.lineNumber})`)
        })
      })
      const watch = (page: Page) => {
        page.on('console', (message) => {
          const text = message.text()
          if (text.startsWith('[csp-violation]') || /Content Security Policy/i.test(text)) violations.push(`${page.url()}: ${text}`)
        })
      }
      context.pages().forEach(watch)
      context.on('page', watch)
      await use(violations)
      expect(violations, 'Content Security Policy violations on the pages of this test').toEqual([])
    },
    { auto: true },
  ],
})
export { expect }

export const DEMO_PASSWORD = 'rimecase-demo'
export const PHONE = { width: 390, height: 844 }
export const DESKTOP = { width: 1280, height: 900 }

/**
 * Opens a page and waits until the app has hydrated it (the app sets html[data-hydrated]). Typing
 * into server-rendered HTML before that would be undone by hydration, so every full page load that
 * is followed by typing goes through here.
 */
export async function gotoReady(page: Page, path: string) {
  await page.goto(path)
  await waitForHydration(page)
}

/** Waits for the mark the app sets once the current page has hydrated. */
export async function waitForHydration(page: Page) {
  await page.locator('html[data-hydrated]').waitFor({ state: 'attached' })
}

/** Signs in through the sign-in page and waits for the home page. */
export async function signIn(page: Page, email: string) {
  await gotoReady(page, '/login')
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password').fill(DEMO_PASSWORD)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.getByRole('heading', { level: 1, name: /^Hello/ })).toBeVisible()
}

/** Opens the phone menu when the page is narrow, so the main navigation is visible. */
export async function showNavigation(page: Page) {
  const menu = page.getByRole('button', { name: 'Menu' })
  if (await menu.isVisible()) await menu.click()
  return page.getByRole('navigation', { name: 'Main' }).filter({ visible: true })
}
