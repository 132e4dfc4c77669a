/**
 * Security headers (OWASP Secure Headers Project recommendations; MDN for the header syntax).
 */
import { describe, expect, it } from 'vitest';
import { json } from '@sveltejs/kit';
import { HSTS, NON_PAGE_CSP, withSecurityHeaders } from './security-headers';

describe('security headers', () => {
	it('every answer gets nosniff, a referrer policy and no framing', () => {
		const out = withSecurityHeaders(json({ ok: true }), false);
		expect(out.headers.get('x-content-type-options')).toBe('nosniff');
		expect(out.headers.get('referrer-policy')).toBe('same-origin');
		expect(out.headers.get('x-frame-options')).toBe('DENY');
		expect(out.headers.get('content-security-policy')).toBe(NON_PAGE_CSP);
		expect(out.headers.get('strict-transport-security')).toBeNull();
	});

	it('HSTS only over https', () => {
		expect(withSecurityHeaders(json({}), true).headers.get('strict-transport-security')).toBe(HSTS);
	});

	it('a page keeps the CSP SvelteKit wrote', () => {
		const page = new Response('<html></html>', { headers: { 'content-security-policy': "script-src 'self' 'nonce-abc'" } });
		expect(withSecurityHeaders(page, false).headers.get('content-security-policy')).toBe("script-src 'self' 'nonce-abc'");
	});

	it('works on responses with immutable headers (from fetch)', () => {
		class ImmutableHeaders extends Headers {
			set(): void {
				throw new TypeError('immutable');
			}
		}
		const frozen = new Response('x');
		Object.defineProperty(frozen, 'headers', { value: new ImmutableHeaders({ 'content-type': 'text/plain' }) });
		const out = withSecurityHeaders(frozen, false);
		expect(out).not.toBe(frozen);
		expect(out.headers.get('x-content-type-options')).toBe('nosniff');
	});
});
