import { z } from './z'
import { isTimeZone } from '../time'
import { currencies, storeCanBases, unitSystems } from '../vocabulary'
import { numberField } from './fields'

export { roleRank } from '../vocabulary'
export type { Role as HouseholdRole } from '../vocabulary'

export const HouseholdParamsSchema = z.object({
  id: z.string().uuid('That household id is not valid.'),
})

/** An IANA time zone the runtime knows; the household's dates and times are read in it. */
export const TimeZoneSchema = z.string({ invalid_type_error: 'Choose the time zone your kitchen is in.' })
  .trim()
  .refine(isTimeZone, 'Choose a time zone from the list, such as America/Denver.')

/** Highest inhabited land is below 30,000 ft; anything beyond is a typing slip. */
export const HouseholdSettingsSchema = z.object({
  name: z.string({ invalid_type_error: 'Name the household.' }).trim().min(1, 'Name the household.').max(80, 'Keep the household name under 80 characters.'),
  altitudeFt: numberField('Enter the altitude of your kitchen in feet; the canner pressure depends on it.', {
    whole: true,
    fraction: 'Enter the altitude in whole feet.',
    min: -1500,
    low: 'An altitude below -1,500 ft is lower than any inhabited place; check the number.',
    max: 30_000,
    high: 'An altitude above 30,000 ft is higher than any inhabited place; check the number.',
  }),
  unitSystem: z.enum(unitSystems, { errorMap: () => ({ message: 'Choose US customary or metric.' }) }),
  storeCanPriceCents: numberField('Enter the price of one store-bought can.', { whole: true, fraction: 'Enter the price to the cent.', min: 0, low: 'A price cannot be negative.', max: 100_000, high: 'Enter the price of one can (at most 1,000).' }),
  storeCanBasis: z.enum(storeCanBases, { errorMap: () => ({ message: 'Say whether the can size is its net weight or its drained beans.' }) }),
  storeCanAmount: numberField('Enter the size of the store can.', { min: 30, low: 'A can smaller than 30 g (1 oz) or 30 mL is not a can of beans; check the size.', max: 5000, high: 'A can over 5 kg (11 lb) or 5 L is not a household can; check the size.' }),
  currency: z.enum(currencies, { errorMap: () => ({ message: `Choose one of the currencies: ${currencies.join(', ')}.` }) }),
  jarUses: numberField('Enter how many seasons a jar lasts.', { whole: true, min: 1, low: 'A jar is used at least once.', max: 100, high: 'A jar does not last more than 100 seasons.' }),
  coolDownPintMinutes: numberField('Enter the cool-down minutes for pints.', { whole: true, min: 10, low: 'Natural cool-down takes at least 10 minutes.', max: 180, high: 'Natural cool-down takes less than 3 hours.' }),
  coolDownQuartMinutes: numberField('Enter the cool-down minutes for quarts.', { whole: true, min: 10, low: 'Natural cool-down takes at least 10 minutes.', max: 180, high: 'Natural cool-down takes less than 3 hours.' }),
  bestByMonths: numberField('Enter the months until best-by.', { whole: true, min: 1, low: 'Best-by is at least 1 month after canning.', max: 36, high: 'Best-by is at most 36 months after canning.' }),
  timeZone: TimeZoneSchema,
}).partial()

export type HouseholdSettingsInput = z.infer<typeof HouseholdSettingsSchema>
