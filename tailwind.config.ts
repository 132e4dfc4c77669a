/**
 * Termwright's theme. Tailwind 4 reads it through `@config` in src/app.css.
 * Roles, not hues: ink/paper for text and ground, accent for actions and focus,
 * caution (amber) for "heuristic / needs review", danger (muted red) for errors.
 */
import type { Config } from 'tailwindcss';

export default {
	content: ['./src/**/*.{html,svelte,ts}'],
	darkMode: 'class',
	theme: {
		extend: {
			fontFamily: {
				sans: ['"Fira Sans"', 'system-ui', 'sans-serif'],
				mono: ['"Fira Mono"', 'ui-monospace', 'monospace']
			},
			colors: {
				paper: 'var(--tw-paper)',
				panel: 'var(--tw-panel)',
				ink: 'var(--tw-ink)',
				muted: 'var(--tw-muted)',
				rule: 'var(--tw-rule)',
				accent: 'var(--tw-accent)',
				'accent-ink': 'var(--tw-accent-ink)',
				caution: 'var(--tw-caution)',
				'caution-bg': 'var(--tw-caution-bg)',
				danger: 'var(--tw-danger)',
				'danger-bg': 'var(--tw-danger-bg)'
			}
		}
	}
} satisfies Config;
