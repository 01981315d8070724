import type { Config } from 'tailwindcss';
import typography from '@tailwindcss/typography';

export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: '#1d4d3a', soft: '#2f6a53', faint: '#dbe7e0' },
        brass: { DEFAULT: '#b8892f', soft: '#e9d7ad', deep: '#70521a' },
        paper: { DEFAULT: '#f7f4ec', deep: '#ece6d6', card: '#fffdf8' },
        oxide: { DEFAULT: '#a4372a', soft: '#f6e1dc' },
        graphite: { DEFAULT: '#2b2b28', soft: '#5c5a52' },
      },
      fontFamily: {
        sans: ['"Nunito Sans"', '"Nunito Sans Fallback"', 'system-ui', 'sans-serif'],
      },
      maxWidth: { sheet: '72rem' },
    },
  },
  plugins: [typography],
} satisfies Config;
