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
				paper: 'var(--tc-paper)',
				panel: 'var(--tc-panel)',
				ink: 'var(--tc-ink)',
				muted: 'var(--tc-muted)',
				rule: 'var(--tc-rule)',
				accent: 'var(--tc-accent)',
				'accent-ink': 'var(--tc-accent-ink)',
				caution: 'var(--tc-caution)',
				'caution-bg': 'var(--tc-caution-bg)',
				danger: 'var(--tc-danger)',
				'danger-bg': 'var(--tc-danger-bg)'
			}
		}
	}
} satisfies Config;
