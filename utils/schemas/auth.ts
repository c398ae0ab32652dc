import { z } from './z'
import { TimeZoneSchema } from './household'

export const EmailSchema = z.string().trim().toLowerCase().email('Enter an e-mail address like name@example.com.').max(254)

export const LoginSchema = z.object({
  email: EmailSchema,
  password: z.string().min(1, 'Enter your password.').max(200),
})

export const RegisterSchema = z.object({
  email: EmailSchema,
  password: z.string().min(10, 'Use at least 10 characters for your password.').max(200),
  name: z.string().trim().min(1, 'Enter your name.').max(80),
  householdName: z.string().trim().min(1, 'Name your household, for example "Hilltop kitchen".').max(80),
  /** The browser's zone at sign-up; changeable on the Household page. */
  timeZone: TimeZoneSchema.optional(),
})

export type LoginInput = z.infer<typeof LoginSchema>
export type RegisterInput = z.infer<typeof RegisterSchema>
