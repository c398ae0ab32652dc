import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import HouseholdCanners from '~/components/household/HouseholdCanners.vue'
import type { CannerView } from '~/composables/useCanners'

const canner = (extra: Partial<CannerView>): CannerView => ({
  id: 'c1', householdId: 'h', createdAt: '2025-01-01T00:00:00.000Z', updatedAt: '2025-01-01T00:00:00.000Z', name: 'Everyday canner', innerDiameterMm: 304.8, usableHeightMm: 228.6, rackThicknessMm: 6.35,
  gaugeType: 'dial', maxLayers: 1, waterDepthMm: 76.2, lastGaugeTestAt: '2025-09-20', gaugeTestDue: true, ...extra,
})
const noWrites = { onSave: async () => {}, onRemove: async () => {} }
const values = (wrapper: { findAll: (s: string) => Array<{ text: () => string }> }) => wrapper.findAll('dd').map(d => d.text())

describe('HouseholdCanners', () => {
  // 12 in = 304.8 mm and 9 in = 228.6 mm exactly (NIST inch); convert-units does the conversion.
  it('shows measurements in inches for a US household and in mm for a metric one', async () => {
    const us = await mountSuspended(HouseholdCanners, { props: { ...noWrites, canners: [canner({})], units: 'us', canEdit: false } })
    expect(values(us)).toEqual(['12 in', '9 in', '1', '¼ in', '3 in'])
    const metric = await mountSuspended(HouseholdCanners, { props: { ...noWrites, canners: [canner({})], units: 'metric', canEdit: false } })
    expect(values(metric)).toEqual(['305 mm', '229 mm', '1', '6 mm', '76 mm'])
  })

  it('cautions that a due dial gauge needs testing, and offers no changes to a non-owner', async () => {
    const wrapper = await mountSuspended(HouseholdCanners, { props: { ...noWrites, canners: [canner({})], units: 'us', canEdit: false } })
    const caution = wrapper.find('[role="note"]')
    expect(caution.text()).toContain('Gauge test due')
    expect(caution.text()).toContain('Sep 20, 2025')
    expect(wrapper.text()).not.toContain('Add a canner')
    const weighted = await mountSuspended(HouseholdCanners, {
      props: { ...noWrites, canners: [canner({ gaugeType: 'weighted', lastGaugeTestAt: null, gaugeTestDue: false })], units: 'us', canEdit: true },
    })
    expect(weighted.find('[role="note"]').exists()).toBe(false)
    expect(weighted.text()).toContain('A weighted gauge needs no accuracy test.')
    expect(weighted.text()).toContain('Add a canner')
  })
})
