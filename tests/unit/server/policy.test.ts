import { describe, expect, it } from 'vitest'
import { relationAllows, skaterAccessByRelation } from '../../../server/services/policy'

describe('skater access policy', () => {
  it('grants the owner every mode and no one else manage', () => {
    for (const mode of ['read', 'write', 'annotate', 'manage'] as const) expect(relationAllows(['owner'], mode)).toBe(true)
    expect(relationAllows(['coach', 'shop'], 'manage')).toBe(false)
  })

  it('lets a coach read and annotate but not write, and a shop read and write but not annotate', () => {
    expect(skaterAccessByRelation.coach).toEqual(['read', 'annotate'])
    expect(relationAllows(['coach'], 'write')).toBe(false)
    expect(relationAllows(['shop'], 'write')).toBe(true)
    expect(relationAllows(['shop'], 'annotate')).toBe(false)
    expect(relationAllows(['coach', 'shop'], 'write')).toBe(true)
  })

  it('grants nothing without a relation', () => {
    expect(relationAllows([], 'read')).toBe(false)
  })
})
