// Refilling a stage with another refrigerant, at phone and desktop size: the planner on the case
// page saves the chosen plan on the unit and in the case's timeline; the calculator opened from the
// case brings the stage's design pressure and the room temperature read; the unit page saves a plan
// on the unit alone; a trainer may plan but sees no save button. Each run makes its own unit, so
// the demo units other tests read keep their nameplate fills.
import { type APIRequestContext, type Page } from '@playwright/test'
import { PHONE, expect, gotoReady, signIn, test } from './helpers'

const DESKTOP_WIDE = { width: 1366, height: 900 }
const tag = () => Math.random().toString(36).slice(2, 8).toUpperCase()

/** A cascade unit at sea level whose low stage holds 600 g of R13 in 12 L, design pressure 2600 kPa abs, with an open case. */
async function unitWithCase(request: APIRequestContext) {
  const name = `Plan test ${tag()}`
  const customer = await (await request.post('/api/customers', { data: { name } })).json()
  const site = await (await request.post('/api/sites', { data: { customerId: customer.id, name: `${name} lab`, address: '2 Frost Row', altitudeM: 0 } })).json()
  const unit = await (await request.post('/api/units', {
    data: {
      name: `Freezer ${tag()}`, model: 'Deepcold 6', serial: `DC6-${tag()}`, kind: 'cascade', equipmentClass: 'ult-freezer', location: 'Room 4', siteId: site.id,
      designCabinetC: -86, designCascadeHxC: -35,
      stages: [{ stage: 'high', refrigerant: 'R290', chargeG: 150 }, { stage: 'low', refrigerant: 'R13', chargeG: 600, volumeL: 12, designPressureKpa: 2600 }],
    },
  })).json()
  const opened = await (await request.post('/api/cases', { data: { unitId: unit.id, complaint: 'Low stage empty after a leak repair; no R13 in stock' } })).json()
  const reading = await request.post(`/api/cases/${opened.id}/readings`, { data: { readings: [{ quantity: 'ambientTemperature', value: 22, unit: 'C' }] } })
  expect(reading.status()).toBe(200)
  return { unitId: unit.id as number, unitName: unit.name as string, caseId: opened.id as number }
}

function consoleErrors(page: Page): string[] {
  const problems: string[] = []
  page.on('console', (m) => { if (m.type() === 'error' || /hydration/i.test(m.text())) problems.push(`${m.type()}: ${m.text()}`) })
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`))
  return problems
}

async function expectNoSidewaysScroll(page: Page) {
  expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1)).toBe(true)
}

/** Opens the planner of `where` for the low stage and plans R1150 on the same-standing-pressure basis, shown in psig. */
async function planEthylene(page: Page, where: ReturnType<Page['getByRole']>) {
  await where.getByRole('button', { name: 'Plan a substitute charge' }).click()
  const card = where.getByRole('region', { name: 'Substitute refrigerant: charge plan' })
  await expect(card.getByRole('textbox', { name: 'Charge on the nameplate (g)' })).toHaveValue('600')
  await expect(card.getByRole('textbox', { name: 'Volume of the stage (L)' })).toHaveValue('12')
  // The stage's design pressure comes from its nameplate record, in kPa abs.
  await expect(card.getByRole('textbox', { name: 'Design pressure, if known' })).toHaveValue('2600')
  await card.getByLabel('Substitute refrigerant').selectOption('R1150')
  await card.getByLabel('Show the pressure to charge to in').selectOption('psig')
  return card
}

for (const [size, viewport] of [['phone', PHONE], ['desktop', DESKTOP_WIDE]] as const) {
  test(`${size}: a plan chosen on the case page is saved on the unit and in the timeline; the calculator opened from the case checks against the design pressure`, async ({ page }) => {
    const problems = consoleErrors(page)
    await page.setViewportSize(viewport)
    await signIn(page, 'tech@rimecase.demo')
    const { unitId, unitName, caseId } = await unitWithCase(page.request)
    await gotoReady(page, `/cases/${caseId}`)

    // The expected standing pressure of the nameplate charge: gauge figure, "charge to this", and the way to the calculator for this stage.
    const charge = page.getByRole('region', { name: 'Standing pressure to charge to' })
    await expect(charge).toContainText('charge to this')
    await expect(charge).toContainText('psig')
    const link = charge.getByRole('link', { name: 'Plan or follow the charge in the calculator' })
    const href = await link.getAttribute('href')
    expect(href).toContain(`unit=${unitId}`)
    expect(href).toContain('stage=low')
    expect(href).toContain(`case=${caseId}`)
    expect(href).toContain('ambientC=22')
    expect(href).toContain('gauge=psig')

    const planner = page.getByRole('region', { name: 'Refill with another refrigerant' })
    const card = await planEthylene(page, planner)
    await expect(card.getByRole('textbox', { name: 'Ambient now (°C)' })).toHaveValue('22')
    const chargeTo = card.getByRole('status', { name: 'Substitution plan' }).getByLabel('Charge to')
    // 153.8 g and 137.6 psig: R13 (Platzer 1990) and R1150 (Smukala 2000) EOS via CoolProp 8.0.0, sea-level gauge (ISO 2533).
    await expect(chargeTo).toContainText('154 g of R1150')
    await expect(chargeTo).toContainText('137.6 psig')
    await expectNoSidewaysScroll(page)

    const save = card.getByRole('group', { name: 'Save this plan' })
    await save.getByLabel('Note with the plan (optional)').fill('Cylinder ETY-22')
    await save.getByRole('button', { name: `Save this plan on the unit and in case ${caseId}` }).click()
    await expect(planner.getByRole('status')).toContainText(`Saved on the unit and in case ${caseId}: the low stage of ${unitName} now holds 154 g of R1150`)
    // R13 is A1 and R1150 A3 (ASHRAE 34): the cautions of the change stay on screen after saving.
    await expect(planner.getByRole('list', { name: 'Before charging' })).toContainText('from A1 to A3')
    const timeline = page.getByRole('region', { name: 'Timeline' })
    await expect(timeline).toContainText('R13 replaced by R1150, 154 g')
    await expect(timeline).toContainText('Same standing pressure plan for 12 L')
    await expect(timeline).toContainText('Cylinder ETY-22')

    // The standing pressure to charge to now follows the stage's new fill.
    await expect(charge).toContainText('Low stage · R1150, 154 g')
    await expect(charge).toContainText('charge to this')
    // The calculator from the case: the stage (now R1150, 153.8 g), the room temperature, the gauge unit and the design pressure come along.
    await page.getByRole('region', { name: 'Standing pressure to charge to' }).getByRole('link', { name: 'Plan or follow the charge in the calculator' }).click()
    await expect(page.getByRole('heading', { level: 1, name: 'Calculator' })).toBeVisible()
    await expect(page.getByLabel('Refrigerant', { exact: true })).toHaveValue('R1150')
    const standing = page.getByRole('region', { name: 'Standing-pressure check' })
    await expect(standing.getByRole('textbox', { name: 'Ambient (°C)' })).toHaveValue('22')
    await expect(standing.getByTestId('design-pressure-note')).toContainText('2600 kPa abs')
    await expect(standing.getByLabel('Unit of the measured pressure')).toHaveValue('psig')
    // 2600 kPa abs = 24.987 bar g at sea level (1 bar = 100 kPa).
    await expect(standing.getByTestId('design-pressure-note')).toContainText('24.987 bar g')
    const calcPlan = page.getByRole('region', { name: 'Substitute refrigerant: charge plan' })
    await expect(calcPlan.getByRole('textbox', { name: 'Design pressure, if known' })).toHaveValue('2600')
    await expect(calcPlan.getByRole('button', { name: `Save this plan on the unit and in case ${caseId}` })).toBeVisible()
    await expectNoSidewaysScroll(page)
    expect(problems).toEqual([])
  })

  test(`${size}: the unit page saves a plan on the unit's nameplate history; a trainer may plan but not save`, async ({ page, browser }) => {
    const problems = consoleErrors(page)
    await page.setViewportSize(viewport)
    await signIn(page, 'tech@rimecase.demo')
    const { unitId } = await unitWithCase(page.request)
    await gotoReady(page, `/units/${unitId}`)
    const planner = page.getByRole('region', { name: 'Refill with another refrigerant' })
    const card = await planEthylene(page, planner)
    await card.getByRole('textbox', { name: 'Ambient now (°C)' }).fill('20')
    await card.getByRole('status', { name: 'Substitution plan' }).getByRole('radio', { name: 'Same mass' }).check()
    // 600 g of R1150 in 12 L stands far above the 2600 kPa abs design pressure: DANGER on the plan.
    await expect(card.getByRole('article', { name: 'Same mass' })).toContainText('DANGER')
    await card.getByRole('status', { name: 'Substitution plan' }).getByRole('radio', { name: 'Same standing pressure' }).check()
    await expectNoSidewaysScroll(page)
    await card.getByRole('group', { name: 'Save this plan' }).getByRole('button', { name: 'Save this plan on the unit' }).click()
    await expect(planner.getByRole('status')).toContainText('Saved on the unit: the low stage of')
    const history = page.getByRole('region', { name: 'Nameplate history' })
    await expect(history).toContainText(/Low stage: R13 600 g → R1150 1\d\d g/)
    await expect(history).toContainText('Same standing pressure plan for 12 L')
    await expect(history).toContainText('at 20.0 °C room')
    // The plan's standing pressure, kept as figures, is the stage's reference from now on.
    await expect(history).toContainText(/Stands at [\d.]+ kPag \([\d.]+ kPa abs\) at 20\.0 °C: the stage's reference standing pressure from then on/)

    // A refill recorded by hand with the standing pressure read after charging: half the pair is
    // refused in the form, the whole pair is kept (1000 kPag at sea level = 1101.3 kPa abs, ISO 2533).
    await history.getByRole('button', { name: 'Record a refill with another refrigerant' }).click()
    const refill = history.getByRole('form', { name: 'Record a refill' })
    await refill.getByLabel('Now filled with').selectOption('R1150')
    await refill.getByLabel('Charge (g)').fill('160')
    await refill.getByRole('textbox', { name: 'Standing pressure' }).fill('1000')
    await refill.getByRole('button', { name: 'Save on the nameplate record' }).click()
    await expect(refill.getByRole('alert')).toContainText('Give the standing pressure and the ambient it was read at together')
    await refill.getByRole('textbox', { name: 'Ambient (°C)' }).fill('21')
    await refill.getByRole('button', { name: 'Save on the nameplate record' }).click()
    await expect(history).toContainText('Stands at 1000 kPag (1101 kPa abs) at 21.0 °C')
    await expectNoSidewaysScroll(page)
    expect(problems).toEqual([])

    const trainerContext = await browser.newContext({ viewport })
    const trainer = await trainerContext.newPage()
    await signIn(trainer, 'trainer@rimecase.demo')
    await gotoReady(trainer, `/units/${unitId}`)
    const trainerPlanner = trainer.getByRole('region', { name: 'Refill with another refrigerant' })
    await trainerPlanner.getByRole('button', { name: 'Plan a substitute charge' }).click()
    await expect(trainerPlanner.getByRole('status', { name: 'Substitution plan' })).toBeVisible()
    await expect(trainerPlanner.getByRole('group', { name: 'Save this plan' })).toHaveCount(0)
    await trainerContext.close()
  })
}

for (const [size, viewport] of [['phone', PHONE], ['desktop', DESKTOP_WIDE]] as const) {
  test(`${size}: recharging in the case answers as gas goes in, by standing pressure and by weight, and each step lands in the timeline`, async ({ page }) => {
    const problems = consoleErrors(page)
    await page.setViewportSize(viewport)
    await signIn(page, 'tech@rimecase.demo')
    const { caseId } = await unitWithCase(page.request)
    await gotoReady(page, `/cases/${caseId}`)
    const form = page.getByRole('form', { name: 'Record a repair step' })
    await form.getByRole('combobox', { name: 'Step', exact: true }).selectOption({ label: 'Recharge' })
    await form.getByRole('combobox', { name: 'Stage', exact: true }).selectOption({ label: 'Low stage (R13)' })
    const now = form.getByRole('status', { name: 'Charge now' })

    // A settled standing pressure of 100 psig at 22 °C: the browser must show what the charging route answers.
    await form.getByLabel('Standing pressure, settled').fill('100')
    await form.getByLabel('Room temperature (°C)').fill('22')
    const byPressure = await (await page.request.post('/api/calculations/charging', { data: { designation: 'R13', volumeL: 12, ambientC: 22, targetChargeG: 600, pressure: 100, unit: 'psig' } })).json() as { chargeNowG: number; toGoG: number; percentOfTarget: number; target: { reading: { text: string } } }
    expect(byPressure.toGoG).toBeGreaterThan(0)
    await expect(now).toContainText(`${Math.round(byPressure.chargeNowG)} g`)
    await expect(now).toContainText(`Grams to go${Math.round(byPressure.toGoG)} g`)
    await expect(now).toContainText(`${Math.round(byPressure.percentOfTarget)} %`)
    await expect(now).toContainText(byPressure.target.reading.text)
    await expectNoSidewaysScroll(page)
    await form.getByRole('button', { name: 'Record this step' }).click()
    await expect(page.getByRole('heading', { level: 3, name: /Recharge · Low stage: Not finished/ })).toBeVisible()

    // Then by weight: 150 g on top of what the pressure showed gives the pressure to expect once settled.
    await form.getByLabel('How').selectOption({ label: 'By weight on a scale' })
    await form.getByLabel('Grams weighed in').fill('150')
    await form.getByLabel('Already in before (g, blank for an evacuated stage)').fill(String(Math.round(byPressure.chargeNowG)))
    await form.getByLabel('Room temperature (°C)').fill('22')
    const byWeight = await (await page.request.post('/api/calculations/charging', { data: { designation: 'R13', volumeL: 12, ambientC: 22, targetChargeG: 600, addedG: 150, startG: Math.round(byPressure.chargeNowG), unit: 'psig' } })).json() as { reading: { text: string } }
    await expect(now).toContainText(`Standing pressure to expect, settled${byWeight.reading.text}`)
    await form.getByRole('button', { name: 'Record this step' }).click()
    await expect(page.getByRole('heading', { level: 3, name: /Recharge · Low stage: Done/ })).toBeVisible()

    const timeline = page.getByRole('region', { name: 'Timeline' })
    await expect(timeline).toContainText('to go')
    await expect(timeline).toContainText(`150 g of R13 weighed in on top of ${Math.round(byPressure.chargeNowG)} g`)
    await expect(timeline).toContainText(`it should stand at ${byWeight.reading.text}`)
    expect(problems).toEqual([])
  })
}
