/**
 * Response headers every answer gets (pages, API, downloads). The page Content-Security-Policy
 * itself comes from SvelteKit (`kit.csp` in svelte.config.js, with nonces/hashes for its own
 * scripts); answers SvelteKit does not render as a page (JSON, CSV, …) get a policy that allows
 * nothing, since they are never meant to run or embed anything.
 */

/** The policy for non-page answers: nothing may load, nothing may frame it. */
export const NON_PAGE_CSP = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

/** HSTS for a year, subdomains included (only sent over https: browsers ignore it over http). */
export const HSTS = 'max-age=31536000; includeSubDomains';

/** The fixed headers, by name. */
export const FIXED_HEADERS: Record<string, string> = {
	'x-content-type-options': 'nosniff',
	// Nothing of our URLs (a reset link, a project id) leaves for another site.
	'referrer-policy': 'same-origin',
	// Older browsers that do not read CSP frame-ancestors.
	'x-frame-options': 'DENY',
	'cross-origin-opener-policy': 'same-origin',
	'permissions-policy': 'camera=(), microphone=(), geolocation=(), payment=(), usb=()'
};

/**
 * Sets the security headers on `response` (a copy when its headers are immutable) and returns it.
 * `secure` is true when the request came over https (the URL SvelteKit sees: ORIGIN or
 * PROTOCOL_HEADER behind a proxy); only then is HSTS sent.
 */
export function withSecurityHeaders(response: Response, secure: boolean): Response {
	let out = response;
	try {
		out.headers.set('x-content-type-options', 'nosniff');
	} catch {
		// Responses from fetch() have immutable headers; copy them.
		out = new Response(response.body, response);
	}
	for (const [name, value] of Object.entries(FIXED_HEADERS)) out.headers.set(name, value);
	if (secure) out.headers.set('strict-transport-security', HSTS);
	if (!out.headers.has('content-security-policy')) out.headers.set('content-security-policy', NON_PAGE_CSP);
	return out;
}
