import AxeBuilder from '@axe-core/playwright'
import { type Page } from '@playwright/test'
import { DESKTOP, PHONE, expect, gotoReady, showNavigation, signIn, test } from './helpers'

async function expectNoSeriousA11yIssues(page: Page) {
  const results = await new AxeBuilder({ page }).analyze()
  const serious = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical')
  expect(serious.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([])
}

async function openUnits(page: Page) {
  const nav = await showNavigation(page)
  await nav.getByRole('link', { name: 'Units', exact: true }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'Units' })).toBeVisible()
}

/** Names of the units the register shows now, as a table on a desktop or as cards on a phone. */
function unitNames(page: Page, phone: boolean) {
  const list = phone ? page.getByRole('list', { name: 'Units' }).getByRole('link') : page.getByRole('table').getByRole('row').getByRole('link')
  return list.allInnerTexts()
}

for (const [size, viewport] of [['desktop', DESKTOP], ['phone', PHONE]] as const) {
  const phone = size === 'phone'

  test(`on a ${size} a technician sorts and filters the register, opens a cascade unit and adds one`, async ({ page }) => {
    await page.setViewportSize(viewport)
    await signIn(page, 'tech@rimecase.demo')
    await openUnits(page)

    await page.getByLabel('Customer').selectOption({ label: 'Lindqvarn Biobank' })
    await expect(page).toHaveURL(/customerId=\d+/)
    await expect.poll(() => unitNames(page, phone)).toEqual(['Cold room CR-1', 'Freezer F-204', 'Freezer F-205', 'Freezer F-311'])

    if (phone) {
      await page.getByLabel('Sort by').selectOption({ label: 'Serial, Z to A' })
    } else {
      const serial = page.getByRole('columnheader', { name: 'Serial' })
      await serial.getByRole('button').click()
      await expect(serial).toHaveAttribute('aria-sort', 'ascending')
      await expect.poll(() => unitNames(page, phone)).toEqual(['Freezer F-311', 'Freezer F-204', 'Freezer F-205', 'Cold room CR-1'])
      await serial.getByRole('button').click()
      await expect(serial).toHaveAttribute('aria-sort', 'descending')
      await expect(page.getByRole('columnheader', { name: 'Unit' })).toHaveAttribute('aria-sort', 'none')
    }
    await expect.poll(() => unitNames(page, phone)).toEqual(['Cold room CR-1', 'Freezer F-205', 'Freezer F-204', 'Freezer F-311'])

    await page.getByLabel('Kind').selectOption({ label: 'Single stage' })
    await expect.poll(() => unitNames(page, phone)).toEqual(['Cold room CR-1'])
    await page.getByLabel('Kind').selectOption({ label: 'All kinds' })
    await page.getByLabel('Search units').fill('F-204')
    await expect.poll(() => unitNames(page, phone)).toEqual(['Freezer F-204'])
    await expectNoSeriousA11yIssues(page)

    await page.getByRole('link', { name: 'Freezer F-204' }).click()
    await expect(page.getByRole('heading', { level: 1, name: 'Freezer F-204' })).toBeVisible()
    const high = page.getByRole('article', { name: 'high stage, R404A' })
    const low = page.getByRole('article', { name: 'low stage, R170' })
    // Safety classes per ASHRAE Standard 34: R404A is A1, ethane (R170) A3.
    await expect(high.getByText('Safety class A1')).toBeVisible()
    await expect(low.getByText('Safety class A3')).toBeVisible()
    await expect(low.getByText('highly flammable')).toBeVisible()
    await expect(low.getByText('210 g')).toBeVisible()
    const start = page.getByRole('link', { name: 'Start a case' })
    await expect(start).toBeVisible()
    await expect(start).toHaveAttribute('href', /^\/cases\/new\?unitId=\d+$/)
    await expectNoSeriousA11yIssues(page)

    await openUnits(page)
    await page.getByRole('link', { name: 'Add unit' }).click()
    await expect(page.getByRole('heading', { level: 1, name: 'Add a unit' })).toBeVisible()
    const name = `Freezer E2E ${size} ${Date.now()}`
    await page.getByLabel('Name', { exact: true }).fill(name)
    await page.getByLabel('Site', { exact: true }).selectOption({ label: 'Tessaly, Climatic Lab' })
    await page.getByLabel('Model').fill('Icebox 9')
    await page.getByLabel('Cabinet').fill('-86')
    await page.getByLabel('Cascade heat exchanger').fill('-35')
    const highForm = page.getByRole('group', { name: 'High stage' })
    const lowForm = page.getByRole('group', { name: 'Low stage' })
    await highForm.getByLabel('Refrigerant').selectOption('R290')
    await highForm.getByLabel('Charge').fill('-150')
    await highForm.getByLabel('Fed by (metering device)').selectOption({ label: 'Capillary tube' })
    await lowForm.getByLabel('Refrigerant').selectOption('R170')
    await lowForm.getByLabel('Charge').fill('90')
    await lowForm.getByLabel('Volume').fill('7,5')
    await page.getByRole('button', { name: 'Save unit' }).click()

    await expect(page.getByRole('alert')).toContainText('need another look')
    await expect(page.getByText('Enter the serial number')).toBeVisible()
    await expect(highForm.getByText('Charge must be between 1 and 500 000 g')).toBeVisible()
    await expect(page.getByLabel('Serial number')).toHaveAttribute('aria-invalid', 'true')
    await expect(page).toHaveURL(/\/units\/new$/)
    await expectNoSeriousA11yIssues(page)

    await page.getByLabel('Serial number').fill(`E2E-${size}-${Date.now()}`)
    await highForm.getByLabel('Charge').fill('150')
    await page.getByRole('button', { name: 'Save unit' }).click()
    await expect(page.getByRole('heading', { level: 1, name })).toBeVisible()
    await expect(page).toHaveURL(/\/units\/\d+$/)
    await expect(page.getByRole('article', { name: 'low stage, R170' }).getByText('7.5 L')).toBeVisible()
    await expect(page.getByRole('article', { name: 'high stage, R290' })).toContainText('Capillary tube')

    await page.getByRole('link', { name: 'Edit unit' }).click()
    await expect(page.getByLabel('Serial number')).toHaveValue(/^E2E-/)
    await expect(page.getByRole('group', { name: 'High stage' }).getByLabel('Fed by (metering device)')).toHaveValue('capillary')
    await page.getByLabel('Location on site').fill('Climatic Lab, cell 4')
    await page.getByRole('group', { name: 'Low stage' }).getByLabel('Reference standing pressure').fill('790')
    await page.getByRole('button', { name: 'Save unit' }).click()
    await expect(page.getByRole('group', { name: 'Low stage' }).getByText('Give the reference standing pressure and its ambient temperature together, or neither')).toBeVisible()
    await page.getByRole('group', { name: 'Low stage' }).getByLabel('Ambient at that pressure').fill('21')
    await page.getByRole('button', { name: 'Save unit' }).click()
    await expect(page.getByRole('heading', { level: 1, name })).toBeVisible()
    await expect(page.getByText('Climatic Lab, cell 4')).toBeVisible()
    await expect(page.getByRole('article', { name: 'low stage, R170' }).getByText('790 kPa abs at 21 °C')).toBeVisible()
  })
}

test('a duplicate serial is refused beside the serial field, and a trainer sees no editing controls', async ({ page }) => {
  await signIn(page, 'tech@rimecase.demo')
  await gotoReady(page, '/units/new')
  await page.getByLabel('Name', { exact: true }).fill('Second F-204')
  await page.getByLabel('Site', { exact: true }).selectOption({ label: 'Lindqvarn Biobank, Cold Store Wing' })
  await page.getByLabel('Model').fill('Polarstack 780')
  await page.getByLabel('Serial number').fill('PS780-22-0417')
  await page.getByRole('radio', { name: 'Single stage' }).check()
  await page.getByRole('group', { name: 'Single stage' }).getByLabel('Refrigerant').selectOption('R404A')
  await page.getByRole('button', { name: 'Save unit' }).click()
  await expect(page.getByText('This serial number is already on your register').last()).toBeVisible()
  await expect(page.getByLabel('Serial number')).toHaveAttribute('aria-invalid', 'true')

  await page.getByRole('button', { name: 'Sign out' }).click()
  await signIn(page, 'trainer@rimecase.demo')
  await openUnits(page)
  await expect(page.getByRole('link', { name: 'Add unit' })).toHaveCount(0)
  await page.getByLabel('Search units').fill('F-205')
  await page.getByRole('link', { name: 'Freezer F-205' }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'Freezer F-205' })).toBeVisible()
  await expect(page.getByRole('link', { name: 'Edit unit' })).toHaveCount(0)
})

test('a technician adds a customer with a site and a contact, with the form checks first', async ({ page }) => {
  await signIn(page, 'tech@rimecase.demo')
  const nav = await showNavigation(page)
  await nav.getByRole('link', { name: 'Customers', exact: true }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'Customers' })).toBeVisible()

  const name = `Quayside Cryo ${Date.now()}`
  await page.getByRole('button', { name: 'Add customer' }).click()
  await page.getByLabel('Customer name').fill(name)
  await page.getByRole('form', { name: 'Add a customer' }).getByRole('button', { name: 'Add customer' }).click()
  await page.getByLabel('Search customers and sites').fill(name)
  const card = page.getByRole('article', { name })
  await expect(card).toBeVisible()
  // Let the search settle: a result list that reloads under the form would reset what is typed.
  await expect(page.getByText('1–1 of 1')).toBeVisible()
  await page.waitForLoadState('networkidle')

  await card.getByRole('button', { name: `Add a site for ${name}` }).click()
  const siteForm = card.getByRole('form', { name: 'Add a site' })
  await siteForm.getByLabel('Site name').fill('Quay lab')
  await siteForm.getByLabel('Altitude').fill('6000')
  await siteForm.getByRole('button', { name: 'Add site' }).click()
  await expect(siteForm.getByText('Altitude must be between -430 and 5 000 m')).toBeVisible()
  await expectNoSeriousA11yIssues(page)
  await siteForm.getByLabel('Altitude').fill('1500')
  await siteForm.getByRole('button', { name: 'Add site' }).click()
  const site = card.getByRole('region', { name: 'Site Quay lab' })
  // U.S. Standard Atmosphere, 1976 (NOAA/NASA/USAF): 84.56 kPa at 1 500 m.
  await expect(site.getByText('84.56 kPa abs')).toBeVisible()

  await site.getByRole('button', { name: 'Add a contact at Quay lab' }).click()
  const contactForm = site.getByRole('form', { name: 'Add a contact' })
  await contactForm.getByLabel('Contact name').fill('Lab desk')
  await contactForm.getByLabel('E-mail').fill('lab-desk@')
  await contactForm.getByRole('button', { name: 'Add contact' }).click()
  await expect(contactForm.getByText('Enter a valid e-mail address')).toBeVisible()
  await contactForm.getByLabel('E-mail').fill('lab-desk@quayside.example')
  await contactForm.getByRole('button', { name: 'Add contact' }).click()
  await expect(site.getByRole('link', { name: 'lab-desk@quayside.example' })).toBeVisible()
  await expectNoSeriousA11yIssues(page)
})
