import type { Config } from 'tailwindcss';

// Arcbench's identity (see DEVELOPERS.md, "Look and feel"): warm paper
// surfaces, deep "range ink" text, a signal-amber accent for what the user
// marks, and "fit teal" for what the model says.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: { sans: ['"Work Sans"', 'system-ui', 'sans-serif'] },
      colors: {
        paper: { DEFAULT: '#f6f3ec', raised: '#fffdf8', sunk: '#ece7dc' },
        ink: { DEFAULT: '#1b2433', soft: '#3d4a5c', faint: '#6b7686' },
        signal: { DEFAULT: '#d9822b', dark: '#a85e14', light: '#f6d7b0' },
        fit: { DEFAULT: '#1f7a72', dark: '#135650', light: '#cfe9e5' },
        vacuum: '#7a6fa8',
        alert: { DEFAULT: '#b3261e', light: '#f7dcd9' },
        ok: { DEFAULT: '#2e7d32', light: '#dcefdc' },
        // Hairlines between cards, rows and fields.
        line: { DEFAULT: '#e2dccf', strong: '#cfc6b3' },
      },
      fontSize: {
        micro: ['0.75rem', { lineHeight: '1rem' }],
        body: ['0.9375rem', { lineHeight: '1.4rem' }],
        lead: ['1.125rem', { lineHeight: '1.6rem' }],
        title: ['1.5rem', { lineHeight: '2rem', fontWeight: '600' }],
        display: ['2rem', { lineHeight: '2.4rem', fontWeight: '600' }],
      },
      borderRadius: { card: '10px' },
    },
  },
} satisfies Config;
