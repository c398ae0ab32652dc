import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import MarketList from '~/components/market/MarketList.vue'
import type { CostSummary, ShoppingItem } from '~/utils/planning'

const items: ShoppingItem[] = [
  { kind: 'ingredient', item: 'Pinto beans', quantity: 2900, unit: 'g', display: '6 lb 6 oz', ref: 'pinto', packages: [{ size: 1814.37, count: 1, priceCents: 629, label: '4 lb' }, { size: 907.18, count: 1, priceCents: 349, label: '2 lb' }], cost: 978, leftover: 0 },
  { kind: 'lid', item: 'Lids, regular mouth', quantity: 18, unit: 'count', display: '18 lids', ref: 'regular', packages: [{ size: 12, count: 2, priceCents: 379, label: 'pack of 12' }], cost: 758, leftover: 6 },
  { kind: 'salt', item: 'Canning salt', quantity: 27, unit: 'g', display: '1 oz', packages: [], cost: null, leftover: 0 },
]
const cost: CostSummary = { perJar: 81, total: 1458, storeEquivalent: 2142, saving: 684, savingPerYear: null, shoppingTotal: 1736, breakdown: { goods: 900, salt: 0, lids: 558, vinegar: 0, jars: 0 }, incomplete: true }

describe('Market list', () => {
  it('lists each item with its packages and prices, and the totals', async () => {
    const wrapper = await mountSuspended(MarketList, { props: { items, cost, jars: 18, checks: null } })
    const rows = wrapper.findAll('[data-testid="market-row"]')
    expect(rows).toHaveLength(3)
    expect(rows[0]!.text()).toContain('1 × 4 lb + 1 × 2 lb')
    expect(rows[0]!.text()).toContain('$9.78')
    expect(rows[2]!.text()).toContain('no price on the list')
    expect(wrapper.text()).toContain('$17.36')
    expect(wrapper.text()).toContain('$0.81')
    expect(wrapper.findAll('input[type="checkbox"]')).toHaveLength(0)
  })

  it('sorts by cost and shows who checked what off; a click asks to toggle', async () => {
    const wrapper = await mountSuspended(MarketList, { props: { items, cost, jars: 18, checks: { 'lid:regular': 'Wren' } } })
    expect(wrapper.text()).toContain('1 of 3 items checked off')
    expect(wrapper.text()).toContain('checked by Wren')
    await wrapper.findAll('button').find(b => b.text().startsWith('Cost'))!.trigger('click')
    const names = wrapper.findAll('[data-testid="market-row"]').map(r => r.find('td:nth-child(2) span').text())
    expect(names).toEqual(['Canning salt', 'Lids, regular mouth', 'Pinto beans'])
    await wrapper.findAll('input[type="checkbox"]')[2]!.setValue(true)
    expect(wrapper.emitted('toggle')).toEqual([['ingredient:pinto', true]])
  })
})
