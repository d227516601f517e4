import type { Config } from 'tailwindcss'

// Dropwright's design tokens. Two liquids drive the palette: `aqueous` (the dispersed phase, a deep lagoon blue)
// and `oil` (the continuous phase, a warm amber); `slate` is a cool graphite for text and chrome. Status colours
// are reserved for forecast validity and rule findings.
export default {
  content: [
    './components/**/*.{vue,ts}',
    './layouts/**/*.vue',
    './pages/**/*.vue',
    './app.vue',
    './error.vue',
    './plugins/**/*.ts',
  ],
  theme: {
    extend: {
      colors: {
        aqueous: {
          50: '#eef6f9',
          100: '#d5e9f0',
          200: '#a9d2e1',
          300: '#74b4cc',
          400: '#3f90b0',
          500: '#1f6f8b',
          600: '#195a72',
          700: '#16485b',
          800: '#133a49',
          900: '#0f2c38',
        },
        oil: {
          50: '#fdf7ea',
          100: '#f9e9c4',
          200: '#f2d28a',
          300: '#e9b44f',
          400: '#de9a25',
          500: '#c47f0e',
          600: '#9f640b',
          700: '#7a4c0c',
          800: '#5c3a0d',
          900: '#3f280b',
        },
        graphite: {
          50: '#f5f7f8',
          100: '#e9edf0',
          200: '#d3dae0',
          300: '#b0bcc6',
          400: '#8595a3',
          500: '#647686',
          600: '#4e5e6c',
          700: '#3e4a56',
          800: '#2a333c',
          900: '#1a2027',
          950: '#0f1317',
        },
        ok: { 500: '#2f8a57', 100: '#dcf1e4' },
        caution: { 500: '#b86e00', 100: '#fcebd0' },
        fault: { 500: '#b3372b', 100: '#f8dedb' },
      },
      fontFamily: {
        sans: ['"IBM Plex Sans"', 'system-ui', 'sans-serif'],
        mono: ['"JetBrains Mono"', 'ui-monospace', 'monospace'],
      },
      fontSize: {
        xs: ['0.75rem', { lineHeight: '1rem' }],
        sm: ['0.8125rem', { lineHeight: '1.25rem' }],
        base: ['0.875rem', { lineHeight: '1.375rem' }],
        lg: ['1rem', { lineHeight: '1.5rem' }],
        xl: ['1.25rem', { lineHeight: '1.75rem' }],
        '2xl': ['1.5rem', { lineHeight: '2rem' }],
        '3xl': ['2rem', { lineHeight: '2.5rem' }],
      },
      spacing: { panel: '18rem', header: '3.25rem' },
      borderRadius: { DEFAULT: '0.3rem' },
      boxShadow: { panel: '0 1px 2px rgb(15 19 23 / 0.06), 0 4px 12px rgb(15 19 23 / 0.05)' },
    },
  },
  plugins: [],
} satisfies Config
