import type { Config } from 'tailwindcss';
import { palette } from './src/lib/palette';

// Lobewise's palette comes from src/lib/palette.ts (one definition). Components use these tokens.
// "ink"/"paper" carry text and surfaces, "steel" the quiet UI, "ember" the one accent,
// "gauge" the informational tone, and the state colours always travel with a word.
const config: Config = {
  content: ['./src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: palette,
      fontFamily: {
        sans: ['var(--font-body)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-spec)', 'ui-monospace', 'monospace'],
      },
    },
  },
};

export default config;
