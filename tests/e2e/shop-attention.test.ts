import { randomBytes, randomUUID } from 'node:crypto'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { AnalysisResult } from '../../shared/schemas/analysis'
import { resultOf } from '../factories/analysis-results'
import { baseUrl, launchBrowser } from '../support/browser'
import { api, createVerifiedPerson, signInPage } from '../support/e2e-people'

const tag = randomBytes(3).toString('hex')
const skaterEmail = `ref-skater-${tag}@example.test`
const shopEmail = `ref-shop-${tag}@example.test`

/** Measured analyses written straight into the app's database: the engine is exercised by blade-photo.test.ts. */
async function storeMeasured(db: pg.Client, bladeId: string, result: AnalysisResult): Promise<string> {
  const [photoId, id] = [randomUUID(), randomUUID()]
  await db.query(`INSERT INTO photos (id, blade_id, storage_key, sha256, content_type, width, height, bytes)
    VALUES ($1, $2, $3, $4, 'image/jpeg', 4000, 3000, 1)`, [photoId, bladeId, `e2e/${photoId}`, photoId])
  await db.query(`INSERT INTO analyses (id, blade_id, photo_id, status, result, algorithm_version, finished_at)
    VALUES ($1, $2, $3, 'measured', $4, 'test-model', now())`, [id, bladeId, photoId, JSON.stringify(result)])
  return id
}

describe('a shop\u2019s bench: what needs attention, its default targets and its reference profiles, in a real browser', () => {
  let skaterBrowser: Awaited<ReturnType<typeof launchBrowser>>
  let shopBrowser: Awaited<ReturnType<typeof launchBrowser>>
  const db = new pg.Client({ connectionString: process.env.E2E_DATABASE_URL })

  beforeAll(async () => {
    ;[skaterBrowser, shopBrowser] = await Promise.all([launchBrowser(), launchBrowser()])
    await db.connect()
    await createVerifiedPerson(skaterEmail, 'Skater Ines', { skates: true, coaches: false })
    await createVerifiedPerson(shopEmail, 'Sharpener Odo', { skates: false, coaches: true })
  })
  afterAll(async () => {
    await skaterBrowser?.dispose()
    await shopBrowser?.dispose()
    await db.end()
  })

  it('lists the off-target blade first on Home, takes a shop default, and compares a blade with the shop reference', async () => {
    const shopPage = await shopBrowser.newPage()
    await signInPage(shopPage, shopEmail)
    const shop = await api<{ id: string }>(shopPage, 'POST', '/shops', { name: `Edge Bench ${tag}` })

    const page = await skaterBrowser.newPage()
    await signInPage(page, skaterEmail)
    const skater = await api<{ id: string }>(page, 'POST', '/skaters', { name: 'Ines' })
    const pair = await api<{ blades: { id: string; side: string }[] }>(page, 'POST', `/skaters/${skater.id}/pairs`, { label: 'Club skates', sizeIn: 10, discipline: 'freestyle' })
    const [left, right] = ['left', 'right'].map((s) => pair.blades.find((b) => b.side === s)!.id)
    for (const id of [left, right]) {
      await page.request.fetch(`${baseUrl()}/api/blades/${id}`, { method: 'PATCH', data: { modelLabel: 'Test Model B' }, headers: { Origin: new URL(baseUrl()).origin } })
    }
    await api(page, 'POST', `/skaters/${skater.id}/shares/shop`, { shopId: shop.id })
    const fresh = await storeMeasured(db, left, resultOf({ touchPointMm: 40, heelLiftMm: 25 }))
    // Touch point 48 mm against 35–45 mm (DESIGN.md §5): off target, and 8 mm from the left blade.
    const worn = await storeMeasured(db, right, resultOf({ model: { sizeIn: 10, toe: 'right' }, removedMm: 0.2, touchPointMm: 48, heelLiftMm: 25 }))

    await shopPage.goto(`${baseUrl()}/`)
    const first = shopPage.locator('.attention__list li').first()
    await first.waitFor()
    expect(await first.textContent()).toMatch(/Ines · Club skates · right.*act now.*needs a re-profile; touch point off target; left and right differ/)

    await shopPage.goto(`${baseUrl()}/shop`)
    const heel = shopPage.locator('tr[data-shop-target="heelLiftMm"]')
    await heel.waitFor()
    await shopPage.locator('.shop-targets__form .n-base-selection').click()
    await shopPage.locator('.n-base-select-option', { hasText: /^Heel lift$/ }).click()
    await shopPage.getByLabel('Shop lower limit').fill('18')
    await shopPage.getByLabel('Shop upper limit').fill('30')
    await shopPage.getByRole('button', { name: 'Set shop default' }).click()
    await shopPage.waitForFunction(() => document.querySelector('tr[data-shop-target="heelLiftMm"]')?.textContent?.includes('18–30 mm'))
    expect(await heel.textContent()).toContain('this shop, Sharpener Odo')

    await shopPage.getByLabel('Minimum runner height').fill('22.5')
    await shopPage.getByRole('button', { name: 'Save minimum' }).click()
    await shopPage.getByText('Minimum runner height saved').waitFor()

    await api(shopPage, 'POST', `/shops/${shop.id}/reference-profiles`, { analysisId: fresh })
    await shopPage.goto(`${baseUrl()}/compare?reference=${worn}`)
    await shopPage.getByText('What changed').waitFor()
    expect(await shopPage.locator('h1').textContent()).toContain('Against the shop\u2019s reference')
    expect(await shopPage.locator('.notes').textContent()).toContain(`Reference: Test Model B, 10 in, kept by Edge Bench ${tag}`)
    await shopPage.screenshot({ path: '/tmp/t6/compare-reference.png', fullPage: true }).catch(() => undefined)

    await page.goto(`${baseUrl()}/blades/${right}`)
    const heelTarget = page.locator('tr[data-target="heelLiftMm"]')
    await heelTarget.waitFor()
    expect(await heelTarget.textContent()).toMatch(/18–30 mm.*shop default \(Edge Bench/)
    expect(await page.locator('[data-part="runner-height"]').textContent()).toContain(`The shop's minimum is 22.5 mm (Edge Bench ${tag})`)
  })
})
