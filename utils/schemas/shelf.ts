/** Schemas of the Shelf: taking jars off, labels and the inventory CSV. */
import { z } from './z'

const uuid = (what: string) => z.string({ required_error: `Choose the ${what}.`, invalid_type_error: `Choose the ${what}.` }).uuid(`That ${what} id is not valid.`)

export const TakeOffSchema = z.object({
  items: z.array(z.object({
    lotId: uuid('lot'),
    jars: z.number({ required_error: 'Enter how many jars.', invalid_type_error: 'Enter how many jars.' }).int('Enter whole jars.').min(1, 'Take off at least 1 jar.').max(500, 'That is more jars than a lot holds.'),
  })).min(1, 'Choose the jars to take off.').max(50)
    .refine(items => new Set(items.map(i => i.lotId)).size === items.length, 'Name each lot once.'),
  /** Return the emptied jars to the household's jar stock (the default). */
  returnJars: z.boolean().default(true),
})
export type TakeOffInput = z.infer<typeof TakeOffSchema>

export const FridgeParamsSchema = z.object({ id: uuid('household'), itemId: uuid('refrigerator item') })

export const labelLayouts = ['sheet-30', 'plain'] as const
export const LabelQuerySchema = z.object({
  lots: z.string().max(4000).optional(),
  layout: z.enum(labelLayouts, { errorMap: () => ({ message: 'Choose the 30-up label sheet or plain paper.' }) }).default('sheet-30'),
})

/** The columns of the Shelf CSV, in order: export writes them, import reads them. */
export const shelfCsvColumns = ['product', 'recipe_id', 'jar_size', 'jars', 'canned_on', 'best_by', 'load_code'] as const

const isoDate = (what: string) => z.string().trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, `Write the ${what} as YYYY-MM-DD.`)
  .refine(s => !Number.isNaN(Date.parse(s)) && new Date(s).toISOString().slice(0, 10) === s, 'That date does not exist.')

/** One row of an imported inventory, before the jar size and recipe are checked against the catalogue. */
export const ShelfCsvRowSchema = z.object({
  product: z.string().trim().min(1, 'Name the product, for example "Pinto beans, hot pack".').max(120, 'Keep the product under 120 characters.'),
  recipe_id: z.string().trim().max(120).optional().transform(s => s || undefined),
  jar_size: z.string().trim().min(1, 'Give the jar size id, for example pint-regular.'),
  jars: z.string().trim().regex(/^\d+$/, 'Write the number of jars as a whole number.').transform(Number)
    .pipe(z.number().min(1, 'A lot holds at least 1 jar.').max(500, 'More than 500 jars in one lot looks like a typing slip.')),
  canned_on: isoDate('canned date'),
  best_by: z.string().trim().optional().transform(s => s || undefined).pipe(isoDate('best-by date').optional()),
  load_code: z.string().trim().max(40, 'Keep the load code under 40 characters.').optional().transform(s => s ?? ''),
})
export type ShelfCsvRow = z.infer<typeof ShelfCsvRowSchema>
