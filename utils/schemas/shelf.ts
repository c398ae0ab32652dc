/** Schemas of the Shelf: taking jars off, correcting a lot, labels and the inventory CSV. */
import { labelLayouts, shelfCorrectionCauses } from '../vocabulary'
import { inPlausibleYears, numberField, PLAUSIBLE_YEARS_MESSAGE, queryWholeNumber } from './fields'
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

export const ShelfLotParamsSchema = z.object({ id: uuid('household'), lotId: uuid('lot') })

/** Undo the household's latest take-off; with `batchId`, only if that take-off is still the latest. */
export const UndoSchema = z.object({ batchId: uuid('take-off').optional() }).default({})

/**
 * Put a lot's count right without calling it use: the jars really on the Shelf now, and why.
 * A lot recorded by mistake leaves whole; broken, lost or thrown-out jars only ever leave.
 */
export const ShelfCorrectionSchema = z.object({
  jarsLeft: numberField('Enter how many jars of this lot are on the Shelf now.', {
    whole: true, fraction: 'Enter whole jars.', min: 0, low: 'Enter 0 or more jars.', max: 500, high: 'More than 500 jars in one lot looks like a typing slip.',
  }),
  cause: z.enum(shelfCorrectionCauses, { errorMap: () => ({ message: 'Say what happened to the jars.' }) }),
  note: z.string({ invalid_type_error: 'Write the note as text.' }).trim().max(200, 'Keep the note under 200 characters.').default(''),
}).superRefine((body, ctx) => {
  if (body.cause === 'mistake' && body.jarsLeft !== 0) {
    ctx.addIssue({ code: 'custom', path: ['jarsLeft'], message: 'A lot recorded by mistake leaves the Shelf whole: enter 0 jars.' })
  }
})
export type ShelfCorrectionInput = z.infer<typeof ShelfCorrectionSchema>

const labelsPerLot = queryWholeNumber('Print from 1 to 300 labels of a lot.', 1, 300)
/**
 * The labels to print: the lots named by id, or one load's lots, or the whole Shelf; one label
 * per jar left, or `count` labels of each lot.
 */
export const LabelQuerySchema = z.object({
  lots: z.string({ invalid_type_error: 'Choose the lots to label.' }).max(4000, 'Choose fewer lots at a time.').optional(),
  load: uuid('load').optional(),
  count: labelsPerLot.optional(),
  layout: z.enum(labelLayouts, { errorMap: () => ({ message: 'Choose a label sheet (30 per US letter page, 24 per A4 page) or plain paper.' }) }).default('sheet-30'),
})
export type LabelQuery = z.infer<typeof LabelQuerySchema>

/** The columns of the Shelf CSV, in order: export writes them, import reads them. */
export const shelfCsvColumns = ['product', 'recipe_id', 'jar_size', 'jars', 'canned_on', 'best_by', 'load_code', 'lot_id'] as const

const isoDate = (what: string) => z.string().trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, `Write the ${what} as YYYY-MM-DD.`)
  .refine(s => !Number.isNaN(Date.parse(s)) && new Date(s).toISOString().slice(0, 10) === s, 'That date does not exist.')
  .refine(inPlausibleYears, PLAUSIBLE_YEARS_MESSAGE)

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
  /** The lot an export came from; empty for a new lot. */
  lot_id: z.string().trim().optional().transform(s => s || undefined)
    .pipe(z.string().uuid('Keep the lot_id as Shelfstead wrote it, or leave it empty for a new lot.').optional()),
})
export type ShelfCsvRow = z.infer<typeof ShelfCsvRowSchema>
