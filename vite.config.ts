import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

// Unit tests never touch a database file: each test file opens its own in-memory database. Set here,
// before SvelteKit reads the environment, because $env/dynamic/private is fixed when Vitest starts.
if (process.env.VITEST) process.env.DATABASE_PATH = ':memory:';

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
					environment: 'node'
				}
			},
			{
				// Rune state classes (*.svelte.ts) tested with Svelte's client runtime, as the pages run them.
				extends: true,
				resolve: { conditions: ['browser'] },
				test: { name: 'client', include: ['src/**/*.svelte.test.ts'], environment: './vitest.client-environment.ts' }
			}
		]
	}
});
