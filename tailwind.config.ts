import type { Config } from 'tailwindcss'

// Colour roles: slate ink/surfaces, cyan-700 accent, stage colours (high orange, low indigo,
// single slate), danger red-700, caution amber-500, healthy emerald-700. Dark theme follows the system.
export default {
  content: ['./app/**/*.{vue,ts}'],
  darkMode: 'media',
  theme: {
    extend: {
      fontFamily: {
        sans: ['"Atkinson Hyperlegible Next"', 'system-ui', 'sans-serif'],
        mono: ['"Atkinson Hyperlegible Mono"', 'ui-monospace', 'monospace'],
      },
      minHeight: { touch: '44px' },
      minWidth: { touch: '44px' },
    },
  },
} satisfies Config
