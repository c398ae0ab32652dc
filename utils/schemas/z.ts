/**
 * zod, with the house error map set: every schema imports `z` from here, so a check that has no
 * message of its own still answers in words a home canner can act on ("Keep this under 80
 * characters") instead of zod's defaults ("String must contain at most 80 character(s)").
 * The map applies wherever a schema runs: the API routes and the forms.
 */
import { defaultErrorMap, z, ZodIssueCode, type ZodErrorMap } from 'zod'

const plural = (n: number | bigint, one: string, many: string) => `${n.toLocaleString('en-US')} ${Number(n) === 1 ? one : many}`

export const houseErrorMap: ZodErrorMap = (issue, ctx) => {
  switch (issue.code) {
    case ZodIssueCode.invalid_type:
      if (issue.received === 'undefined' || issue.received === 'null') return { message: 'Fill this in.' }
      if (issue.expected === 'number' || issue.expected === 'integer') return { message: 'Enter a number.' }
      if (issue.expected === 'string') return { message: 'Enter this as text.' }
      if (issue.expected === 'boolean') return { message: 'Choose yes or no.' }
      if (issue.expected === 'array') return { message: 'Give a list here.' }
      return { message: 'This value is not one the form accepts; check it.' }
    case ZodIssueCode.too_small:
      if (issue.type === 'string') return { message: Number(issue.minimum) <= 1 ? 'Fill this in.' : `Use at least ${plural(issue.minimum, 'character', 'characters')}.` }
      if (issue.type === 'array') return { message: `Add at least ${plural(issue.minimum, 'item', 'items')}.` }
      return { message: `Enter ${issue.inclusive ? 'at least' : 'more than'} ${issue.minimum.toLocaleString('en-US')}.` }
    case ZodIssueCode.too_big:
      if (issue.type === 'string') return { message: `Keep this under ${plural(Number(issue.maximum) + 1, 'character', 'characters')}.` }
      if (issue.type === 'array') return { message: `At most ${plural(issue.maximum, 'item', 'items')} here.` }
      return { message: `Enter ${issue.inclusive ? 'at most' : 'less than'} ${issue.maximum.toLocaleString('en-US')}.` }
    case ZodIssueCode.invalid_string:
      if (issue.validation === 'email') return { message: 'Enter an e-mail address like name@example.com.' }
      if (issue.validation === 'uuid') return { message: 'That choice is not one of the list; choose again.' }
      return { message: 'This is not in a form the field takes; check it.' }
    case ZodIssueCode.invalid_enum_value:
    case ZodIssueCode.invalid_literal:
    case ZodIssueCode.invalid_union:
    case ZodIssueCode.invalid_union_discriminator:
      return { message: 'Choose one of the options offered.' }
    case ZodIssueCode.not_multiple_of:
      return { message: 'Enter a whole number.' }
    case ZodIssueCode.invalid_date:
      return { message: 'That date does not exist.' }
    case ZodIssueCode.unrecognized_keys:
      return { message: 'The form sent something it should not; reload the page and try again.' }
    default:
      return { message: ctx.defaultError.startsWith('Invalid') ? 'Check this value.' : ctx.defaultError }
  }
}

z.setErrorMap(houseErrorMap)

/**
 * The house map to pass to a parse (`safeParse(input, { errorMap: parseErrorMap })`) where the
 * global one may not be set: the bundler can import `z` straight from zod, past this module. A
 * message a schema's own errorMap gave (an enum's) is kept.
 */
export const parseErrorMap: ZodErrorMap = (issue, ctx) =>
  ctx.defaultError !== defaultErrorMap(issue, { ...ctx, defaultError: '' }).message && ctx.defaultError !== houseErrorMap(issue, ctx).message
    ? { message: ctx.defaultError }
    : houseErrorMap(issue, ctx)

export { z }
