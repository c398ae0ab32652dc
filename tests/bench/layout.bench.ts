import { bench, describe } from 'vitest'
import { layoutLayer } from '~~/utils/planning'

// Time to lay out one layer for 1…40 jars: a canner just big enough for n jars of 76.2 mm.
const jar = 76.2
const clearance = 6
describe('layoutLayer (jars per layer with drawn positions)', () => {
  for (const n of [1, 2, 5, 9, 12, 19, 25, 30, 40]) {
    // Grow the canner until the layout holds n jars; the bench then times that one call.
    let diameter = jar + clearance
    while (layoutLayer(diameter, jar, clearance).perLayer < n) diameter += 2
    bench(`${n} jars per layer (canner ${Math.round(diameter)} mm)`, () => {
      layoutLayer(diameter, jar, clearance)
    })
  }
})
