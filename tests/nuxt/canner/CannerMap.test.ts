import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import CannerMap from '~/components/canner/CannerMap.vue'
import { PACKOMANIA_RATIOS, layoutLayer } from '~/utils/planning'

async function draw(cannerMm: number, jarMm: number, jarsByLayer: number[]) {
  const layout = layoutLayer(cannerMm, jarMm, 6)
  const wrapper = await mountSuspended(CannerMap, {
    props: {
      cannerName: 'Test canner', jarName: 'Pint', cannerDiameterMm: cannerMm, jarDiameterMm: jarMm,
      jarHeightMm: 135, usableHeightMm: 320, rackThicknessMm: 6, waterDepthMm: 76,
      positions: layout.positions, jarsByLayer,
    },
  })
  return { wrapper, layout }
}

describe('Canner map', () => {
  it('draws exactly the jars of the layer the planner counted, all inside the wall and none overlapping', async () => {
    // 310 mm canner, 76.2 mm (3 in) pints + 6 mm clearance: Packomania R/r for 9 is 3.6131, for 10 is 3.8130
    const { wrapper, layout } = await draw(310, 76.2, [9, 6])
    expect(310 / (76.2 + 6)).toBeGreaterThanOrEqual(PACKOMANIA_RATIOS[9 - 1]!)
    expect(310 / (76.2 + 6)).toBeLessThan(3.813025631398) // Packomania n = 10
    expect(layout.perLayer).toBe(9)
    const top = wrapper.get('[data-testid="canner-top"]')
    const jars = top.findAll('circle[data-jar]')
    expect(jars).toHaveLength(9)
    expect(top.findAll('circle[data-jar="filled"]')).toHaveLength(9)
    const wallR = Number(top.get('circle[data-wall]').attributes('r'))
    expect(wallR).toBe(155)
    const circles = jars.map(c => ({ x: Number(c.attributes('cx')), y: Number(c.attributes('cy')), r: Number(c.attributes('r')) }))
    for (const c of circles) expect(Math.hypot(c.x, c.y) + c.r).toBeLessThanOrEqual(wallR + 1e-9)
    for (let i = 0; i < circles.length; i++) {
      for (let j = i + 1; j < circles.length; j++) {
        expect(Math.hypot(circles[i]!.x - circles[j]!.x, circles[i]!.y - circles[j]!.y)).toBeGreaterThanOrEqual(circles[i]!.r + circles[j]!.r - 1e-9)
      }
    }
  })

  it('shows the second layer with empty places dashed, and names the layers for screen readers', async () => {
    const { wrapper } = await draw(310, 76.2, [9, 6])
    await wrapper.findAll('button').find(b => b.text().startsWith('Layer 2'))!.trigger('click')
    const top = wrapper.get('[data-testid="canner-top"]')
    expect(top.findAll('circle[data-jar="filled"]')).toHaveLength(6)
    expect(top.findAll('circle[data-jar="empty"]')).toHaveLength(3)
    expect(top.get('title').text()).toMatch(/layer 2 holds 6 of 9 places/)
    expect(wrapper.get('[data-testid="canner-side"] title').text()).toMatch(/2 layers \(9 \+ 6 jars\)/)
  })
})
