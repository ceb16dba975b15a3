import type { Config } from 'tailwindcss';

// Phaseloom's design language: a lab notebook, not a dashboard.
// Warm paper, ink text, thin rules; trace colours from the Okabe–Ito colour-blind-safe palette
// (Okabe & Ito, "Color Universal Design", 2002 — common practice in scientific plotting).
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f7f3ea', deep: '#efe8d8', card: '#fbf9f3' },
        ink: { DEFAULT: '#1f1d1a', soft: '#4a463f', faint: '#7d776c' },
        rule: { DEFAULT: '#d9d1bf', strong: '#b9ae97' },
        accent: { DEFAULT: '#0b5f8a', soft: '#dcebf3' },
        caution: { DEFAULT: '#8a5a00', soft: '#f6ead0' },
        danger: { DEFAULT: '#9b2c1f', soft: '#f5dfd9' },
        ok: { DEFAULT: '#2f6b3a', soft: '#dfeedd' },
        trace: {
          orange: '#E69F00',
          sky: '#56B4E9',
          green: '#009E73',
          yellow: '#F0E442',
          blue: '#0072B2',
          vermillion: '#D55E00',
          purple: '#CC79A7',
          black: '#000000',
        },
      },
      fontFamily: {
        sans: ['Inter', 'system-ui', 'sans-serif'],
        mono: ['"JetBrains Mono"', 'ui-monospace', 'monospace'],
      },
      borderWidth: { hair: '0.5px' },
      maxWidth: { page: '72rem' },
    },
  },
} satisfies Config;
