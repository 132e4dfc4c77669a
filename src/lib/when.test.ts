import { describe, expect, it } from 'vitest';
import { utcMinute, utcMinuteLabelled } from './when';

// ISO 8601 date and time in UTC, cut to the minute (common practice, no source).
describe('utcMinute', () => {
	it('cuts the seconds instead of rounding them up', () => {
		expect(utcMinute('2026-12-03T14:05:59.999Z')).toBe('2026-12-03 14:05');
	});
	it('shows the moment in UTC whatever offset it was written with', () => {
		expect(utcMinute('2026-12-03T23:30:00-02:00')).toBe('2026-12-04 01:30');
		expect(utcMinute(new Date(Date.UTC(2026, 0, 2, 3, 4)))).toBe('2026-01-02 03:04');
	});
	it('can say its zone', () => {
		expect(utcMinuteLabelled('2026-12-03T14:05:00Z')).toBe('2026-12-03 14:05 UTC');
	});
});
