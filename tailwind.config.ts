import type { Config } from 'tailwindcss';

// Calm slate and ice blue for the everyday; amber and red only for what needs attention.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ice: {
          50: '#f0f8fc',
          100: '#dceff8',
          200: '#b9dff0',
          300: '#86c6e3',
          400: '#4ea6cf',
          500: '#2a88b4',
          600: '#1d6d93',
          700: '#195877',
          800: '#174863',
          900: '#0f3a56',
          950: '#0a2438',
        },
      },
      fontFamily: {
        // The device's own interface font: nothing to download before a slow phone can paint text
        // (a shipped web font cost the scanned unit's first paint about 0.4 s on the slow profile).
        sans: ['system-ui', 'sans-serif'],
        mono: ['ui-monospace', 'SFMono-Regular', 'Menlo', 'monospace'],
      },
    },
  },
};

export default config;
