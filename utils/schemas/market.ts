import { marketCheckStates } from '../vocabulary'
import { z } from './z'

export const MarketCheckSchema = z.object({
  itemKey: z.string().min(1, 'Say which item.').max(200),
  checked: z.boolean({ invalid_type_error: 'Say checked true or false.' }),
  /** How it was checked off: bought at the store, or already at home (left out of the total). */
  state: z.enum(marketCheckStates, { errorMap: () => ({ message: 'Say whether it was bought or is already at home.' }) }).default('bought'),
})
