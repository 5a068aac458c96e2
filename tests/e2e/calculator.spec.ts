import AxeBuilder from '@axe-core/playwright'
import { type Page } from '@playwright/test'
import { DESKTOP, PHONE, expect, showNavigation, signIn, test } from './helpers'

async function expectNoSeriousA11yIssues(page: Page) {
  const results = await new AxeBuilder({ page }).analyze()
  const serious = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical')
  expect(serious.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([])
}

async function openCalculator(page: Page) {
  await signIn(page, 'tech@rimecase.demo')
  const nav = await showNavigation(page)
  await nav.getByRole('link', { name: 'Calculator', exact: true }).click()
  await expect(page.getByRole('heading', { level: 1, name: 'Calculator' })).toBeVisible()
}

/** A figure as the page prints it: fixed decimals and a true minus sign. */
const shown = (value: number, decimals: number) => value.toFixed(decimals).replace('-', '\u2212')

for (const [size, viewport] of [['desktop', DESKTOP], ['phone', PHONE]] as const) {
  test(`${size}: saturation of R170 both ways, with gauge and absolute always named`, async ({ page }) => {
    await page.setViewportSize(viewport)
    // The phone run also covers the dark theme, which follows the system setting.
    if (size === 'phone') await page.emulateMedia({ colorScheme: 'dark' })
    await openCalculator(page)
    await page.getByLabel('Refrigerant', { exact: true }).selectOption('R170')
    await expect(page.getByText('Safety class', { exact: true })).toBeVisible()
    await expect(page.getByRole('list', { name: 'Hazards' })).toContainText('Flammable')

    const card = page.getByRole('region', { name: 'Pressure ⇄ temperature' })
    const result = card.getByRole('status', { name: 'Saturation result' })
    const temperature = card.getByRole('textbox', { name: 'Saturation temperature' })
    await temperature.fill('80')
    await card.getByRole('button', { name: 'Change sign' }).click()
    await expect(temperature).toHaveValue('-80')
    // 157.41 kPa abs at −80 °C: Bücker & Wagner 2006 ethane EOS as tabulated by CoolProp 8.0.0.
    // Gauge figures subtract the ISO 2533 sea-level atmosphere, 101.325 kPa; 1 psi = 6.894757 kPa (NIST SP 811).
    await expect(result).toContainText('157.4 kPa abs')
    await expect(result).toContainText('56.1 kPag')
    await page.getByLabel('Show the result in').selectOption('barg')
    await expect(result).toContainText('0.561 bar g')
    await expect(result).toContainText('1.574 bar abs')
    await page.getByLabel('Show the result in').selectOption('psig')
    await expect(result).toContainText('8.1 psig')
    await expect(result).toContainText('22.8 psia')

    await page.getByRole('radio', { name: 'Pressure → temperature' }).check()
    const pressure = page.getByRole('textbox', { name: 'Pressure', exact: true })
    await pressure.fill('157.41')
    await expect(result).toContainText(`${shown(-80, 1)} °C`)
    await page.getByLabel('Pressure unit').selectOption('psig')
    await pressure.fill('8.134')
    await expect(result).toContainText(`${shown(-80, 1)} °C`)
    await expect(result).toContainText('157.4 kPa abs')

    await pressure.fill('lots')
    await expect(result).toContainText('Type a number')
    await pressure.fill('99999')
    await expect(result).toContainText('defined from') // the message names the valid range
    await expect(page.locator('main')).not.toContainText('NaN')

    await expect(page.getByRole('img', { name: /Pressure–temperature chart of R170/ })).toBeVisible()
    await page.getByText('Cautions for R170').click()
    await expect(page.getByText(/no ignition sources/)).toBeVisible()
    await expectNoSeriousA11yIssues(page)
  })

  test(`${size}: standing-pressure check for a unit's low stage agrees with the API`, async ({ page }) => {
    await page.setViewportSize(viewport)
    await openCalculator(page)
    const stage = page.getByLabel('Or a stage of one of my units')
    const value = await stage.locator('option', { hasText: 'Freezer F-204 — low stage' }).getAttribute('value')
    await stage.selectOption(value!)
    await expect(page.getByLabel('Refrigerant', { exact: true })).toHaveValue('R170')
    await expect(page.getByRole('textbox', { name: 'Nameplate charge (g)' })).toHaveValue('210')
    await expect(page.getByRole('textbox', { name: 'Internal volume (L)' })).toHaveValue('9.5')
    // The site is at 45 m: ISO 2533 standard atmosphere 100.79 kPa.
    await expect(page.getByText(/Gauge readings use an atmosphere of/)).toContainText('100.79 kPa abs')

    await page.getByRole('textbox', { name: 'Ambient (°C)' }).fill('20')
    // The server computes the same reference equation of state: the browser must show what the API answers.
    const api = await page.request.post('/api/calculations/standing-pressure', { data: { designation: 'R170', ambientC: 20, volumeL: 9.5, chargeG: 210 } })
    const expected = (await api.json()) as { pressureKpa: number; phase: string }
    expect(expected.phase).toBe('gas')
    const result = page.getByRole('status', { name: 'Standing-pressure result' })
    await expect(result).toContainText(`${shown(expected.pressureKpa, 1)} kPa abs`)
    const atmosphere = 101.325 * Math.pow(1 - 2.25577e-5 * 45, 5.25588) // ISO 2533 troposphere formula
    await expect(result).toContainText(`${shown(expected.pressureKpa - atmosphere, 1)} kPag`)

    const measured = page.getByRole('textbox', { name: 'Measured standing pressure' })
    await measured.fill(shown(expected.pressureKpa - atmosphere, 1))
    await expect(result).toContainText('100.0 % of nameplate')
    await measured.fill('1200')
    const low = await page.request.post('/api/calculations/standing-pressure', { data: { designation: 'R170', ambientC: 20, volumeL: 9.5, pressureKpa: 1200 + atmosphere } })
    const { chargeG } = (await low.json()) as { chargeG: number }
    await expect(result).toContainText(`${shown(chargeG, 0)} g`)
    await expect(result).toContainText(`${shown((chargeG / 210) * 100, 1)} % of nameplate`)

    const chart = page.getByRole('img', { name: /Pressure–temperature chart of R170/ })
    await chart.scrollIntoViewIfNeeded()
    await expect(chart).toBeVisible()
    const box = await chart.boundingBox()
    expect(box!.width).toBeGreaterThan(200)
    await expectNoSeriousA11yIssues(page)
  })
}

test('a blend shows bubble and dew, and other refrigerants can join the chart', async ({ page }) => {
  await openCalculator(page)
  await page.getByLabel('Refrigerant', { exact: true }).selectOption('R404A')
  await page.getByRole('textbox', { name: 'Saturation temperature' }).fill('-40')
  const result = page.getByRole('status', { name: 'Saturation result' })
  // Lemmon 2003 pseudo-pure R404A EOS as tabulated by CoolProp 8.0.0: 135.29 / 130.98 kPa
  await expect(result).toContainText('Bubble (liquid)')
  await expect(result).toContainText('135.3 kPa abs')
  await expect(result).toContainText('Dew (vapour)')
  await expect(result).toContainText('131.0 kPa abs')
  await page.getByText('Compare with other refrigerants').click()
  await page.getByRole('checkbox', { name: 'R23' }).check()
  await expect(page.getByRole('img', { name: /chart of R404A, R23/ })).toBeVisible()
})

test('phone: substitute-refrigerant plan agrees with the API and hands its charge to the charging card', async ({ page }) => {
  await page.setViewportSize(PHONE)
  await openCalculator(page)
  const card = page.getByRole('region', { name: 'Substitute refrigerant: charge plan' })
  await card.getByLabel('Nameplate refrigerant').selectOption('R13')
  await card.getByRole('textbox', { name: 'Charge on the nameplate (g)' }).fill('600')
  await card.getByRole('textbox', { name: 'Volume of the stage (L)' }).fill('12')
  await card.getByRole('textbox', { name: 'Ambient now (°C)' }).fill('22')
  await card.getByRole('textbox', { name: 'Design evaporating (°C)' }).fill('-85')
  await card.getByLabel('Substitute refrigerant').selectOption('R1150')
  await card.getByLabel('Show the pressure to charge to in').selectOption('psig')

  // The browser computes with the same module the server runs: it must show what the API answers.
  const api = await page.request.post('/api/calculations/substitution', {
    data: { volumeL: 12, ambientC: 22, from: { designation: 'R13', chargeG: 600 }, to: 'R1150', basis: 'standing-pressure', evaporatingC: -85, unit: 'psig' },
  })
  const plan = (await api.json()) as { chargeG: number; chargeTo: { text: string } }
  // 153.8 g and 137.6 psig: R13 (Platzer 1990) and R1150 (Smukala 2000) EOS via CoolProp 8.0.0, sea-level gauge.
  expect(plan.chargeTo.text).toBe('137.6 psig')
  const result = card.getByRole('status', { name: 'Substitution plan' })
  const chargeTo = result.getByLabel('Charge to')
  await expect(chargeTo).toContainText(`${shown(plan.chargeG, 0)} g of R1150`)
  await expect(chargeTo).toContainText('137.6 psig')
  await expect(result.getByRole('article', { name: 'Same liquid volume' })).toContainText('211 g of R1150')
  await expect(result.getByRole('list', { name: 'Checks for this substitution' })).toContainText('from A1 to A3')

  // Against a 25 barg design pressure, the same-mass plan (3363.8 kPa abs) is a danger.
  await card.getByRole('textbox', { name: 'Design pressure, if known' }).fill('25')
  await result.getByRole('radio', { name: 'Same mass' }).check()
  await expect(chargeTo).toContainText('600 g of R1150')
  await expect(result.getByRole('article', { name: 'Same mass' })).toContainText('DANGER')
  await result.getByRole('radio', { name: 'Same standing pressure' }).check()

  await result.getByRole('button', { name: 'Charge this plan' }).click()
  const charging = page.getByRole('region', { name: 'Charging by standing pressure' })
  await expect(charging.getByRole('textbox', { name: 'Target charge (g)' })).toHaveValue('153.8')
  await charging.getByRole('textbox', { name: 'Standing pressure now' }).fill('100')
  const progress = charging.getByRole('status', { name: 'Charging result' })
  // 100 psig = 790.8 kPa abs: 9.491 kg/m³ of R1150 at 22 °C × 12 L = 113.9 g (CoolProp 8.0.0), 74.1 % of 153.8 g.
  await expect(progress).toContainText('114 g')
  await expect(progress).toContainText('74.1 % of target')
  await charging.getByRole('radio', { name: 'Grams weighed in' }).check()
  await charging.getByRole('textbox', { name: 'Grams weighed in' }).fill('120')
  const expected = await page.request.post('/api/calculations/charging', { data: { designation: 'R1150', volumeL: 12, ambientC: 22, targetChargeG: 153.8, addedG: 120, unit: 'psig' } })
  await expect(progress).toContainText((await expected.json() as { reading: { text: string } }).reading.text)
  await expect(page.locator('main')).not.toContainText('NaN')
  await expectNoSeriousA11yIssues(page)
})

test('a liquid-full fill is loud in the standing-pressure check', async ({ page }) => {
  await openCalculator(page)
  await page.getByLabel('Refrigerant', { exact: true }).selectOption('R170')
  const card = page.getByRole('region', { name: 'Standing-pressure check' })
  await card.getByRole('textbox', { name: 'Ambient (°C)' }).fill('22')
  await card.getByRole('textbox', { name: 'Nameplate charge (g)' }).fill('3600')
  await card.getByRole('textbox', { name: 'Internal volume (L)' }).fill('10')
  const result = card.getByRole('status', { name: 'Standing-pressure result' })
  // 3.6 kg of ethane in 10 L at 22 °C: compressed liquid at 5671.2 kPa (Bücker & Wagner 2006 EOS via CoolProp 8.0.0).
  await expect(result).toContainText('5671.2 kPa abs')
  await expect(result.getByRole('list', { name: 'Warnings' })).toContainText('LIQUID-FULL')
})
