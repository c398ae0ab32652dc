import type { Config } from 'tailwindcss'
import plugin from 'tailwindcss/plugin'
import defaultTheme from 'tailwindcss/defaultTheme'
import { palette } from './assets/css/palette'

export { palette }

// The colour set replaces Tailwind's defaults on purpose: every colour in the app comes
// from the checked palette, so an unchecked pairing (or decorative red) cannot slip in.
const colors = {
  transparent: 'transparent',
  current: 'currentColor',
  inherit: 'inherit',
  white: '#ffffff',
  black: '#000000',
  ...palette,
}

// Global focus ring and print rules; written as a plugin so they live beside the theme.
const basePlugin = plugin(({ addBase, addVariant, theme }) => {
  addBase({
    ':focus-visible': {
      outline: `3px solid ${theme('colors.ink.DEFAULT')}`,
      outlineOffset: '2px',
      borderRadius: '2px',
    },
    '@media print': {
      'html, body, [class*="bg-glass"]': { background: '#ffffff !important' },
      '*, *::before, *::after': { color: '#000000 !important', boxShadow: 'none !important', textShadow: 'none !important' },
      'nav, .no-print, button.no-print': { display: 'none !important' },
      'a[href]': { color: '#000000', textDecoration: 'none' },
      'table, figure, .ui-card': { breakInside: 'avoid' },
    },
  })
  addVariant('hocus', ['&:hover', '&:focus-visible'])
})

export default {
  content: [
    './components/**/*.{vue,ts}',
    './layouts/**/*.vue',
    './pages/**/*.vue',
    './app.vue',
    './error.vue',
    './composables/**/*.ts',
    './utils/**/*.ts',
  ],
  theme: {
    colors,
    extend: {
      fontFamily: {
        sans: ['"Atkinson Hyperlegible"', ...defaultTheme.fontFamily.sans],
      },
      // Semantic type scale: readable at arm's length; quantities large, labels small.
      fontSize: {
        'label': ['0.9375rem', { lineHeight: '1.3rem', letterSpacing: '0.01em' }],
        'body': ['1.125rem', { lineHeight: '1.7rem' }],
        'lead': ['1.25rem', { lineHeight: '1.85rem' }],
        'heading': ['1.375rem', { lineHeight: '1.8rem', fontWeight: '700' }],
        'title': ['1.875rem', { lineHeight: '2.3rem', fontWeight: '700' }],
        'figure': ['2.25rem', { lineHeight: '2.5rem', fontWeight: '700' }],
        'figure-lg': ['3rem', { lineHeight: '3.25rem', fontWeight: '700' }],
      },
      spacing: {
        // WCAG 2.5.5 target size: every control is at least 44 x 44 CSS px.
        'tap': '2.75rem',
        'tap-lg': '3.5rem',
      },
      borderRadius: {
        control: '0.625rem',
        card: '1rem',
      },
      boxShadow: {
        card: '0 1px 2px rgb(43 30 22 / 0.06), 0 3px 10px rgb(43 30 22 / 0.05)',
        bar: '0 -1px 0 rgb(43 30 22 / 0.08), 0 -4px 14px rgb(43 30 22 / 0.06)',
      },
      ringColor: { DEFAULT: palette.ink.DEFAULT },
      maxWidth: { page: '72rem', prose: '40rem' },
    },
  },
  plugins: [basePlugin],
} satisfies Config
