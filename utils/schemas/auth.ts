import { z } from './z'
import { TimeZoneSchema } from './household'

export const EmailSchema = z.string().trim().toLowerCase().email('Enter an e-mail address like name@example.com.').max(254)

/** At least 10 characters; the server also refuses passwords on a common-password list. */
export const PasswordSchema = z.string({ invalid_type_error: 'Choose a password.' })
  .min(10, 'Use at least 10 characters for your password.')
  .max(200, 'Keep the password under 200 characters.')

export const LoginSchema = z.object({
  email: EmailSchema,
  password: z.string().min(1, 'Enter your password.').max(200),
})

export const RegisterSchema = z.object({
  email: EmailSchema,
  password: PasswordSchema,
  name: z.string().trim().min(1, 'Enter your name.').max(80),
  householdName: z.string().trim().min(1, 'Name your household, for example "Hilltop kitchen".').max(80),
  /** The browser's zone at sign-up; changeable on the Household page. */
  timeZone: TimeZoneSchema.optional(),
})

export const SwitchHouseholdSchema = z.object({
  householdId: z.string({ invalid_type_error: 'Choose a household.' }).uuid('Choose one of your households.'),
})

export const ResetRequestSchema = z.object({ email: EmailSchema })

/** A reset or invitation link's token: 43 url-safe characters (32 random bytes). */
export const TokenSchema = z.string({ invalid_type_error: 'That link is not complete.' }).regex(/^[A-Za-z0-9_-]{43}$/, 'That link is not complete; open it from the e-mail again.')

export const TokenParamsSchema = z.object({ token: TokenSchema })

export const ResetPasswordSchema = z.object({ token: TokenSchema, password: PasswordSchema })

export type LoginInput = z.infer<typeof LoginSchema>
export type RegisterInput = z.infer<typeof RegisterSchema>
