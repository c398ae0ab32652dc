/** Schemas of the Logbook and the seal check, shared by the API routes and the forms. */
import { unsealedActions } from '../vocabulary'
import { z } from './z'
import { fromLocalInput, isLocalInput } from '../time'
import { inPlausibleYears, isCalendarDate, PLAUSIBLE_YEARS_MESSAGE, queryWholeNumber } from './fields'

const uuid = (what: string) => z.string({ required_error: `Choose the ${what}.`, invalid_type_error: `Choose the ${what}.` }).uuid(`That ${what} id is not valid.`)
const ISO_DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/
const instant = (what: string) => z.string({ required_error: `Enter when the load ${what}.`, invalid_type_error: `Enter when the load ${what}.` })
  .regex(ISO_DATE_TIME, `Enter when the load ${what} as a date and time.`)
  .refine(s => !Number.isNaN(Date.parse(s)) && isCalendarDate(s.slice(0, 10)), 'That date does not exist.')
  .refine(inPlausibleYears, PLAUSIBLE_YEARS_MESSAGE)
const wholeNumber = (message: string) => z.number({ required_error: message, invalid_type_error: message }).int(message)

export const HouseholdLoadParamsSchema = z.object({ id: uuid('household'), loadId: uuid('load') })
export const HouseholdPhotoParamsSchema = z.object({ id: uuid('household'), photoId: uuid('photo') })

export const LoadLineSchema = z.object({
  recipeId: z.string({ required_error: 'Choose the recipe.', invalid_type_error: 'Choose the recipe.' }).min(1, 'Choose the recipe.').max(120),
  jarSizeId: z.string({ required_error: 'Choose the jar size.', invalid_type_error: 'Choose the jar size.' }).min(1, 'Choose the jar size.').max(60),
  jars: wholeNumber('Enter the number of jars.').min(1, 'A line holds at least 1 jar.').max(60, 'No home canner holds more than 60 jars in one load.'),
  /** The product as it should read on the Shelf; defaults to the recipe's name. */
  product: z.string().trim().max(120, 'Keep the product name under 120 characters.').optional(),
})

/** The pressure held and the minutes timed at that pressure, as the canner used them. */
const processFields = {
  pressurePsi: z.number({ required_error: 'Enter the pressure you held.', invalid_type_error: 'Enter the pressure you held.' })
    .positive('Enter the gauge pressure you held, in psi.').max(20, 'Home pressure canners do not run above 20 psi; check the gauge reading.'),
  processMinutes: wholeNumber('Enter the minutes timed at pressure.').min(1, 'Enter the minutes timed at pressure.').max(300, 'More than 300 minutes looks like a typing slip.'),
}

const NOTES = z.string().trim().max(2000, 'Keep the notes under 2,000 characters.')
const MAX_LOAD_MS = 24 * 3_600_000

function checkTimes(body: { startedAt?: string, endedAt?: string }, ctx: z.RefinementCtx) {
  if (!body.startedAt || !body.endedAt) return
  const span = Date.parse(body.endedAt) - Date.parse(body.startedAt)
  if (span <= 0) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['endedAt'], message: 'The load must come out after it went in: check the end time.' })
  else if (span > MAX_LOAD_MS) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['endedAt'], message: 'One load does not take more than 24 hours: check the start and end.' })
}

export const LoadCreateSchema = z.object({
  planId: uuid('plan').optional(),
  planLoad: wholeNumber('Give the load number of the plan.').min(1).max(200).optional(),
  cannerId: uuid('canner'),
  lines: z.array(LoadLineSchema).min(1, 'Add at least one recipe and jar size.').max(8, 'At most 8 lines in one load.'),
  ...processFields,
  startedAt: instant('started'),
  endedAt: instant('came out'),
  notes: NOTES.default(''),
}).superRefine((body, ctx) => {
  if ((body.planId === undefined) !== (body.planLoad === undefined)) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, path: [body.planId ? 'planLoad' : 'planId'], message: 'Give both the plan and its load number, or neither.' })
  }
  checkTimes(body, ctx)
})
export type LoadCreateInput = z.infer<typeof LoadCreateSchema>

/**
 * A route schema for a form: the form holds its times as `<input type="datetime-local">`
 * values, read in the household's time zone, and an emptied product name as "use the
 * recipe's"; both are turned into what the route takes, then the route's own schema decides.
 */
export function asLoadForm<T extends z.ZodTypeAny>(schema: T, zone: () => string) {
  return z.preprocess((value) => {
    if (!value || typeof value !== 'object') return value
    const form = { ...(value as Record<string, unknown>) }
    for (const key of ['startedAt', 'endedAt']) {
      if (isLocalInput(form[key])) form[key] = fromLocalInput(form[key], zone())
      else if (form[key] === '') form[key] = undefined
    }
    if (Array.isArray(form.lines)) {
      form.lines = form.lines.map((line: Record<string, unknown>) => (typeof line?.product === 'string' && !line.product.trim() ? { ...line, product: undefined } : line))
    }
    return form
  }, schema)
}

/**
 * Record how a pending (reprocessing) load was run; correct a logged load (its times, pressure,
 * minutes, and the jars of its lines before the seal check); change its notes; or confirm it.
 */
export const LoadUpdateSchema = z.object({
  ...processFields,
  startedAt: instant('started'),
  endedAt: instant('came out'),
  notes: NOTES,
  lines: z.array(z.object({
    id: uuid('load line'),
    jars: LoadLineSchema.shape.jars,
  }), { invalid_type_error: 'Send the lines as a list of line ids and jar counts.' }).min(1, 'Send at least one line to correct.').max(8, 'A load has at most 8 lines.')
    .refine(lines => new Set(lines.map(l => l.id)).size === lines.length, 'Name each line once.'),
  /** The canner confirms a load the Canning day logged. */
  confirmed: z.literal(true, { errorMap: () => ({ message: 'Send confirmed: true to confirm the load.' }) }),
}).partial().superRefine((body, ctx) => {
  if (Object.keys(body).length === 0) ctx.addIssue({ code: z.ZodIssueCode.custom, path: [], message: 'Send the run (pressure, minutes, start and end), the jars, the notes, or confirmed.' })
  checkTimes(body, ctx)
})
export type LoadUpdateInput = z.infer<typeof LoadUpdateSchema>

export const loadSortKeys = ['startedAt', 'code', 'canner', 'jars', 'pressurePsi', 'processMinutes'] as const
export type LoadSortKey = (typeof loadSortKeys)[number]
const SORT = new RegExp(`^-?(${loadSortKeys.join('|')})$`)
const dateOnly = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the date as YYYY-MM-DD.').refine(isCalendarDate, 'That date does not exist.')
  .refine(inPlausibleYears, PLAUSIBLE_YEARS_MESSAGE)

export const LoadListQuerySchema = z.object({
  page: queryWholeNumber('Give the page as a whole number from 1.', 1, 10_000).default('1'),
  pageSize: queryWholeNumber('Give between 1 and 100 loads a page.', 1, 100).default('20'),
  sort: z.string().regex(SORT, `Sort by one of ${loadSortKeys.join(', ')}, with a leading "-" for newest or largest first.`).default('-startedAt'),
  recipeId: z.string().min(1).max(120).optional(),
  cannerId: z.string().uuid('That canner id is not valid.').optional(),
  from: dateOnly.optional(),
  to: dateOnly.optional(),
}).refine(q => !q.from || !q.to || q.from <= q.to, { path: ['to'], message: 'The end of the date range comes before its start.' })
export type LoadListQuery = z.infer<typeof LoadListQuerySchema>

export const SealCheckLineSchema = z.object({
  loadLineId: uuid('load line'),
  sealed: wholeNumber('Enter how many jars sealed.').min(0, 'Sealed jars cannot be fewer than 0.').max(60),
  unsealed: wholeNumber('Enter how many jars did not seal.').min(0, 'Unsealed jars cannot be fewer than 0.').max(60),
  action: z.enum(unsealedActions, { errorMap: () => ({ message: 'Choose what to do with the jars that cannot go on the shelf: refrigerate or reprocess.' }) }).optional(),
})

export const SealCheckSchema = z.object({
  loadId: uuid('load'),
  lines: z.array(SealCheckLineSchema).min(1, 'Record every line of the load.').max(8),
  notes: NOTES.default(''),
})
export type SealCheckInput = z.infer<typeof SealCheckSchema>

export const SendMarketListSchema = z.object({ userId: uuid('member') })
