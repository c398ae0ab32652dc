/**
 * Control characters and implausible dates are refused before any value reaches the database.
 * Outside truth: PostgreSQL text cannot hold U+0000 and its dates have no year 0 (PostgreSQL
 * manual, "Date/Time Types": the Gregorian calendar, 4713 BC to 5874897 AD, with no year zero);
 * Unicode's C0 controls are U+0000–U+001F and its C1 controls U+0080–U+009F (Unicode 15, ch. 23.1).
 */
import { fc, test } from '@fast-check/vitest'
import { describe, expect, it } from 'vitest'
import { findTextProblem, hasControlCharacter } from '~~/utils/schemas/text'
import { inPlausibleYears } from '~~/utils/schemas/fields'
import { LoadListQuerySchema } from '~~/utils/schemas/logbook'
import { ShelfCsvRowSchema } from '~~/utils/schemas/shelf'

const controls = [...Array.from({ length: 0x20 }, (_, i) => i), 0x7F, ...Array.from({ length: 0x20 }, (_, i) => 0x80 + i)]
  .filter(c => ![0x09, 0x0A, 0x0D].includes(c))
  .map(c => String.fromCharCode(c))
const plainText = fc.string({ unit: fc.integer({ min: 0xA0, max: 0xD7FF }).map(c => String.fromCharCode(c)) })

describe('control characters', () => {
  it('counts every C0 and C1 control but tab, line feed and carriage return (65 - 3 = 62)', () => {
    expect(controls).toHaveLength(62)
    for (const c of controls) expect(hasControlCharacter(`pinto${c}beans`), `U+${c.charCodeAt(0).toString(16)}`).toBe(true)
    expect(hasControlCharacter('Soak overnight.\n\tDrain,\r\nthen fill.')).toBe(false)
  })

  test.prop([plainText, fc.constantFrom(...controls), plainText, fc.array(fc.constantFrom('lines', '0', 'product', 'notes'), { maxLength: 4 })])(
    'finds a control anywhere in a body and names its field', (before, control, after, path) => {
      const body = path.reduceRight<unknown>((inner, key) => ({ [key]: inner }), `${before}${control}${after}`)
      expect(findTextProblem(body)).toEqual({ field: path.join('.') || 'body', message: expect.stringMatching(/control character/) })
    })

  test.prop([fc.jsonValue({ maxDepth: 6 }).filter(v => !JSON.stringify(v).match(/\\u00[01]|\\u007f|[\u0080-\u009f]/))])(
    'lets a body without controls through', (body) => {
      expect(findTextProblem(body)).toBeNull()
    })

  it('refuses a key holding a NUL, and a depth no form sends, without overflowing the stack', () => {
    expect(findTextProblem({ lines: [{ 'pro\u0000duct': 'x' }] })?.field).toBe('lines.0')
    const deep = JSON.parse('['.repeat(200_000) + ']'.repeat(200_000))
    expect(findTextProblem(deep)?.message).toMatch(/nested too deeply/)
  })
})

describe('plausible years', () => {
  it.each([
    ['1970-01-01', true], ['2026-09-01', true], ['2200-12-31', true], ['2200-12-31T23:00:00Z', true],
    ['0000-01-01', false], ['1969-12-31', false], ['2201-01-01', false], ['9999-12-31', false],
    // 9999-12-31 23:30 at UTC−14 is already the year 10000 in UTC
    ['9999-12-31T23:30:00-14:00', false], ['not a date', false],
  ])('%s → %s', (iso, ok) => {
    expect(inPlausibleYears(iso)).toBe(ok)
  })

  it('refuses year 0000 in the Logbook range and in a CSV canned date, naming the field', () => {
    const query = LoadListQuerySchema.safeParse({ from: '0000-01-01', to: '2026-01-01' })
    expect(query.success).toBe(false)
    expect(query.error!.issues.map(i => i.path.join('.'))).toEqual(['from'])
    const row = ShelfCsvRowSchema.safeParse({ product: 'Pintos', jar_size: 'pint-regular', jars: '4', canned_on: '0000-01-01' })
    expect(row.success).toBe(false)
    expect(row.error!.issues.map(i => i.path.join('.'))).toEqual(['canned_on'])
  })
})

describe('the error map a request is parsed with', () => {
  it('answers in house words where the global map is not set, and keeps an enum\'s own message', async () => {
    const { z: bare } = await import('zod')
    const { parseErrorMap } = await import('~~/utils/schemas/z')
    const schema = bare.object({ gauge: bare.enum(['dial', 'weighted'], { errorMap: () => ({ message: 'Choose a dial gauge or a weighted gauge.' }) }), name: bare.string() })
    const result = schema.safeParse({ gauge: 'spring', name: 5 }, { errorMap: parseErrorMap })
    expect(result.error!.issues.map(i => i.message)).toEqual(['Choose a dial gauge or a weighted gauge.', 'Enter this as text.'])
    expect(bare.string().safeParse(5, { errorMap: parseErrorMap }).error!.issues[0]!.message).toBe('Enter this as text.')
  })
})
