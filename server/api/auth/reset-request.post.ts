import { ResetRequestSchema } from '~~/utils/schemas/auth'

/** Ask for a password-reset link by e-mail; the same answer for every address. */
export default defineEventHandler(async (event) => {
  const { email } = await validBody(event, ResetRequestSchema)
  await spend(event, 'resetPerClient', clientAddress(event), 'reset requests from this device')
  await spend(event, 'resetPerAddress', email, 'reset requests for this address')
  return requestReset(event, await useDB(), email)
})
