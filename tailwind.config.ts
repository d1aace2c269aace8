import type { Config } from 'tailwindcss';

// Riparia's own palette, named after a riverbank: deep water, reeds, silt and the birds that fish it.
export default {
	content: ['./src/**/*.{html,svelte,ts}'],
	theme: {
		extend: {
			colors: {
				fen: {
					50: '#eef6f1',
					100: '#d5e9dd',
					200: '#acd3bc',
					300: '#7fb38f',
					400: '#4f9470',
					500: '#2f7a58',
					600: '#1e5b47',
					700: '#184a3a',
					800: '#12382d',
					900: '#0c261f'
				},
				silt: {
					50: '#faf8f3',
					100: '#f3efe5',
					200: '#e7dfcc',
					300: '#d4c7a8',
					400: '#b8a47a',
					500: '#9a8558'
				},
				loam: {
					400: '#6b7a72',
					500: '#4a5a52',
					600: '#35443c',
					700: '#25332c',
					900: '#1b2a23'
				},
				kingfisher: {
					100: '#dcedf3',
					500: '#1d6f8c',
					600: '#175a72',
					700: '#12475a'
				},
				marigold: {
					100: '#fbefd6',
					500: '#c98a1b',
					700: '#8a5c0c'
				},
				ember: {
					100: '#f8e0dc',
					500: '#b23a2e',
					700: '#84271e'
				}
			},
			fontFamily: {
				display: ['Merriweather', 'Georgia', 'serif'],
				sans: ['"Source Sans 3"', 'system-ui', 'sans-serif']
			},
			fontSize: {
				// A 1.2 modular scale from a 17 px body, so long journal entries read comfortably.
				xs: ['0.78rem', { lineHeight: '1.1rem' }],
				sm: ['0.9rem', { lineHeight: '1.35rem' }],
				base: ['1.0625rem', { lineHeight: '1.65rem' }],
				lg: ['1.275rem', { lineHeight: '1.85rem' }],
				xl: ['1.53rem', { lineHeight: '2.1rem' }],
				'2xl': ['1.836rem', { lineHeight: '2.4rem' }],
				'3xl': ['2.2rem', { lineHeight: '2.75rem' }]
			},
			borderRadius: {
				card: '0.6rem'
			},
			boxShadow: {
				card: '0 1px 2px rgb(18 56 45 / 0.06), 0 2px 8px rgb(18 56 45 / 0.06)'
			}
		}
	}
} satisfies Config;
