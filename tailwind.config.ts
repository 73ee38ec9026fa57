import type { Config } from 'tailwindcss';

// Dubito's theme tokens: one accent for actions, one for warnings, neutral greys for structure.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: {
        sans: ['"Inter Variable"', 'system-ui', 'sans-serif'],
        mono: ['"JetBrains Mono"', 'ui-monospace', 'monospace'],
      },
      colors: {
        accent: { 50: '#eef6f6', 100: '#d5eaea', 500: '#1f7a7a', 600: '#176464', 700: '#114f4f' },
        caution: { 50: '#fdf6e7', 100: '#f9e6bd', 500: '#b7791f', 700: '#7c5214' },
      },
    },
  },
} satisfies Config;
