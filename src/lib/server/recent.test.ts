import { describe, expect, it } from 'vitest';
import { RecentMap } from './recent';

describe('RecentMap (least recently used first out; common practice, no source)', () => {
	it('keeps at most its capacity, dropping the entry used longest ago', () => {
		const m = new RecentMap<number>(2);
		m.set('a', 1);
		m.set('b', 2);
		expect(m.get('a')).toBe(1); // a is now the newest
		m.set('c', 3);
		expect(m.get('b')).toBeUndefined();
		expect(m.get('a')).toBe(1);
		expect(m.get('c')).toBe(3);
	});
});
