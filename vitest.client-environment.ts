/**
 * The vitest environment of the `client` project: Node globals, but modules compiled for the browser
 * (Svelte's client runtime), so $effect runs in rune state tests as it does in the pages.
 */
import type { Environment } from 'vitest/environments';

export default {
	name: 'node-client',
	viteEnvironment: 'client',
	setup: () => ({ teardown: () => {} })
} satisfies Environment;
