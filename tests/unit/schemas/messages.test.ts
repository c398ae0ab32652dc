/**
 * No message a person can see comes from zod's own English or names a field path: every schema
 * that reaches a form or an API answer is fed hostile values, and each message it gives must be
 * one of ours.
 */
import { describe, expect, it } from 'vitest'
import { z as bareZod, defaultErrorMap, ZodEffects, ZodObject, ZodType } from 'zod'
import { houseErrorMap } from '~~/utils/schemas/z'

/** zod's default wording (zod 3 locales/en) and a leading "field:" path. */
const ZOD_DEFAULT = /^(Required|Expected |Invalid|String must|Number must|Array must|Too small|Too big|Unrecognized key|Should be|Date must|BigInt must)/
const FIELD_PATH = /^[A-Za-z_][\w.[\]]*:\s/

// Every schema file, so a new one is checked without being listed here.
const modules = Object.fromEntries(Object.entries(import.meta.glob('../../../utils/schemas/*.ts', { eager: true }))
  .map(([path, exports]) => [path.replace(/^.*\/(.*)\.ts$/, '$1'), exports]))
const schemas = Object.entries(modules).flatMap(([file, exports]) =>
  Object.entries(exports as Record<string, unknown>)
    .filter((entry): entry is [string, ZodType] => entry[1] instanceof ZodType)
    .map(([name, schema]) => ({ name: `${file}.${name}`, schema })))

function shapeOf(schema: ZodType): Record<string, ZodType> | null {
  let inner: ZodType = schema
  while (inner instanceof ZodEffects) inner = inner.innerType()
  return inner instanceof ZodObject ? inner.shape : null
}

const hostile: unknown[] = [undefined, null, '', '   ', 'x'.repeat(5000), 'not-a-uuid', -1e9, 1e12, 1.5, 0, [], [{}], {}, true, '0x1F40']

function inputsFor(schema: ZodType): unknown[] {
  const shape = shapeOf(schema)
  if (!shape) return hostile
  const keys = Object.keys(shape)
  return [...hostile, ...hostile.map(v => Object.fromEntries(keys.map(k => [k, v])))]
}

describe('messages a person sees', () => {
  it('finds the schemas it checks', () => {
    expect(schemas.length).toBeGreaterThan(15)
  })

  it('recognises zod\'s default wording when the house map is bypassed', () => {
    const raw = bareZod.object({ name: bareZod.string().max(3) }).safeParse({ name: 'too long' }, { errorMap: defaultErrorMap })
    expect(raw.success).toBe(false)
    expect(raw.error!.issues[0]!.message).toMatch(ZOD_DEFAULT)
  })

  it.each(schemas)('$name answers hostile input in our words', ({ schema }) => {
    let failures = 0
    for (const input of inputsFor(schema)) {
      const result = schema.safeParse(input)
      if (result.success) continue
      failures++
      for (const issue of result.error.issues) {
        expect(issue.message, `${JSON.stringify(input)?.slice(0, 80)} → ${issue.path.join('.')}`).not.toMatch(ZOD_DEFAULT)
        expect(issue.message).not.toMatch(FIELD_PATH)
        expect(issue.message.length).toBeGreaterThan(5)
      }
    }
    expect(failures).toBeGreaterThan(0)
  })

  it('says what to do for a default check with no message of its own', () => {
    const long = bareZod.string().max(80).safeParse('x'.repeat(81), { errorMap: houseErrorMap })
    expect(long.error!.issues[0]!.message).toBe('Keep this under 81 characters.')
    const few = bareZod.number().min(1).safeParse(0, { errorMap: houseErrorMap })
    expect(few.error!.issues[0]!.message).toBe('Enter at least 1.')
  })
})
