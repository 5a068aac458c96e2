import { expect, type Page } from '@playwright/test'

export const DEMO_PASSWORD = 'rimecase-demo'
export const PHONE = { width: 390, height: 844 }
export const DESKTOP = { width: 1280, height: 900 }

/** Signs in through the sign-in page and waits for the home page. */
export async function signIn(page: Page, email: string) {
  await page.goto('/login')
  // On a loaded machine the form can be typed into before the app has hydrated, which then clears it:
  // wait until the page's scripts have loaded.
  await page.waitForLoadState('networkidle')
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
