import type { Config } from 'tailwindcss';

// Kitlane's own palette. Contrast ratios computed with the WCAG 2.2 relative-luminance formula (W3C WCAG 2.2,
// "contrast ratio"; AA needs 4.5:1 for body text): white on brand-700 (header) 5.47, brand-700 on canvas 5.12,
// brand-800 links on white 7.58 and on canvas-sunken (footer) 6.40, ink on canvas 16.0, ink-muted on canvas
// 7.41 and on canvas-sunken 6.68, danger-800 on danger-50 7.79, success-700 on success-50 5.48, ink on
// accent-300 11.5. Amber is a fill behind ink text only (amber-400 on canvas is 1.7:1: never text or rings).
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        brand: {
          50: '#effaf8',
          100: '#d5f2ec',
          200: '#aee4da',
          300: '#79cfc1',
          500: '#14948a',
          600: '#0f8077',
          700: '#0f766e',
          800: '#115e59',
          900: '#134e4a',
        },
        canvas: { DEFAULT: '#faf7f2', raised: '#ffffff', sunken: '#f1ebe1' },
        line: { DEFAULT: '#e2d9cc', strong: '#a8998a' },
        ink: { DEFAULT: '#1f1b16', muted: '#57504a' },
        accent: { 100: '#fdf0cf', 300: '#f8cf6a', 400: '#f3b63c', 700: '#92520b' },
        danger: { 50: '#fdf0ef', 700: '#b42318', 800: '#912018' },
        success: { 50: '#eefaf2', 700: '#157347' },
      },
      fontFamily: {
        sans: ['"DM Sans"', 'ui-sans-serif', 'system-ui', 'sans-serif'],
      },
    },
  },
} satisfies Config;
