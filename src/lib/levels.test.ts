import { describe, expect, it } from 'vitest';
import { levelKey, levelRefs, levelText, parseLevelKey } from './levels';

describe('level keys', () => {
	it('round-trip "2D#2|5/2" and read as "2D (2) J=5/2"', () => {
		const ref = { term: '2D', occurrence: 2, J: '5/2' };
		expect(levelKey(ref)).toBe('2D#2|5/2');
		expect(parseLevelKey('2D#2|5/2')).toEqual(ref);
		expect(levelText('2D#2|5/2')).toBe('2D (2) J=5/2');
		expect(levelText('6D#1|9/2')).toBe('6D J=9/2');
		expect(parseLevelKey('nonsense')).toBeNull();
	});

	it('one key per level and occurrence: d³ ²D (twice) gives 4 keys', () => {
		// ²D occurs twice in d³ (Condon & Shortley), each with J = 3/2, 5/2.
		const refs = levelRefs([{ label: '2D', count: '2', levels: [{ J: '3/2' }, { J: '5/2' }] }]);
		expect(refs.map(levelKey)).toEqual(['2D#1|3/2', '2D#1|5/2', '2D#2|3/2', '2D#2|5/2']);
	});
});
