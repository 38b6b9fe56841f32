import type { Config } from 'tailwindcss';

// Pulsekeeper's palette: a deep night-sky ink for surfaces and one warm "ember" signal accent.
// Fonts ship with the app (see web/main.tsx); nothing is fetched from outside.
export default {
  content: ['./index.html', './web/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        night: {
          100: '#e7e9f3',
          200: '#c9cee3',
          300: '#a3aaca',
          400: '#7b84aa',
          500: '#58618a',
          600: '#3c4570',
          700: '#2a3259',
          800: '#1b2243',
          900: '#121830',
          950: '#0a0e1f',
        },
        ember: {
          200: '#ffdcb4',
          300: '#ffc184',
          400: '#fba457',
          500: '#ef8a32',
          600: '#cf6d1a',
          700: '#a35312',
        },
        calm: { 400: '#63d2ad', 500: '#3fb890' },
        alarm: { 300: '#ffa3a3', 400: '#ff7d7d', 500: '#e65858' },
      },
      fontFamily: {
        sans: ['"Inter Variable"', 'system-ui', 'sans-serif'],
        mono: ['"JetBrains Mono Variable"', 'ui-monospace', 'monospace'],
      },
    },
  },
} satisfies Config;
