import { describe, expect, it } from 'vitest'
import { SnakeNamingStrategy } from '../../../server/db/snake-naming.strategy'

describe('SnakeNamingStrategy', () => {
  const strategy = new SnakeNamingStrategy()

  it('pluralises and snake-cases table names', () => {
    expect(strategy.tableName('OutboundMail')).toBe('outbound_mails')
    expect(strategy.tableName('Blade', 'custom_blades')).toBe('custom_blades')
  })

  it('snake-cases columns, embedded prefixes and join columns', () => {
    expect(strategy.columnName('heelLiftMm', undefined, [])).toBe('heel_lift_mm')
    expect(strategy.columnName('x', undefined, ['touchPoint'])).toBe('touch_point_x')
    expect(strategy.joinColumnName('skaterProfile', 'id')).toBe('skater_profile_id')
  })
})
