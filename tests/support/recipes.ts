/**
 * A shared tested recipe as a site admin would enter it, copied from USDA Complete Guide to Home
 * Canning (2015), Guide 4 "Beans or peas—shelled, dried, all varieties" (reference §1): pints
 * 75 min and quarts 90 min; dial gauge 11/12/13/14 psi in 2,000 ft bands to 8,000 ft (Table 1);
 * weighted gauge 10 psi to 1,000 ft, 15 psi above (Table 2); 3¼ lb per 9 pints, ¾ lb per
 * quart; ½ tsp salt per pint, 1 tsp per quart; 1 inch headspace.
 */
import convert from 'convert-units'

const lb = (n: number) => convert(n).from('lb').to('g')

export function libraryRecipe(overrides: Record<string, unknown> = {}) {
  return {
    name: 'Black-eyed peas, dried, hot pack',
    ingredientId: 'black-eyed-peas',
    packStyle: 'hot',
    fillBasis: 'published',
    // NIST: 1 in = 25.4 mm exactly (convert-units gives 25.3999992).
    headspaceMm: 25.4,
    solidsFillFraction: 1,
    summary: 'Dried peas soaked, boiled 30 minutes and packed hot in their cooking water.',
    steps: 'Soak 12 to 18 hours in a cool place, or boil 2 minutes and soak 1 hour. Drain, cover with fresh water and boil 30 minutes. Fill jars with peas and cooking water, leaving 1 inch headspace.',
    source: 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 4 "Beans or peas—shelled, dried, all varieties"',
    caution: null,
    prep: { soak: 'either', cook: { label: 'drain, cover with fresh water and boil 30 minutes', minutes: 30 }, source: 'CG Guide 4: soak 12–18 h or boil 2 min and stand 1 h; boil 30 min' },
    jars: [
      { sizeKey: 'pint', processMinutes: 75, dryGrams: lb(3.25) / 9, saltTsp: 0.5 },
      { sizeKey: 'quart', processMinutes: 90, dryGrams: lb(0.75), saltTsp: 1 },
    ],
    pressureBands: [
      { gaugeType: 'dial', minFt: 0, maxFt: 2000, psi: 11, source: 'CG Guide 4, Table 1' },
      { gaugeType: 'dial', minFt: 2001, maxFt: 4000, psi: 12, source: 'CG Guide 4, Table 1' },
      { gaugeType: 'dial', minFt: 4001, maxFt: 6000, psi: 13, source: 'CG Guide 4, Table 1' },
      { gaugeType: 'dial', minFt: 6001, maxFt: 8000, psi: 14, source: 'CG Guide 4, Table 1' },
      { gaugeType: 'weighted', minFt: 0, maxFt: 1000, psi: 10, source: 'CG Guide 4, Table 2' },
      { gaugeType: 'weighted', minFt: 1001, maxFt: null, psi: 15, source: 'CG Guide 4, Table 2' },
    ],
    reason: 'Added from the USDA Complete Guide, Guide 4 (dried peas share the bean table).',
    ...overrides,
  }
}
