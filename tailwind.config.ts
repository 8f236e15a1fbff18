import type { Config } from 'tailwindcss';

// Bumperline's own palette: deep navy ink and a brass accent, with one colour each for
// running, attention and down (always shown beside a word and an icon). Every text pairing
// below meets WCAG 2.2 AA (4.5:1) on white or on its own tint.
export default {
  content: ['./index.html', './apps/web/src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: {
        sans: ['"Nunito Sans Variable"', 'system-ui', 'sans-serif'],
      },
      // The values live in CSS variables (apps/web/src/styles.css) so the dim theme for dark bars swaps them in one
      // place; both themes' pairings are checked there.
      colors: {
        ink: { DEFAULT: 'var(--bl-ink)', soft: 'var(--bl-ink-soft)', muted: 'var(--bl-ink-muted)' },
        paper: { DEFAULT: 'var(--bl-paper)', dim: 'var(--bl-paper-dim)', line: 'var(--bl-paper-line)' },
        brass: { DEFAULT: 'var(--bl-brass)', light: 'var(--bl-brass-light)', bright: 'var(--bl-brass-bright)' },
        running: { DEFAULT: 'var(--bl-running)', tint: 'var(--bl-running-tint)' },
        attention: { DEFAULT: 'var(--bl-attention)', tint: 'var(--bl-attention-tint)' },
        down: { DEFAULT: 'var(--bl-down)', tint: 'var(--bl-down-tint)' },
        shop: { DEFAULT: 'var(--bl-shop)', tint: 'var(--bl-shop-tint)' },
        /** The top and bottom bars: dark in both themes. */
        bar: { DEFAULT: 'var(--bl-bar)', text: 'var(--bl-bar-text)' },
      },
    },
  },
} satisfies Config;
