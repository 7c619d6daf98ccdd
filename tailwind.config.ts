import type { Config } from 'tailwindcss';

// Tidewarden's own palette: warm paper, ink, a deep tide green-blue and a brass accent.
// Status colours are a second cue only; every status is also written in words.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}', './lib/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f7f6f2', raised: '#ffffff', sunk: '#eeece6' },
        ink: { DEFAULT: '#1c232b', soft: '#46505b', faint: '#5f6872' },
        rule: { DEFAULT: '#d9d5cc', strong: '#b9b3a7' },
        tide: { 50: '#eef6f6', 100: '#d3e8e8', 300: '#7fb4b6', 500: '#2f7479', 600: '#235c61', 700: '#1a474b', 900: '#0f2b2e' },
        brass: { 100: '#f4ead7', 500: '#a67a2c', 700: '#7a5718' },
        // The status palette: one meaning per colour (lib/status/palette.ts, DEVELOPERS.md "Status colours").
        // Text colours are at least 4.5:1 on their own background and on paper.
        state: {
          action: '#a8322e',
          actionbg: '#f8e2e0',
          soon: '#85590c',
          soonbg: '#faefd6',
          sound: '#2d7244',
          soundbg: '#e5f1e8',
          progress: '#1f5a85',
          progressbg: '#e1ecf5',
          over: '#6a3f8f',
          overbg: '#efe6f6',
        },
      },
      fontFamily: {
        sans: ['var(--font-tw)', 'system-ui', 'sans-serif'],
      },
      fontSize: {
        // A compact type scale for dense engineering screens.
        '2xs': ['0.6875rem', { lineHeight: '1rem' }],
        xs: ['0.75rem', { lineHeight: '1.05rem' }],
        sm: ['0.8125rem', { lineHeight: '1.2rem' }],
        base: ['0.875rem', { lineHeight: '1.35rem' }],
        lg: ['1rem', { lineHeight: '1.5rem' }],
        xl: ['1.1875rem', { lineHeight: '1.6rem' }],
        '2xl': ['1.5rem', { lineHeight: '1.9rem' }],
        '3xl': ['2rem', { lineHeight: '2.4rem' }],
      },
    },
  },
};

export default config;
