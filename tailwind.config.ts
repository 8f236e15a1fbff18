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
      colors: {
        ink: { DEFAULT: '#14213d', soft: '#334155', muted: '#475569' },
        paper: { DEFAULT: '#ffffff', dim: '#f4f6fa', line: '#cbd2de' },
        brass: { DEFAULT: '#8a5a00', light: '#fdf3d8', bright: '#d4a017' },
        running: { DEFAULT: '#11643a', tint: '#e3f4ea' },
        attention: { DEFAULT: '#8a4b00', tint: '#fff1dc' },
        down: { DEFAULT: '#a3161a', tint: '#fde6e6' },
        shop: { DEFAULT: '#2c4a9a', tint: '#e6ecfa' },
      },
    },
  },
} satisfies Config;
