import type { H3Event } from 'h3'
import type { ZodType, ZodTypeDef } from 'zod'
import type { ApiErrorData, ApiIssue } from '~~/utils/schemas/errors'
import { findTextProblem } from '~~/utils/schemas/text'
import { parseErrorMap } from '~~/utils/schemas/z'

/**
 * The one error envelope of the API. Every refusal a route or server util makes goes through
 * these helpers, so a client reads one shape:
 *
 *   { statusCode, message, data: { field?: string, issues: [{ field, message, line? }] } }
 *
 * `message` is written for a person (never a field path or a library's words); `field` names
 * the request field at fault, as a dotted path ("lines.0.jars").
 */
function fail(statusCode: number, message: string, field?: string, issues?: ApiIssue[]): never {
  const data: ApiErrorData = { ...(field ? { field } : {}), issues: issues ?? (field ? [{ field, message }] : []) }
  throw createError({ statusCode, message, data })
}

/** 400: the request itself is wrong (a missing, malformed or unknown value). */
export function badInput(field: string, message: string, issues?: ApiIssue[]): never {
  return fail(400, message, field, issues)
}
/** 401: not signed in, or a sign-in that does not match. */
export function unauthorized(message: string): never {
  return fail(401, message)
}
/** 403: signed in, but this role may not do it. */
export function forbidden(message: string): never {
  return fail(403, message)
}
/** 404: nothing of that id in this household (another household's row is a 404 too). */
export function notFound(message: string): never {
  return fail(404, message)
}
/** 409: the request clashes with the current state (already recorded, changed meanwhile). */
export function conflict(message: string, field?: string): never {
  return fail(409, message, field)
}
/** 408: the request body stopped arriving (or took too long). */
export function timedOut(message: string, field?: string): never {
  return fail(408, message, field)
}
/** 413: too large to take. */
export function tooLarge(message: string, field?: string): never {
  return fail(413, message, field)
}
/** 415: a body type this API does not take (form posts, text/plain). */
export function unsupportedBody(message: string): never {
  return fail(415, message, 'body')
}
/** 429: too many attempts; the caller sets Retry-After and says when to try again. */
export function rateLimited(message: string): never {
  return fail(429, message)
}
/** 422: well-formed, but the published tables (or the household's data) give no basis for it. */
export function refusal(message: string, field?: string): never {
  return fail(422, message, field)
}
/** 502 / 503: a service the request needs failed or is not set up. */
export function upstreamFailed(message: string): never {
  return fail(502, message)
}
export function unavailable(message: string, field?: string): never {
  return fail(503, message, field)
}

/**
 * Parse `input` with a zod schema; the first problem answers 400 with its field and message.
 * A control character anywhere in the input (or a hostile depth) is refused first, whatever
 * the schema, so none reaches the database.
 */
function parseOr400<T>(schema: ZodType<T, ZodTypeDef, unknown>, input: unknown): T {
  const text = findTextProblem(input)
  if (text) badInput(text.field, text.message)
  // The house map passed here too: the bundler may hoist `z` from 'zod' past the module that sets it.
  const result = schema.safeParse(input, { errorMap: parseErrorMap })
  if (result.success) return result.data
  // An issue with the body itself (a number, a list, null where an object belongs) names "body".
  const issues = result.error.issues.map(i => ({ field: i.path.join('.') || 'body', message: i.message }))
  const first = issues.find(i => i.field) ?? issues[0]!
  return badInput(first.field, first.message, issues)
}

/** The JSON body, validated. A body that is not JSON answers 400 like any other bad input. */
export async function validBody<T>(event: H3Event, schema: ZodType<T, ZodTypeDef, unknown>): Promise<T> {
  const body = await readBody(event).catch(() => badInput('body', 'Send the form as JSON.'))
  return parseOr400(schema, body)
}

export function validParams<T>(event: H3Event, schema: ZodType<T, ZodTypeDef, unknown>): T {
  return parseOr400(schema, getRouterParams(event, { decode: true }))
}

export function validQuery<T>(event: H3Event, schema: ZodType<T, ZodTypeDef, unknown>): T {
  return parseOr400(schema, getQuery(event))
}
