import type { Config } from 'tailwindcss';

// Kerfline's palette: warm paper, dark ink, one attention colour, blueprint blue for cut diagrams.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f7f2e8', deep: '#efe7d6', edge: '#d9cdb5' },
        ink: { DEFAULT: '#231f1a', soft: '#4a4238', faint: '#6b6154' },
        attention: { DEFAULT: '#b4380f', soft: '#fbe3d6', ink: '#7a2408' },
        blueprint: { DEFAULT: '#1f4f8f', soft: '#dfe8f5', line: '#8fb0dc' },
        sawdust: '#e8c98f',
        ok: { DEFAULT: '#2f6b3a', soft: '#e0efdf' },
      },
      fontFamily: {
        sans: ['var(--font-ui)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-mono)', 'ui-monospace', 'monospace'],
      },
      borderRadius: { card: '0.625rem' },
      boxShadow: { card: '0 1px 0 rgba(35,31,26,0.08), 0 1px 3px rgba(35,31,26,0.08)' },
      minHeight: { touch: '2.75rem' },
      minWidth: { touch: '2.75rem' },
    },
  },
};

export default config;
