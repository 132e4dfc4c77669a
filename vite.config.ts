import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	test: {
		// Server tests open their own in-memory databases; keep runs isolated.
		pool: 'forks',
		projects: [
			{
				extends: true,
				test: {
					name: 'server',
					include: ['src/**/*.test.ts'],
					exclude: ['src/**/*.svelte.test.ts'],
					environment: 'node',
					// Each test file gets its own private in-memory database.
					env: { DATABASE_PATH: ':memory:' }
				}
			},
			{
				// Rune state classes (*.svelte.ts) tested with Svelte's client runtime, as the pages run them.
				extends: true,
				resolve: { conditions: ['browser'] },
				test: { name: 'client', include: ['src/**/*.svelte.test.ts'], environment: 'node' }
			}
		]
	}
});
