import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		adapter: adapter({ precompress: false }),
		// The origin check (the CSRF defence Auth.js relies on) is done by our own hook for every
		// non-GET request, forms and JSON alike, before Auth.js or any route sees it
		// (src/lib/server/http/requests.ts, checkRequests). SvelteKit's own check for form posts runs
		// before any hook and refuses every form POST without an Origin, which would refuse mail
		// providers' one-click unsubscribe (RFC 8058); so SvelteKit's is switched off here and ours,
		// stricter and with that one narrow exemption, is the only one.
		csrf: { trustedOrigins: ['*'] },
		csp: {
			mode: 'nonce',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self'],
				// Server-rendered style="" attributes (bar widths, chart colours) need this; no inline <style> or script is allowed.
				'style-src-attr': ['unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self'],
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
