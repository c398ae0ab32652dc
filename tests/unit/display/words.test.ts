import { describe, expect, it } from 'vitest'
import { formatMoney, recipeOptions } from '~~/utils/display'
import { formatDuration } from '~~/utils/time'

describe('words a canner reads', () => {
  it('a length of time reads the same everywhere: "5 h", "5 h 20 min", "45 min"', () => {
    expect([formatDuration(300), formatDuration(320), formatDuration(45), formatDuration(0)]).toEqual(['5 h', '5 h 20 min', '45 min', '0 min'])
  })
  it('money in the household\'s currency, as Intl.NumberFormat writes it', () => {
    for (const currency of ['USD', 'CAD', 'EUR', 'GBP']) {
      expect(formatMoney(1396, currency)).toBe(new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(13.96))
    }
    expect(formatMoney(1396)).toBe('$13.96')
  })
  it('recipe pickers list tested recipes before house recipes and hide retired ones', () => {
    const options = recipeOptions([
      { id: 'h', name: 'Our pintos', status: 'house' },
      { id: 't', name: 'Dried beans, hot pack', status: 'tested' },
      { id: 'r', name: 'Old table', status: 'tested', retired: 'Retired 2026-01-01.' },
    ])
    expect(options).toEqual([{ value: 't', label: 'Dried beans, hot pack' }, { value: 'h', label: 'Our pintos (house, untested)' }])
    expect(recipeOptions([{ id: 'r', name: 'Old table', status: 'tested', retired: 'x' }], 'r')).toEqual([{ value: 'r', label: 'Old table (retired)' }])
  })
})
