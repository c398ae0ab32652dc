import { z } from 'zod'

export const roleRank = { helper: 1, canner: 2, owner: 3 } as const
export type HouseholdRole = keyof typeof roleRank

export const HouseholdParamsSchema = z.object({
  id: z.string().uuid('That household id is not valid.'),
})

/** Highest inhabited land is below 30,000 ft; anything beyond is a typing slip. */
export const HouseholdSettingsSchema = z.object({
  name: z.string().trim().min(1, 'Name the household.').max(80),
  altitudeFt: z.coerce.number({ invalid_type_error: 'Enter the altitude in feet.' }).int('Enter whole feet.').min(-1500, 'Altitude looks too low.').max(30000, 'Altitude looks too high.'),
  unitSystem: z.enum(['us', 'metric'], { errorMap: () => ({ message: 'Choose US customary or metric.' }) }),
  storeCanPriceCents: z.coerce.number().int().min(0, 'A price cannot be negative.').max(100_000),
  jarUses: z.coerce.number().int().min(1, 'A jar is used at least once.').max(100),
  coolDownPintMinutes: z.coerce.number().int().min(10, 'Natural cool-down takes at least 10 minutes.').max(180),
  coolDownQuartMinutes: z.coerce.number().int().min(10, 'Natural cool-down takes at least 10 minutes.').max(180),
  bestByMonths: z.coerce.number().int().min(1).max(36),
}).partial()

export type HouseholdSettingsInput = z.infer<typeof HouseholdSettingsSchema>
