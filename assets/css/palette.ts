// Shelfstead's "root cellar" palette: the single source of colour for tailwind.config.ts,
// for drawings that need raw hex values (canner map, charts) and for the contrast test.
// Plain data only, so a node test, the Tailwind config and a page can all import it.

export const palette = {
  /** Dark bean-brown: body text and headings. */
  ink: { DEFAULT: '#2b1e16', soft: '#4b3b2f' },
  /** Warm brass: the primary action and pressure figures. `tint` is a background only. */
  brass: { DEFAULT: '#8a5a12', deep: '#6f480c', tint: '#f6ecd6' },
  /** Pale jar-glass sage: page, card and sunken surfaces. */
  glass: { DEFAULT: '#f3f6f1', raised: '#fcfdfb', sunk: '#e5ebe2' },
  /** Lid steel: secondary text, control edges (`edge`, >= 3:1) and decorative rules (`line`). */
  steel: { DEFAULT: '#55606a', edge: '#7b858d', line: '#cdd5cd' },
  /** Paprika: cautions and refusals only, never decoration. */
  paprika: { DEFAULT: '#a3331b', deep: '#80260f', tint: '#fbebe4' },
  /** Moss: a quiet "all well" (sealed, gauge tested) for status badges. */
  moss: { DEFAULT: '#3c6932', tint: '#e3eedd' },
  /** Text on brass and paprika fills. */
  cream: '#fffaf0',
} as const

/** Pick a colour by its Tailwind-style name: `hex('brass')`, `hex('brass-deep')`. */
export function hex(name: string): string {
  const [family, shade = 'DEFAULT'] = name.split('-') as [string, string?]
  const entry = (palette as Record<string, string | Record<string, string>>)[family]
  const value = typeof entry === 'string' ? (shade === 'DEFAULT' ? entry : undefined) : entry?.[shade]
  if (!value) throw new Error(`No colour "${name}" in the Shelfstead palette`)
  return value
}

/**
 * Every foreground/background pairing the design system uses, with the WCAG AA
 * minimum it must meet: 4.5 for normal text, 3 for large text (>= 24 px, or >= 18.66 px
 * bold) and for the edges of controls and focus rings (WCAG 2.1 §1.4.3 and §1.4.11).
 */
export interface Pairing {
  fg: string
  bg: string
  min: 4.5 | 3
  use: string
}

export const pairings: readonly Pairing[] = [
  { fg: 'ink', bg: 'glass', min: 4.5, use: 'body text on the page' },
  { fg: 'ink', bg: 'glass-raised', min: 4.5, use: 'body text in cards' },
  { fg: 'ink', bg: 'glass-sunk', min: 4.5, use: 'table headers, active nav item' },
  { fg: 'ink', bg: 'brass-tint', min: 4.5, use: 'text on highlighted rows and badges' },
  { fg: 'ink', bg: 'paprika-tint', min: 4.5, use: 'caution body text' },
  { fg: 'ink', bg: 'moss-tint', min: 4.5, use: 'text in well-done notices' },
  { fg: 'ink-soft', bg: 'glass', min: 4.5, use: 'quieter body text' },
  { fg: 'ink-soft', bg: 'glass-raised', min: 4.5, use: 'quieter body text in cards' },
  { fg: 'steel', bg: 'glass', min: 4.5, use: 'labels, hints, secondary text' },
  { fg: 'steel', bg: 'glass-raised', min: 4.5, use: 'labels and hints in cards' },
  { fg: 'steel', bg: 'glass-sunk', min: 4.5, use: 'secondary text on sunken surfaces, neutral badges' },
  { fg: 'brass', bg: 'glass', min: 4.5, use: 'pressure figures and links on the page' },
  { fg: 'brass', bg: 'glass-raised', min: 4.5, use: 'pressure figures and links in cards' },
  { fg: 'brass-deep', bg: 'brass-tint', min: 4.5, use: 'brass badge text' },
  { fg: 'brass-deep', bg: 'glass-sunk', min: 4.5, use: 'active nav item label' },
  { fg: 'brass-deep', bg: 'glass-raised', min: 4.5, use: 'active bottom tab label' },
  { fg: 'brass', bg: 'glass-sunk', min: 3, use: 'sorted column arrow in table headers' },
  { fg: 'cream', bg: 'brass', min: 4.5, use: 'primary button label' },
  { fg: 'cream', bg: 'brass-deep', min: 4.5, use: 'primary button label, hovered' },
  { fg: 'cream', bg: 'paprika', min: 4.5, use: 'danger button label' },
  { fg: 'cream', bg: 'paprika-deep', min: 4.5, use: 'danger button label, hovered' },
  { fg: 'paprika', bg: 'glass', min: 4.5, use: 'field error text on the page' },
  { fg: 'paprika', bg: 'glass-raised', min: 4.5, use: 'field error text in cards' },
  { fg: 'paprika-deep', bg: 'paprika-tint', min: 4.5, use: 'caution and refusal titles' },
  { fg: 'moss', bg: 'moss-tint', min: 4.5, use: 'moss badge text' },
  { fg: 'moss', bg: 'glass-raised', min: 4.5, use: 'success figures in cards' },
  { fg: 'moss', bg: 'glass', min: 4.5, use: 'success figures on the page' },
  { fg: 'paprika', bg: 'paprika-tint', min: 4.5, use: 'caution icon and figures inside cautions' },
  { fg: 'steel-edge', bg: 'glass-raised', min: 3, use: 'input and select borders' },
  { fg: 'steel-edge', bg: 'glass', min: 3, use: 'secondary button border' },
  { fg: 'paprika', bg: 'glass-raised', min: 3, use: 'invalid input border, caution stripe' },
  { fg: 'brass', bg: 'glass', min: 3, use: 'selected tab marker' },
  { fg: 'ink', bg: 'glass', min: 3, use: 'focus ring on the page' },
  { fg: 'ink', bg: 'glass-raised', min: 3, use: 'focus ring in cards' },
  { fg: 'ink', bg: 'paprika-tint', min: 3, use: 'focus ring inside cautions' },
]

function channel(value: number): number {
  const c = value / 255
  // 0.03928 as published in WCAG 2.1; no 8-bit value falls between it and sRGB's 0.04045.
  return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4
}

/** Relative luminance of an sRGB colour, WCAG 2.1 §1.4.3, relative luminance definition. */
export function relativeLuminance(color: string): number {
  const m = /^#([0-9a-f]{6})$/i.exec(color)
  if (!m) throw new Error(`Expected a #rrggbb colour, got "${color}"`)
  const n = Number.parseInt(m[1]!, 16)
  return 0.2126 * channel((n >> 16) & 0xff) + 0.7152 * channel((n >> 8) & 0xff) + 0.0722 * channel(n & 0xff)
}

/** Contrast ratio (L1 + 0.05) / (L2 + 0.05), lighter over darker: 1 to 21. */
export function contrastRatio(a: string, b: string): number {
  const [hi, lo] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x) as [number, number]
  return (hi + 0.05) / (lo + 0.05)
}
