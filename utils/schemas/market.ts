import { z } from './z'

export const MarketCheckSchema = z.object({
  itemKey: z.string().min(1, 'Say which item.').max(200),
  checked: z.boolean({ invalid_type_error: 'Say checked true or false.' }),
})

/** A stable key for a market list item: its kind and what it refers to. */
export function marketItemKey(item: { kind: string, ref?: string, item: string }): string {
  return `${item.kind}:${item.ref ?? item.item}`
}
