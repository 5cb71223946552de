import type { Config } from 'tailwindcss';

/**
 * Halflight's own look: a dusk-blue "ink" for structure, a lamp-amber "glow" for action and
 * emphasis, warm "paper" surfaces, with "moss" and "brick" for good and bad news.
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ink: {
          50: '#f2f1fa',
          100: '#e2e0f3',
          200: '#c5c1e6',
          300: '#a09ad2',
          400: '#7d76ba',
          500: '#625ba3',
          600: '#4d4788',
          700: '#3c376c',
          800: '#2a2650',
          900: '#1c1938',
          950: '#121026',
        },
        glow: {
          50: '#fff8ec',
          100: '#feeccb',
          200: '#fcd590',
          300: '#f9b953',
          400: '#f09a27',
          500: '#d97d10',
          600: '#b25f0b',
          700: '#86460d',
        },
        paper: {
          50: '#fcfbf8',
          100: '#f7f4ed',
          200: '#ece7db',
          300: '#dcd4c3',
        },
        moss: { 100: '#e3f1e6', 500: '#3f8a58', 700: '#2a5e3b' },
        brick: { 100: '#f8e4e0', 500: '#b4432f', 700: '#7f2b1d' },
      },
      fontFamily: {
        sans: ['Lato', 'system-ui', 'sans-serif'],
      },
      fontSize: {
        caption: ['0.75rem', { lineHeight: '1.1rem', letterSpacing: '0.02em' }],
        body: ['0.9375rem', { lineHeight: '1.5rem' }],
        lead: ['1.125rem', { lineHeight: '1.7rem' }],
        title: ['1.5rem', { lineHeight: '2rem', letterSpacing: '-0.01em' }],
        display: ['2.125rem', { lineHeight: '2.6rem', letterSpacing: '-0.015em' }],
      },
      borderRadius: { card: '0.625rem' },
      boxShadow: { card: '0 1px 2px rgb(18 16 38 / 0.06), 0 4px 14px rgb(18 16 38 / 0.05)' },
    },
  },
} satisfies Config;
