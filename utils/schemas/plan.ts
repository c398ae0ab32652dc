import { planStatuses, soakMethods } from '../vocabulary'
import { z } from './z'
import { inPlausibleYears, PLAUSIBLE_YEARS_MESSAGE } from './fields'

const positiveWhole = (what: string, max: number) =>
  z.number({ invalid_type_error: `Enter ${what} as a number.` }).int(`Enter ${what} as a whole number.`).positive(`${what[0]!.toUpperCase()}${what.slice(1)} must be more than 0.`).max(max, `That is more ${what} than one plan can hold (${max}).`)

export const PackageSchema = z.object({
  grams: z.number({ invalid_type_error: 'Enter the bag size in grams.' }).positive('A bag must weigh more than 0 g.').max(50_000, 'A bag over 50 kg looks like a typing slip.'),
  count: positiveWhole('bags', 200),
})

/**
 * One plan line: a recipe in one jar size, and exactly one way of saying how much —
 * a jar count, a dry weight, packages on hand, or jars per month over some months.
 */
export const PlanLineSchema = z.object({
  recipeId: z.string().min(1, 'Choose a recipe.'),
  jarSizeId: z.string().min(1, 'Choose a jar size.'),
  /** For recipes that take any variety (dried beans, all varieties): which bean. */
  ingredientId: z.string().min(1).optional(),
  jars: positiveWhole('jars', 500).optional(),
  dryGrams: z.number({ invalid_type_error: 'Enter the dry weight in grams.' }).positive('The dry weight must be more than 0.').max(500_000, 'That is more dry goods than one plan can hold (500 kg).').optional(),
  packages: z.array(PackageSchema).min(1, 'Add at least one bag.').max(10).optional(),
  jarsPerMonth: z.number({ invalid_type_error: 'Enter jars per month as a number.' }).positive('Jars per month must be more than 0.').max(200).optional(),
  months: positiveWhole('months', 36).optional(),
  jarsOnShelf: z.number().int('Enter whole jars.').min(0, 'Jars on the shelf cannot be negative.').max(5000).optional(),
  saltTsp: z.number().min(0, 'Salt cannot be negative.').max(3, 'More than 3 tsp of salt per jar is not a canning amount.').optional(),
  dryMlPerJar: z.number().positive('The dry fill must be more than 0.').max(2000).optional(),
}).superRefine((line, ctx) => {
  const given = [line.jars !== undefined, line.dryGrams !== undefined, line.packages !== undefined, line.jarsPerMonth !== undefined]
  const count = given.filter(Boolean).length
  if (count !== 1) {
    ctx.addIssue({
      code: z.ZodIssueCode.custom,
      path: ['jars'],
      message: count === 0
        ? 'Say how much: a number of jars, a dry weight, packages on hand, or jars per month.'
        : 'Give only one of: jars, dry weight, packages, or jars per month.',
    })
  }
  if (line.jarsPerMonth !== undefined && line.months === undefined) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['months'], message: 'Say how many months the jars should last.' })
  }
})

export const PlanRequestSchema = z.object({
  cannerId: z.string().uuid('Choose a canner.').optional(),
  cannerIds: z.array(z.string().uuid('Choose a canner.')).min(1).max(2, 'At most two canners run side by side.').optional(),
  startAt: z.string().regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})?$/, 'Give the start as a date and time, e.g. 2026-12-05T08:00.')
    .refine(inPlausibleYears, PLAUSIBLE_YEARS_MESSAGE).optional(),
  soak: z.enum(soakMethods, { errorMap: () => ({ message: 'Choose the overnight soak or the quick soak.' }) }).optional(),
  altitudeFt: z.number({ invalid_type_error: 'Enter the altitude in feet.' }).int('Enter whole feet.').min(-1500).max(30_000).optional(),
  lines: z.array(PlanLineSchema).min(1, 'Add at least one recipe.').max(12, 'At most 12 lines in one plan.'),
}).superRefine((body, ctx) => {
  if ((body.cannerId === undefined) === (body.cannerIds === undefined)) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['cannerId'], message: 'Choose the canner, or two canners to run side by side.' })
  }
  if (body.cannerIds && new Set(body.cannerIds).size !== body.cannerIds.length) {
    ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['cannerIds'], message: 'Choose two different canners.' })
  }
})

export const PlanNameSchema = z.string().trim().min(1, 'Name the plan.').max(80, 'Keep the name under 80 characters.')

export const PlanSaveSchema = z.object({ name: PlanNameSchema, request: PlanRequestSchema })
export const PlanUpdateSchema = z.object({
  name: PlanNameSchema.optional(),
  status: z.enum(planStatuses).optional(),
  request: PlanRequestSchema.optional(),
})

export type PlanLineBody = z.infer<typeof PlanLineSchema>
export type PlanRequestBody = z.infer<typeof PlanRequestSchema>

/** Preview a change to a saved plan: its progress (loads logged, at-home marks) applies. */
export const PlanPreviewQuerySchema = z.object({ planId: z.string().uuid('That plan id is not valid.').optional() })
