/**
 * What a site admin sends to add, correct or retire a shared tested recipe. A shared recipe is
 * a published process: every table row names its source, the recipe names its citation, and
 * every change says why. Shared by the API routes and the admin's form.
 */
import { fillBases, gaugeTypes, packStyles, recipeSoaks } from '../vocabulary'
import { z } from './z'
import { MIN_HEADSPACE_MM } from './catalogue'

const num = (message: string) => z.number({ invalid_type_error: message, required_error: message })

/** A band with no upper edge ("above 1,000 ft") is stored with the largest integer Postgres keeps. */
export const OPEN_BAND_FT = 2_147_483_647
/** Weighted gauges come as 5, 10 and 15 lb weights (USDA CG Guide 1, "Pressure canners"). */
export const WEIGHTED_PSI = [5, 10, 15] as const

const reason = z.string({ required_error: 'Say what changed and why, for example "Quart time corrected to the 2015 Guide".' })
  .trim().min(8, 'Say what changed and why, for example "Quart time corrected to the 2015 Guide".').max(600)

const JarRowSchema = z.object({
  sizeKey: z.string().min(1, 'Choose a jar size.'),
  processMinutes: num('Enter the published process time in minutes.').int('Enter whole minutes, as published.')
    .min(10, 'A published pressure process for beans is at least 10 minutes; check the table.')
    .max(240, 'More than 240 minutes is not a published time for a home pressure canner; check the table.'),
  dryGrams: num('Enter the published dry amount per jar in grams.').positive('The dry amount must be more than 0 g.').max(2000, 'More than 2 kg per jar looks like a typing slip.').nullable().default(null),
  saltTsp: num('Enter the salt per jar in teaspoons.').min(0, 'Salt cannot be negative.').max(2, 'More than 2 tsp of salt per jar is not a canning amount.').nullable().default(null),
})

const BandSchema = z.object({
  gaugeType: z.enum(gaugeTypes, { errorMap: () => ({ message: 'Choose a dial gauge or a weighted gauge.' }) }),
  minFt: num('Enter the lowest altitude of the band in feet.').int('Enter whole feet.').min(0, 'Altitudes start at 0 ft (sea level).'),
  /** Null: the published band has no upper edge ("above 1,000 ft"). */
  maxFt: num('Enter the highest altitude of the band in feet, or leave it open.').int('Enter whole feet.').max(OPEN_BAND_FT).nullable(),
  psi: num('Enter the published pressure in psi.').min(5, 'Home pressure canning uses at least 5 psi.').max(17, 'More than 17 psi is not a published home canning pressure.'),
  source: z.string().trim().min(3, 'Name the table this pressure comes from, for example "CG Guide 4, Table 1".').max(300),
})

/** The problems of one gauge type's bands: they must start at 0 ft and follow on without gaps. */
function bandIssues(bands: Array<z.infer<typeof BandSchema>>, ctx: z.RefinementCtx) {
  for (const gauge of gaugeTypes) {
    const mine = bands.map((b, i) => ({ ...b, i })).filter(b => b.gaugeType === gauge).sort((a, b) => a.minFt - b.minFt)
    if (!mine.length) continue
    if (mine[0]!.minFt !== 0) {
      ctx.addIssue({ code: 'custom', path: [mine[0]!.i, 'minFt'], message: `The ${gauge} gauge table must start at 0 ft, so every altitude has a pressure.` })
    }
    mine.forEach((band, k) => {
      const top = band.maxFt ?? OPEN_BAND_FT
      if (top < band.minFt) ctx.addIssue({ code: 'custom', path: [band.i, 'maxFt'], message: 'The highest altitude must be above the lowest.' })
      if (gauge === 'weighted' && !(WEIGHTED_PSI as readonly number[]).includes(band.psi)) {
        ctx.addIssue({ code: 'custom', path: [band.i, 'psi'], message: 'A weighted gauge gives 5, 10 or 15 psi.' })
      }
      const next = mine[k + 1]
      if (!next) return
      if (band.maxFt === null) ctx.addIssue({ code: 'custom', path: [band.i, 'maxFt'], message: 'Only the highest band may be left open.' })
      else if (next.minFt !== band.maxFt + 1) {
        ctx.addIssue({ code: 'custom', path: [next.i, 'minFt'], message: `This band must start at ${(band.maxFt + 1).toLocaleString('en-US')} ft, right after the band below it, so no altitude is left without a pressure or given two.` })
      }
    })
  }
}

/** Soaking and cooking before the jars are filled, as the source gives it (the Canning day counts back from it). */
const PrepSchema = z.object({
  soak: z.enum(recipeSoaks, { errorMap: () => ({ message: 'Choose how the source hydrates the beans: overnight or quick, quick only, or no soak.' }) }),
  cook: z.object({
    label: z.string().trim().min(3, 'Say what is done, for example "drain, cover with fresh water and boil 30 minutes".').max(200),
    minutes: num('Enter the minutes the source gives.').int('Enter whole minutes.').min(1, 'Enter at least 1 minute.').max(600, 'More than 10 hours looks like a typing slip.'),
  }).nullable(),
  source: z.string().trim().min(3, 'Name where the soak and cooking times come from.').max(300),
})

export const SharedRecipeSchema = z.object({
  name: z.string().trim().min(1, 'Name the recipe as its source does.').max(120),
  ingredientId: z.string({ required_error: 'Choose the bean.', invalid_type_error: 'Choose the bean.' }).min(1, 'Choose the bean.'),
  packStyle: z.enum(packStyles, { errorMap: () => ({ message: 'Choose hot pack, raw pack or dry pack.' }) }),
  fillBasis: z.enum(fillBases, { errorMap: () => ({ message: 'Choose whether the source gives a dry amount per jar or a fill share.' }) }),
  headspaceMm: num('Enter the published headspace.')
    .min(MIN_HEADSPACE_MM, 'Beans are low-acid: at least 1 inch (25.4 mm) of headspace in a pressure canner.')
    .max(50.8, 'More than 2 inches (51 mm) of headspace is not a published value for beans.'),
  solidsFillFraction: num('Enter how full of beans a jar may be.').gt(0, 'The beans must take some part of the jar: more than 0.').max(1, 'The beans cannot take more than the whole jar (1).'),
  summary: z.string().trim().max(600).default(''),
  steps: z.string().trim().min(1, 'Write the steps as the source gives them.').max(6000),
  source: z.string({ required_error: 'Name the published source, with its title and edition.' }).trim()
    .min(10, 'Name the published source, with its title and edition.').max(600),
  caution: z.string().trim().max(600).nullable().default(null),
  prep: PrepSchema.nullable().default(null),
  jars: z.array(JarRowSchema).min(1, 'Give the process time of at least one jar size.').max(5)
    .refine(jars => new Set(jars.map(j => j.sizeKey)).size === jars.length, 'Give each jar size once.'),
  pressureBands: z.array(BandSchema).min(1, 'Give the published pressure for at least one gauge type.').max(16).superRefine(bandIssues),
  reason,
}).superRefine((body, ctx) => {
  if (body.fillBasis !== 'published') return
  body.jars.forEach((jar, i) => {
    if (jar.dryGrams === null) ctx.addIssue({ code: 'custom', path: ['jars', i, 'dryGrams'], message: 'The source gives the dry amount per jar: enter it in grams.' })
  })
})
export type SharedRecipeInput = z.input<typeof SharedRecipeSchema>
export type SharedRecipeBody = z.output<typeof SharedRecipeSchema>

export const RetireRecipeSchema = z.object({ reason })
export const RestoreRecipeSchema = z.object({ reason })
