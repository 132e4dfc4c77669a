import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	test: {
		include: ['src/**/*.test.ts'],
		environment: 'node',
		// Each test file gets its own private in-memory database.
		env: { DATABASE_PATH: ':memory:' },
		// Server tests open their own in-memory databases; keep runs isolated.
		pool: 'forks'
	}
});
