/** What a device sends when someone presses an action on the Canning day. */
import { dayEventKinds } from '../vocabulary'
import { z } from './z'
import { inPlausibleYears, PLAUSIBLE_YEARS_MESSAGE } from './fields'

export const DayEventSchema = z.object({
  /** The device's own id for this action, so sending it again (after being offline) stores it once. */
  clientId: z.string().trim().min(8, 'Send the action\'s own id (clientId).').max(64),
  /** "load:3", or a kitchen task's key ("fill:2", "<recipe>:cook"). */
  target: z.string().regex(/^(load:\d{1,3}|fill:\d{1,3}|[\w~-]{1,120}:[a-z-]{3,20})$/, 'Say which load or task the action is for.'),
  kind: z.enum(dayEventKinds, { errorMap: () => ({ message: 'That is not an action of the Canning day.' }) }),
  /** When it happened, for an action kept while offline; the server's clock otherwise. */
  at: z.string().datetime({ offset: true, message: 'Give the time as an ISO date and time.' }).refine(inPlausibleYears, PLAUSIBLE_YEARS_MESSAGE).optional(),
})
export type DayEventInput = z.infer<typeof DayEventSchema>

export const UnsafeLoadDecisionSchema = z.object({
  action: z.enum(['refrigerate', 'reprocess'], { errorMap: () => ({ message: 'Choose refrigerate or reprocess.' }) }),
})
