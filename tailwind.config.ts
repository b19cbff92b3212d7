import type { Config } from 'tailwindcss';

/**
 * Hearthcast's own palette: ember (actions), clay (surfaces), slate-teal (information).
 * Contrast of text colours on their backgrounds is ≥ 4.5:1 (WCAG 2.2 AA).
 */
export default {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: { sans: ['Lexend', 'system-ui', 'sans-serif'] },
      colors: {
        ember: { 50: '#fdf3ee', 100: '#fae0d3', 600: '#b4441e', 700: '#963718', 800: '#772c14' },
        clay: { 50: '#fbf7f2', 100: '#f3ebe1', 200: '#e5d6c4', 700: '#5c4a3a', 900: '#2b211a' },
        tide: { 50: '#eef7f7', 600: '#0f6e6e', 700: '#0b5656' },
      },
    },
  },
} satisfies Config;
