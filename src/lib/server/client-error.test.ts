/** Parser-level rejections (431, 400) answer in the API's JSON error shape (scripts/client-error.js). */
import { describe, expect, it } from 'vitest';
import { clientErrorResponse } from '../../../scripts/client-error.js';

describe('answers to requests Node cannot parse', () => {
	it('an over-long URL gets 431 with { error: { message } }', () => {
		const raw = clientErrorResponse('HPE_HEADER_OVERFLOW');
		expect(raw.startsWith('HTTP/1.1 431 ')).toBe(true);
		const [head, body] = raw.split('\r\n\r\n');
		expect(head).toMatch(/content-type: application\/json/);
		expect(head).toContain(`content-length: ${Buffer.byteLength(body)}`);
		expect(JSON.parse(body).error.message).toMatch(/over the server limit/);
	});

	it('anything else is a 400 in the same shape', () => {
		const raw = clientErrorResponse('HPE_INVALID_METHOD');
		expect(raw.startsWith('HTTP/1.1 400 ')).toBe(true);
		expect(JSON.parse(raw.split('\r\n\r\n')[1])).toEqual({ error: { message: 'The request could not be parsed as HTTP' } });
	});
});
