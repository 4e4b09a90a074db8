import type { Config } from 'tailwindcss';

// Splicepoint's own palette and type scale. Loaded from src/app.css with `@config`.
// Colours are named for what they do on the page, not for their hue.
export default {
	content: ['./src/**/*.{html,svelte,ts}'],
	theme: {
		extend: {
			colors: {
				ink: { DEFAULT: '#1f2933', soft: '#52606d' },
				paper: '#f6f3ec',
				panel: '#ffffff',
				rule: '#d8d1c2',
				copper: { DEFAULT: '#a4501c', dark: '#7d3b12', light: '#f3e2d4' },
				volt: { DEFAULT: '#1d6a86', light: '#dcecf2' },
				ok: { DEFAULT: '#2f7a4b', light: '#e0f0e5' },
				warn: { DEFAULT: '#9a6200', light: '#f7ebd2' },
				fault: { DEFAULT: '#b3261e', light: '#f8e1df' }
			},
			fontFamily: {
				sans: ['"Source Sans 3"', 'system-ui', 'sans-serif'],
				serif: ['Merriweather', 'Georgia', 'serif'],
				mono: ['"JetBrains Mono"', 'ui-monospace', 'monospace']
			},
			fontSize: {
				// A 1.2 ratio scale from a 17 px body size.
				xs: ['0.8125rem', { lineHeight: '1.25rem' }],
				sm: ['0.9375rem', { lineHeight: '1.4rem' }],
				base: ['1.0625rem', { lineHeight: '1.6rem' }],
				lg: ['1.275rem', { lineHeight: '1.8rem' }],
				xl: ['1.53rem', { lineHeight: '2rem' }],
				'2xl': ['1.836rem', { lineHeight: '2.3rem' }],
				'3xl': ['2.203rem', { lineHeight: '2.6rem' }],
				'4xl': ['2.644rem', { lineHeight: '3rem' }]
			},
			maxWidth: { page: '72rem', prose: '40rem' }
		}
	}
} satisfies Config;
