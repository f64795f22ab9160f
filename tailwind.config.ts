import type { Config } from 'tailwindcss';

// Branchwise's own palette and type. Loaded from app/globals.css with @config; the one place
// the theme lives. Colours are never the only carrier of meaning (status shapes and words too).
// Text pairs used by the components were checked for WCAG AA (4.5:1) on paper-50 and white.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        // Deep blue-green: the shell, primary actions, links.
        ink: {
          50: '#f0f7f5',
          100: '#dfeeeb',
          200: '#bcd9d5',
          300: '#8dbdb9',
          400: '#5a9e9b',
          500: '#2f817f',
          600: '#226a69',
          700: '#1a5757',
          800: '#134545',
          900: '#0e3434',
          950: '#0a2626',
        },
        // Warm neutral: page, surfaces, borders, secondary text.
        paper: {
          0: '#ffffff',
          50: '#fbf9f5',
          100: '#f5f1ea',
          200: '#ebe5da',
          300: '#dcd4c6',
          400: '#bdb3a2',
          500: '#948a79',
          600: '#736a5b',
          700: '#5a5246',
          800: '#3f3a32',
          900: '#2a2621',
        },
        // Copper accent: the mark's lead branch, focus ring, highlights.
        ember: {
          50: '#fdf3ec',
          100: '#f9e1d0',
          200: '#f1c0a0',
          300: '#e59a6c',
          400: '#d67a45',
          500: '#c0612c',
          600: '#a14e22',
          700: '#823f1d',
          800: '#643119',
        },
        // Outcomes: always paired with a word and a shape.
        moss: { 50: '#f0f5ea', 200: '#c9dcb6', 600: '#4a7d34', 700: '#3d6b2a', 800: '#2f5320' },
        ochre: { 50: '#fbf5e0', 200: '#ecd98f', 600: '#96700a', 700: '#7a5a00', 800: '#5e4500' },
        brick: { 50: '#fbeeec', 200: '#efc3bd', 600: '#b93c33', 700: '#a3312a', 800: '#7f2620' },
      },
      fontFamily: {
        // The Greek face carries Γ and other zone labels that the Latin subset lacks.
        sans: ['var(--font-plex-sans)', 'var(--font-plex-greek)', 'ui-sans-serif', 'system-ui', 'sans-serif'],
        mono: ['var(--font-plex-mono)', 'var(--font-plex-greek)', 'ui-monospace', 'monospace'],
      },
      fontSize: {
        '2xs': ['0.6875rem', { lineHeight: '1rem' }],
      },
      boxShadow: {
        panel: '0 1px 0 rgba(42, 38, 33, 0.04), 0 1px 3px rgba(42, 38, 33, 0.06)',
      },
    },
  },
};

export default config;
