import { z } from './z'
import { roles } from '../vocabulary'
import { EmailSchema, PasswordSchema } from './auth'

const RoleSchema = z.enum(roles, { errorMap: () => ({ message: 'Choose owner, canner or helper.' }) })
const uuid = (message: string) => z.string({ invalid_type_error: message }).uuid(message)

export const InviteSchema = z.object({ email: EmailSchema, role: RoleSchema })
export const MemberRoleSchema = z.object({ role: RoleSchema })

export const MemberParamsSchema = z.object({
  id: uuid('That household id is not valid.'),
  userId: uuid('That member id is not valid.'),
})
export const InvitationParamsSchema = z.object({
  id: uuid('That household id is not valid.'),
  invitationId: uuid('That invitation id is not valid.'),
})

/** Accepting an invitation: as the person already signed in, by signing in, or with a new account. */
export const AcceptInvitationSchema = z.discriminatedUnion('mode', [
  z.object({ mode: z.literal('signed-in') }),
  z.object({ mode: z.literal('sign-in'), password: z.string({ invalid_type_error: 'Enter your password.' }).min(1, 'Enter your password.').max(200) }),
  z.object({ mode: z.literal('register'), name: z.string({ invalid_type_error: 'Enter your name.' }).trim().min(1, 'Enter your name.').max(80, 'Keep your name under 80 characters.'), password: PasswordSchema }),
], { errorMap: () => ({ message: 'Choose how to accept: with this account, by signing in, or with a new account.' }) })

export const ActivityQuerySchema = z.object({
  page: z.string().regex(/^[1-9]\d{0,4}$/, 'Pages are numbered from 1.').transform(Number).optional(),
})

export type InviteInput = z.infer<typeof InviteSchema>
export type AcceptInvitationInput = z.infer<typeof AcceptInvitationSchema>
