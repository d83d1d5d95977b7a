import { describe, expect, it } from 'vitest'
import { loadConfig } from '../../../server/config/config'

describe('loadConfig', () => {
  it('defaults to the local services on loopback', () => {
    const config = loadConfig({})
    expect(new URL(config.DATABASE_URL).hostname).toBe('127.0.0.1')
    expect(new URL(config.S3_ENDPOINT).hostname).toBe('127.0.0.1')
    expect(new URL(config.SMTP_URL).hostname).toBe('127.0.0.1')
    expect(config.PORT).toBe(5180)
  })

  it('names every bad variable at start-up', () => {
    expect(() => loadConfig({ PORT: 'eighty', DATABASE_URL: 'not a url' })).toThrow(/PORT[\s\S]*DATABASE_URL|DATABASE_URL[\s\S]*PORT/)
  })
})
