import type { Config } from 'tailwindcss';

// Kitlane's own palette. Contrast ratios against the canvas (#faf7f2) and white were computed with the
// WCAG 2.x relative-luminance formula (W3C WCAG 2.2, "contrast ratio" definition):
// brand-700 text ≈ 5.2:1 on canvas, ink ≈ 15:1, muted ≈ 7:1. Amber is for fills behind ink text only.
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
