/**
 * Control characters are refused in every string a request carries, keys included, before any
 * schema reads it: PostgreSQL text cannot hold U+0000, and the other C0/C1 controls (and DEL)
 * are never typed by a person; they come from a broken file or a hostile client. Refused rather
 * than stripped, so a person learns which field (or CSV cell) is broken instead of finding it
 * silently changed. Tab, line feed and carriage return are kept: notes and steps are multi-line,
 * and trimming removes them at the edges of one-line fields.
 */

// Built from code points, so no control character sits in this file.
const CONTROL = new RegExp(`[${['\\u0000-\\u0008', '\\u000B', '\\u000C', '\\u000E-\\u001F', '\\u007F-\\u009F'].join('')}]`)

export const CONTROL_CHARACTER_MESSAGE = 'Remove the invisible control character (such as a NUL) from this text; paste it as plain text.'
export const TOO_DEEP_MESSAGE = 'The form sent values nested too deeply; reload the page and try again.'
/** Deeper than any form of the app nests its values. */
const MAX_DEPTH = 12

export function hasControlCharacter(text: string): boolean {
  return CONTROL.test(text)
}

export interface TextProblem { field: string, message: string }

/**
 * The first string (or key) in `input` holding a control character, or a value nested deeper
 * than any form sends, with its dotted path ("lines.0.product"); null when there is none.
 * Walks with its own stack, so a hostile depth cannot overflow the call stack.
 */
export function findTextProblem(input: unknown, root = ''): TextProblem | null {
  const stack: Array<{ value: unknown, path: string[], depth: number }> = [{ value: input, path: root ? [root] : [], depth: 0 }]
  while (stack.length) {
    const { value, path, depth } = stack.pop()!
    const field = path.join('.') || 'body'
    if (typeof value === 'string') {
      if (hasControlCharacter(value)) return { field, message: CONTROL_CHARACTER_MESSAGE }
      continue
    }
    if (!value || typeof value !== 'object') continue
    if (depth >= MAX_DEPTH) return { field, message: TOO_DEEP_MESSAGE }
    for (const [key, inner] of Object.entries(value)) {
      if (hasControlCharacter(key)) return { field, message: CONTROL_CHARACTER_MESSAGE }
      stack.push({ value: inner, path: [...path, key], depth: depth + 1 })
    }
  }
  return null
}
