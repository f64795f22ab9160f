import type { Config } from 'tailwindcss';

// Branchwise's own palette and type. Loaded from app/globals.css with @config; the one place
// the theme lives. Colours are never the only carrier of meaning (status shapes and words too).
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {},
  },
};

export default config;
