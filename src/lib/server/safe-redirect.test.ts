/**
 * Open-redirect checks for `next` after sign-in. The tricky inputs follow the WHATWG URL
 * standard (backslash counts as a slash for http(s); tab, CR and LF are stripped) and
 * OWASP's "Unvalidated Redirects and Forwards" cheat sheet.
 */
import { describe, expect, it } from 'vitest';
import { safeNext } from './safe-redirect';

const ORIGIN = 'https://tw.example';

describe('safeNext', () => {
	it('keeps same-origin paths with their query and hash', () => {
		expect(safeNext('/projects/p1', ORIGIN)).toBe('/projects/p1');
		expect(safeNext('/builder?config=3d5%204s&x=1#grid', ORIGIN)).toBe('/builder?config=3d5%204s&x=1#grid');
	});

	it.each([
		['/\\evil.example'],
		['/%09/evil.example'.replace('%09', '\t')],
		['/\t/evil.example'],
		['/\n/evil.example'],
		['\\/evil.example'],
		['//evil.example'],
		['///evil.example'],
		['/\\/evil.example'],
		['https://evil.example/'],
		['javascript:alert(1)'],
		['evil.example'],
		['']
	])('refuses %j', (next) => {
		expect(safeNext(next, ORIGIN)).toBe('/projects');
	});

	it('refuses the URL-encoded tab as it arrives decoded from searchParams', () => {
		const next = new URL('https://tw.example/signin?next=/%09/evil.example').searchParams.get('next');
		expect(safeNext(next, ORIGIN)).toBe('/projects');
	});

	it('a browser resolving the answer stays on our origin', () => {
		for (const next of ['/a', '/\\evil.example', '/\t/evil.example', '/%2F%2Fevil.example']) {
			expect(new URL(safeNext(next, ORIGIN), ORIGIN).origin).toBe(ORIGIN);
		}
	});
});
