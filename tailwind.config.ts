import type { Config } from 'tailwindcss';

// Pulseloom's own look: warm paper, ink-blue text, a deep teal for action, and amber/brick
// for warnings and errors. Tailwind 4 reads this file through `@config` in app/globals.css;
// the same tokens are mirrored for Konva drawings in components/plots/palette.ts.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: '#1d2430', muted: '#5b6472' },
        paper: '#f6f4ef',
        panel: '#ffffff',
        line: '#d9d4c7',
        accent: { DEFAULT: '#0f6e6a', ink: '#ffffff', soft: '#e3f0ee' },
        warn: { DEFAULT: '#b7791f', soft: '#fbf1dc' },
        danger: { DEFAULT: '#b33a3a', soft: '#f8e4e2' },
        ok: { DEFAULT: '#2f7d4f', soft: '#e2f1e7' },
      },
      fontFamily: {
        sans: ['var(--font-sans)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-mono)', 'ui-monospace', 'monospace'],
      },
      fontSize: {
        // A compact scale for dense lab tables: 12.5 / 14 / 16 / 20 / 26.
        xs: ['0.78rem', { lineHeight: '1.1rem' }],
        sm: ['0.875rem', { lineHeight: '1.3rem' }],
        base: ['1rem', { lineHeight: '1.5rem' }],
        lg: ['1.25rem', { lineHeight: '1.75rem' }],
        xl: ['1.625rem', { lineHeight: '2.1rem' }],
      },
      borderRadius: { card: '10px' },
    },
  },
};

export default config;
