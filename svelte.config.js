import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		adapter: adapter(),
		// Form actions are protected by SvelteKit's origin check; keep it on.
		csrf: { trustedOrigins: [] },
		// Content-Security-Policy for every page. 'auto': SvelteKit adds a nonce (rendered pages) or
		// hashes (prerendered) for its own inline scripts, so no 'unsafe-inline' script is allowed.
		// Styles: stylesheets and <style> elements only from here (or with SvelteKit's nonce);
		// style *attributes* are allowed (style-src-attr), because Svelte renders style="…" for
		// the diagrams and the State grid on the server and the picture export writes computed styles
		// as attributes. Inline style cannot run script; Svelte escapes what users type.
		// Images: data: and blob: for the SVG/PNG export; fonts are self-hosted (@fontsource).
		csp: {
			mode: 'auto',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self'],
				'style-src-attr': ['unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self', 'data:'],
				'connect-src': ['self'],
				'object-src': ['none'],
				'base-uri': ['self'],
				'form-action': ['self'],
				'frame-ancestors': ['none']
			}
		}
	}
};

export default config;
