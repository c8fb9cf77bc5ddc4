// Tailwind theme for Benchlore: paper, ink, teal and amber colours and the three type families.
/* Contrast ratios (WCAG 2.x relative luminance) are noted beside each text colour; all text pairs are
   at least 4.5:1 on paper (#f6f1e7). Amber itself (2.7:1) is for rules and fills only, never text. */

/** @type {import('tailwindcss').Config} */
module.exports = {
  content: ['./src/**/*.{astro,html,js,jsx,md,mdx,ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: {
          DEFAULT: '#f6f1e7', // page background
          deep: '#ece4d3', // header and footer bands, table heads
          light: '#fffdf8', // inputs and cards
        },
        ink: {
          DEFAULT: '#1c2726', // body copy: 13.6:1 on paper
          soft: '#4d5957', // secondary text: 6.5:1 on paper, 5.8:1 on paper-deep
        },
        teal: {
          DEFAULT: '#0f4c4a', // headings, links, buttons: 8.7:1 on paper
          dark: '#0a3735', // hover and pressed: 11.6:1 on paper
          wash: '#dcebe8', // tinted panels: teal text 7.9:1 on it
        },
        amber: {
          DEFAULT: '#c7861a', // caution rules and fills only (2.7:1 on paper: not for text)
          ink: '#7a4a06', // caution text and symbols: 6.6:1 on paper, 6.6:1 on amber-wash
          wash: '#fbefd6', // caution box background
        },
        rule: {
          DEFAULT: '#d8ccb6', // decorative hairlines
          strong: '#8a7d66', // form control borders: 3.6:1 on paper, 4.0:1 on paper-light
        },
        brick: {
          DEFAULT: '#9a2f1f', // errors: 6.7:1 on paper
          wash: '#fbe9e4', // error box background: brick text 6.4:1 on it
        },
      },
      fontFamily: {
        serif: ['"Source Serif 4"', 'Georgia', 'Cambria', '"Times New Roman"', 'serif'],
        sans: ['"IBM Plex Sans"', 'system-ui', '-apple-system', '"Segoe UI"', 'Roboto', 'Arial', 'sans-serif'],
        mono: ['"IBM Plex Mono"', 'ui-monospace', 'SFMono-Regular', 'Menlo', 'Consolas', 'monospace'],
      },
      maxWidth: {
        reading: '42rem', // about 70 characters of serif body text
      },
    },
  },
  plugins: [],
};
