/**
 * Where to go after signing in. The `next` query parameter is user input: it is followed only
 * when it resolves, against this site's origin, to a path on this same origin. A string test
 * ("starts with / but not //") is not enough: browsers read `/\evil.example` and `/\t/evil.example`
 * as `//evil.example` (WHATWG URL parser: backslash is a slash in special schemes, tab and
 * newline are removed), so the resolved URL's origin is compared instead.
 */
export const DEFAULT_AFTER_SIGN_IN = '/projects';

/**
 * The same-origin path (path + query + hash) that `next` points to, or `fallback`.
 * Example: `safeNext('/projects/p1?x=1', 'https://tw.example')` → `'/projects/p1?x=1'`;
 * `safeNext('/\\evil.example', 'https://tw.example')` → `'/projects'`.
 */
export function safeNext(next: string | null | undefined, origin: string, fallback = DEFAULT_AFTER_SIGN_IN): string {
	if (!next || !next.startsWith('/')) return fallback;
	let resolved: URL;
	try {
		resolved = new URL(next, origin);
	} catch {
		return fallback;
	}
	if (resolved.origin !== new URL(origin).origin) return fallback;
	// Send the normalised form, so what the browser follows is exactly what was checked.
	return resolved.pathname + resolved.search + resolved.hash;
}
