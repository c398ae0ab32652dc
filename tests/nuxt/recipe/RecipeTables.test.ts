import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import RecipeProcessTable from '~/components/recipe/RecipeProcessTable.vue'
import RecipePressureTable from '~/components/recipe/RecipePressureTable.vue'
import type { JarSizeView } from '~/composables/useJarSizes'
import type { PressureBandView } from '~/composables/useRecipes'

const jar = (id: string, sizeKey: string, name: string, capacityMl: number): JarSizeView =>
  ({ id, sizeKey, name, capacityMl, outsideDiameterMm: 80, heightMm: 130, mouth: 'regular', dimensionsNote: '', capacitySource: 'NIST' })
const jarSizes = [jar('quart-regular', 'quart', 'Quart, regular mouth', 946.35), jar('pint-regular', 'pint', 'Pint, regular mouth', 473.18)]

const cells = (row: { findAll: (s: string) => Array<{ text: () => string }> }) => row.findAll('th, td').map(c => c.text().replace(/\s+/g, ' ').trim())

describe('RecipeProcessTable', () => {
  // USDA Complete Guide to Home Canning, Guide 4, dried beans hot pack: pints 75 min, quarts 90 min.
  it('lists the published minutes by jar size, smallest jar first', async () => {
    const wrapper = await mountSuspended(RecipeProcessTable, {
      props: { processMinutes: [{ jarKey: 'quart', minutes: 90 }, { jarKey: 'pint', minutes: 75 }], jarSizes },
    })
    const rows = wrapper.findAll('tbody tr').map(cells)
    expect(rows).toEqual([['Pint jars', '75 min'], ['Quart jars', '90 min']])
  })
})

describe('RecipePressureTable', () => {
  // CG Guide 4, Table 1 (dial) and Table 2 (weighted gauge: 10 psi at 0–1,000 ft, 15 psi above 1,000 ft).
  const bands: PressureBandView[] = [
    { gaugeType: 'weighted', minFt: 1001, maxFt: 2_147_483_647, psi: 15, source: 'CG Guide 4, Table 2' },
    { gaugeType: 'weighted', minFt: 0, maxFt: 1000, psi: 10, source: 'CG Guide 4, Table 2' },
    { gaugeType: 'dial', minFt: 0, maxFt: 2000, psi: 11, source: 'CG Guide 4, Table 1' },
    { gaugeType: 'dial', minFt: 2001, maxFt: 4000, psi: 12, source: 'CG Guide 4, Table 1' },
  ]

  it('shows the open-ended weighted band as "above 1,000 ft" and marks the household\'s band', async () => {
    const wrapper = await mountSuspended(RecipePressureTable, { props: { bands, altitudeFt: 2350, units: 'us' } })
    const weighted = wrapper.findAll('[data-gauge="weighted"] tbody tr').map(cells)
    expect(weighted).toEqual([['0–1,000 ft', '10 psi'], ['above 1,000 ft Your kitchen', '15 psi']])
    const dial = wrapper.findAll('[data-gauge="dial"] tbody tr').map(cells)
    expect(dial).toEqual([['0–2,000 ft', '11 psi'], ['2,001–4,000 ft Your kitchen', '12 psi']])
    expect(wrapper.text()).not.toContain('2,147,483,647')
  })

  it('adds metres for a metric household and refuses a dial pressure above 8,000 ft', async () => {
    const wrapper = await mountSuspended(RecipePressureTable, { props: { bands, altitudeFt: 9000, units: 'metric' } })
    // 1,000 ft = 304.8 m (convert-units), shown to the whole metre.
    expect(wrapper.find('[data-gauge="weighted"] tbody tr:last-child th').text()).toContain('above 1,000 ft (305 m)')
    expect(wrapper.text()).toContain('No dial-gauge pressure above 8,000 ft')
  })
})
