/**
 * Prints the source of `utils/planning/packing-data.ts`: the best arrangement `searchPacking`
 * finds for every n = 1…40 (deterministic; about 15 minutes on one core). Run from the
 * repository root:
 *
 *   npx tsx scripts/print-packing-data.ts > utils/planning/packing-data.ts
 */
import { formatPackingData, searchPacking } from '../utils/planning/packing-search'

const MAX_N = 40
console.log(formatPackingData(Array.from({ length: MAX_N }, (_, i) => searchPacking(i + 1))))
