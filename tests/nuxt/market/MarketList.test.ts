import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import MarketList from '~/components/market/MarketList.vue'
import type { CostSummary, ShoppingItem } from '~/utils/planning'

const base = { optional: false, atHome: false }
const items: ShoppingItem[] = [
  { ...base, key: 'ingredient:pinto', kind: 'ingredient', item: 'Pinto beans', quantity: 2900, unit: 'g', display: '6 lb 6 oz', ref: 'pinto', packages: [{ size: 1814.37, count: 1, priceCents: 629, label: '4 lb' }, { size: 907.18, count: 1, priceCents: 349, label: '2 lb' }], cost: 978, leftover: 0 },
  { ...base, key: 'lid:regular', kind: 'lid', item: 'Lids, regular mouth', quantity: 18, unit: 'count', display: '18 lids', ref: 'regular', packages: [{ size: 12, count: 2, priceCents: 379, label: 'pack of 12' }], cost: 758, leftover: 6 },
  { ...base, key: 'salt:Canning salt', kind: 'salt', item: 'Canning salt', quantity: 27, unit: 'g', display: '1 oz', packages: [], cost: null, leftover: 0, optional: true },
]
const cost: CostSummary = {
  perJar: 81, total: 1458, storeEquivalent: 2142, storeCans: 18, storeCansPerJar: [{ jarSizeId: 'pint-regular', cans: 1 }], saving: 684,
  savingPerYear: null, usePerMonth: null, shoppingTotal: 1736, shoppingOptional: 0,
  breakdown: { goods: 900, salt: 0, lids: 558, vinegar: 0, jars: 0 }, incomplete: true, missingPrices: ['Canning salt'],
}
const props = { items, cost, jars: 18, currency: 'USD', jarNames: { 'pint-regular': 'Pint, regular mouth' } }

describe('Market list', () => {
  it('lists each item with its packages and prices, the totals, and names the missing price', async () => {
    const wrapper = await mountSuspended(MarketList, { props: { ...props, checks: null } })
    const rows = wrapper.findAll('[data-testid="market-row"]')
    expect(rows).toHaveLength(3)
    expect(rows[0]!.text()).toContain('1 × 4 lb + 1 × 2 lb')
    expect(rows[0]!.text()).toContain('$9.78')
    expect(rows[2]!.text()).toContain('no price')
    expect(wrapper.find('[data-testid="market-total"]').text()).toContain('$17.36')
    expect(wrapper.find('[data-testid="market-total"]').text()).toContain('No price on the household list for Canning salt')
    expect(wrapper.text()).toContain('$0.81')
    expect(wrapper.text()).toContain('a pint = 1 can')
    expect(wrapper.findAll('input[type="checkbox"]')).toHaveLength(0)
  })

  it('money in the household\'s currency (Intl.NumberFormat)', async () => {
    const wrapper = await mountSuspended(MarketList, { props: { ...props, currency: 'EUR', checks: null } })
    expect(wrapper.find('[data-testid="market-total"]').text()).toContain(new Intl.NumberFormat('en-US', { style: 'currency', currency: 'EUR' }).format(17.36))
  })

  it('no prices at all: says which prices are missing instead of $0.00', async () => {
    const none: CostSummary = { ...cost, perJar: 0, total: 0, saving: 2142, missingPrices: ['Pinto beans', 'Lids, regular mouth'] }
    const wrapper = await mountSuspended(MarketList, { props: { ...props, cost: none, checks: null } })
    expect(wrapper.text()).not.toContain('$0.00')
    expect(wrapper.find('[data-testid="missing-prices"]').text()).toContain('Pinto beans, Lids, regular mouth')
  })

  it('sorts by cost and shows who checked what off; a tick asks to check it off as bought, a button as at home', async () => {
    const wrapper = await mountSuspended(MarketList, { props: { ...props, checks: { 'lid:regular': { by: 'Wren', state: 'bought' } } } })
    expect(wrapper.text()).toContain('1 of 3 items checked off')
    expect(wrapper.text()).toContain('checked by Wren')
    expect(wrapper.find('[data-testid="still-to-buy"]').text()).toBe('$9.78')
    await wrapper.findAll('button').find(b => b.text() === 'By cost')!.trigger('click')
    const names = wrapper.findAll('[data-testid="market-row"]').map(r => r.find('p.font-bold').text())
    expect(names).toEqual(['Pinto beans', 'Lids, regular mouth', 'Canning salt'])
    await wrapper.findAll('input[type="checkbox"]')[0]!.setValue(true)
    await wrapper.findAll('button').find(b => b.text() === 'Have it at home')!.trigger('click')
    expect(wrapper.emitted('toggle')).toEqual([['ingredient:pinto', true, 'bought'], ['ingredient:pinto', true, 'at-home']])
  })
})
