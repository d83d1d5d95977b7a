import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { baseUrl, launchBrowser } from '../support/browser'

describe('app shell in a real browser', () => {
  let browser: Awaited<ReturnType<typeof launchBrowser>>

  beforeAll(async () => {
    browser = await launchBrowser()
  })
  afterAll(() => browser.dispose())

  it('renders the shell in IBM Plex Sans, served by the app itself, and shows every service running', async () => {
    const page = await browser.newPage()
    const foreignRequests: string[] = []
    page.on('request', (req) => {
      if (!req.url().startsWith(baseUrl()) && !req.url().startsWith('data:')) foreignRequests.push(req.url())
    })
    await page.goto(baseUrl())
    await page.getByRole('heading', { name: 'Service status' }).waitFor()
    await page.locator('[data-service="queue"]').waitFor()

    const font = await page.evaluate(async () => {
      await document.fonts.ready
      const family = getComputedStyle(document.querySelector('h1')!).fontFamily
      const loaded = [...document.fonts].filter((f) => f.family.includes('IBM Plex Sans') && f.status === 'loaded')
      return { family, loaded: loaded.length }
    })
    expect(font.family).toMatch(/^"?IBM Plex Sans"?/)
    expect(font.loaded).toBeGreaterThan(0)
    expect(foreignRequests).toEqual([])

    const states = await page.locator('[data-service] .state').allTextContents()
    expect(states).toEqual(['running', 'running', 'running', 'running'])
    await expect(page.getByRole('navigation', { name: 'Main' }).isVisible()).resolves.toBe(true)
    await page.close()
  })

  it('shows a not-found page for an unknown address', async () => {
    const page = await browser.newPage()
    await page.goto(`${baseUrl()}/no/such/page`)
    await page.getByText('Page not found').waitFor()
    await page.close()
  })
})
