import type { ZodType, ZodTypeDef } from 'zod'

/**
 * Adapt a zod schema for h3's validated readers: a bad body or query answers 400 with the
 * first problem's field and message in words a person can act on, and the full list in `data`.
 */
export function validateWith<T>(schema: ZodType<T, ZodTypeDef, unknown>) {
  return (input: unknown): T => {
    const result = schema.safeParse(input)
    if (result.success) return result.data
    const issues = result.error.issues.map(i => ({ field: i.path.join('.'), message: i.message }))
    const first = issues[0]!
    throw createError({
      statusCode: 400,
      message: first.field ? `${first.field}: ${first.message}` : first.message,
      data: { issues },
    })
  }
}

export function publicUser(user: { id: string, email: string, name: string, isAdmin: boolean }) {
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin }
}
