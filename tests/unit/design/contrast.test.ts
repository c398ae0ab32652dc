import { describe, expect, it } from 'vitest'
import tailwindConfig, { palette as configPalette } from '~~/tailwind.config'
import { contrastRatio, hex, pairings, palette, relativeLuminance } from '~~/assets/css/palette'

// Contrast ratios use WCAG 2.1 §1.4.3, relative luminance definition:
// L = 0.2126 R + 0.7152 G + 0.0722 B on linearised sRGB, ratio = (L1 + 0.05) / (L2 + 0.05).

describe('WCAG 2.1 relative luminance and contrast ratio', () => {
  it('gives luminance 1 for white and 0 for black', () => {
    expect(relativeLuminance('#ffffff')).toBeCloseTo(1, 10)
    expect(relativeLuminance('#000000')).toBe(0)
  })

  it('gives 21:1 for black on white, the maximum', () => {
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 10)
  })

  it('is symmetric in its two colours', () => {
    expect(contrastRatio('#2b1e16', '#f3f6f1')).toBe(contrastRatio('#f3f6f1', '#2b1e16'))
  })

  // Widely quoted reference points: #767676 is the lightest grey passing 4.5:1 on white, #777777 just fails.
  it('puts #767676 on white at 4.54:1 and #777777 at 4.48:1', () => {
    expect(contrastRatio('#767676', '#ffffff')).toBeCloseTo(4.54, 2)
    expect(contrastRatio('#777777', '#ffffff')).toBeCloseTo(4.48, 2)
  })
})

describe('Shelfstead palette pairings meet WCAG AA', () => {
  for (const p of pairings) {
    const ratio = contrastRatio(hex(p.fg), hex(p.bg))
    it(`${p.fg} on ${p.bg} (${p.use}) is ${ratio.toFixed(2)}:1, at least ${p.min}:1`, () => {
      expect(ratio).toBeGreaterThanOrEqual(p.min)
    })
  }

  it('uses steel-line only for decoration: it is too faint for a control edge', () => {
    expect(contrastRatio(palette.steel.line, palette.glass.raised)).toBeLessThan(3)
    expect(pairings.some(p => p.fg === 'steel-line')).toBe(false)
  })
})

describe('Tailwind config uses the checked palette', () => {
  const colors = tailwindConfig.theme.colors as Record<string, unknown>

  it('exports the same palette object it builds its colours from', () => {
    expect(configPalette).toBe(palette)
  })

  it('offers exactly the palette families plus neutral keywords, and none of the Tailwind defaults', () => {
    expect(Object.keys(colors).sort()).toEqual(
      [...Object.keys(palette), 'black', 'current', 'inherit', 'transparent', 'white'].sort(),
    )
  })

  it('maps every family to the palette values', () => {
    for (const family of Object.keys(palette) as (keyof typeof palette)[]) {
      expect(colors[family]).toEqual(palette[family])
    }
  })

  it('names each colour of a pairing that exists in the palette', () => {
    expect(hex('brass-deep')).toBe('#6f480c')
    expect(hex('cream')).toBe('#fffaf0')
    expect(() => hex('paprika-bright')).toThrow(/No colour/)
  })
})
