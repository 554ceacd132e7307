import type { Config } from 'tailwindcss';

// Outturn's look: a paper background, dark ink, one accent for cost and one for time,
// amber for cautions and red kept for invalid input only.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f8f6f1', raised: '#fffdf8', sunk: '#efebe2' },
        ink: { DEFAULT: '#1d2430', soft: '#4a5261', faint: '#7b8190' },
        rule: { DEFAULT: '#d9d3c5', strong: '#b9b19f' },
        cost: { DEFAULT: '#16607a', light: '#d7e9ef', dark: '#0d4154' },
        time: { DEFAULT: '#7a3f86', light: '#efe0f1', dark: '#552a5e' },
        caution: { DEFAULT: '#b7791f', light: '#fbf0d9', dark: '#7c5212' },
        invalid: { DEFAULT: '#c0262d', light: '#fbe3e3' },
        // Opportunities (a risk that saves money or time): a green of our own, never the invalid red.
        opportunity: { DEFAULT: '#2e6b45', light: '#dcefe2' },
      },
      fontFamily: {
        sans: ['var(--font-inter)', 'system-ui', 'sans-serif'],
      },
      fontSize: {
        // A dense type scale: people read numbers all day here.
        '2xs': ['0.6875rem', { lineHeight: '1rem' }],
        xs: ['0.75rem', { lineHeight: '1.05rem' }],
        sm: ['0.8125rem', { lineHeight: '1.2rem' }],
        base: ['0.875rem', { lineHeight: '1.35rem' }],
        lg: ['1rem', { lineHeight: '1.5rem' }],
        xl: ['1.25rem', { lineHeight: '1.75rem' }],
        '2xl': ['1.625rem', { lineHeight: '2.1rem' }],
        '3xl': ['2.25rem', { lineHeight: '2.6rem' }],
      },
      borderRadius: { DEFAULT: '3px' },
    },
  },
};

export default config;
