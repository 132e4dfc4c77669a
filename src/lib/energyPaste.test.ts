/**
 * The paste-a-column reader. The levels come from the engine's Term sheet, so the check values are
 * the LS levels of the configurations: 2p² gives ³P₀,₁,₂ ¹D₂ ¹S₀ (Condon & Shortley 1935, ch. VII,
 * table 1⁷); 3d³ has ²D twice (Condon & Shortley ch. VII; Racah 1943 seniority 1 and 3); 2p³ is odd
 * and gives ⁴S°₃/₂ ²D°₃/₂,₅/₂ ²P°₁/₂,₃/₂ (Condon & Shortley ch. VII). The format itself is our own
 * (common practice for plain-text level lists, no source). Energies are invented.
 */
import { describe, expect, it } from 'vitest';
import { parseConfiguration } from './physics/parse';
import { termSheet } from './physics/report';
import { levelKey, levelRefs } from './levels';
import { readPastedLine, resolvePaste, type PasteLevel, type PasteRow } from './energyPaste';

/** The entry page's level rows in its order (Hund's heuristic order of the terms, ground term first). */
function levelsOf(notation: string, notes: Record<string, string> = {}): PasteLevel[] {
	const sheet = termSheet(parseConfiguration(notation));
	const counts = new Map(sheet.terms.map((t) => [t.label, Number(t.count)]));
	const rank = new Map(sheet.terms.map((t) => [t.label, t.hundRank]));
	const refs = levelRefs(sheet.terms).sort((a, b) => rank.get(a.term)! - rank.get(b.term)!);
	return refs.map((ref) => {
		const key = levelKey(ref);
		const text = notes[key];
		return {
			key,
			...ref,
			count: counts.get(ref.term)!,
			annotation: text ? { observedEnergyText: text, uncertaintyText: null, status: 'confirmed', comment: 'kept', version: 3 } : null
		};
	});
}

const p2 = levelsOf('2p2');
const even2p2 = { notation: '2p2', odd: false };
const one = (line: string, levels = p2, where = even2p2): PasteRow => {
	const { rows } = resolvePaste(line, levels, where);
	expect(rows).toHaveLength(1);
	return rows[0];
};
const goesTo = (line: string, levels = p2, where = even2p2) => {
	const r = one(line, levels, where);
	if (!r.ok) throw new Error(`refused: ${r.message}`);
	return r;
};
const refusal = (line: string, levels = p2, where = even2p2) => {
	const r = one(line, levels, where);
	if (r.ok) throw new Error(`accepted as ${r.levelKey}`);
	return r.message;
};

describe('pasted energies: accepted forms', () => {
	it('the three lines of the brief go to ³P₀, ³P₁ (with ±0.2) and ³P₂', () => {
		const { rows, ok } = resolvePaste('0  3P0\n16.4 3P1 ±0.2\n43.5  J=2 3P2', p2, even2p2);
		expect(ok).toBe(true);
		expect(rows.map((r) => r.ok && r.levelKey)).toEqual(['3P#1|0', '3P#1|1', '3P#1|2']);
		expect(rows[1]).toMatchObject({ energy: { value: 16.4, text: '16.4' }, uncertainty: { value: 0.2, text: '0.2' } });
	});

	it('keeps the digits as typed: 1880 stays "1880", 19 000.123 45 becomes "19000.12345", −12400 is read', () => {
		expect(goesTo('1880 1D2').energy).toEqual({ value: 1880, text: '1880' });
		expect(goesTo('19 000.123 45 1S0').energy).toEqual({ value: 19000.12345, text: '19000.12345' });
		expect(goesTo('19\u2009000 1S0').energy.text).toBe('19000');
		expect(goesTo('\u221212400 1S0').energy).toEqual({ value: -12400, text: '-12400' });
		expect(goesTo('1880.0 1D2').energy.text).toBe('1880.0');
	});

	it('the uncertainty may be written ±0.2, ± 0.2, +/-0.2 or +-0.2, before or after the level', () => {
		for (const line of ['16.4 ±0.2 3P1', '16.4 ± 0.2 3P1', '16.4 3P1 +/-0.2', '16.4 3P1 +- 0.2', '16.4±0.2 3P1'])
			expect(goesTo(line).uncertainty, line).toEqual({ value: 0.2, text: '0.2' });
	});

	it('labels as the app prints them and other usual spellings: ³P₁, 3P_1, 3P J=1, J:1 3P, the key 3P#1|1', () => {
		for (const line of ['16.4 ³P₁', '16.4 3P_1', '16.4 3P J=1', '16.4 J:1 3P', '16.4 J 1 3P', '16.4 3P#1|1'])
			expect(goesTo(line).levelKey, line).toBe('3P#1|1');
	});

	it('J alone when one level has it (J=0 is ³P₀ or ¹S₀: ambiguous; J=1 is only ³P₁); a term alone when it has one level (¹D)', () => {
		expect(goesTo('16.4 J=1').levelKey).toBe('3P#1|1');
		expect(goesTo('10000 1D').levelKey).toBe('1D#1|2');
	});

	it('tabs and semicolons separate columns; blank lines and # lines are skipped; a quoted comment is kept; " # …" is a remark', () => {
		const { rows, ok } = resolvePaste('# E (cm-1)\tlevel\n\n0\t3P0\n16.4;3P1 "from plate 7" # not saved', p2, even2p2);
		expect(ok).toBe(true);
		expect(rows.map((r) => r.line)).toEqual([3, 4]);
		expect(rows[1]).toMatchObject({ ok: true, levelKey: '3P#1|1', comment: 'from plate 7' });
		expect(rows[0]).toMatchObject({ comment: null });
	});

	it('a repeated term takes its occurrence: 3d3 2D(2)5/2 and 2D#2|5/2 name the second ²D', () => {
		const d3 = levelsOf('3d3');
		const where = { notation: '3d3', odd: false };
		expect(goesTo('15000 2D(2)5/2', d3, where).levelKey).toBe('2D#2|5/2');
		expect(goesTo('15000 2D#2|5/2', d3, where).levelKey).toBe('2D#2|5/2');
		expect(goesTo('15000 2D(1) J=3/2', d3, where).levelKey).toBe('2D#1|3/2');
	});

	it('odd parity: 4S°3/2, 4So3/2 and 4S3/2 all go to ⁴S°₃/₂ of 2p3', () => {
		const p3 = levelsOf('2p3');
		const where = { notation: '2p3', odd: true };
		for (const line of ['0 4S°3/2', '0 4So3/2', '0 4S3/2', '0 ⁴S°₃/₂']) expect(goesTo(line, p3, where).levelKey, line).toBe('4S#1|3/2');
	});

	it('an existing note is shown as what the line replaces, with its version', () => {
		const noted = levelsOf('2p2', { '1D#1|2': '1880' });
		expect(goesTo('15867.9 1D2', noted).replaces).toMatchObject({ observedEnergyText: '1880', version: 3, status: 'confirmed' });
		expect(goesTo('0 3P0', noted).replaces).toBeNull();
	});
});

describe('pasted energies: each refusal says why', () => {
	it('a comma is ambiguous (17,300 could be 17.3 or 17300) and is not taken as a column separator', () => {
		expect(refusal('17,300 1D2')).toMatch(/comma, which is ambiguous/);
		expect(refusal('0, 3P0')).toMatch(/comma/);
	});

	it('a line that does not start with a number, a bad number, and an energy glued to its label', () => {
		expect(refusal('Energy level')).toMatch(/must start with the observed energy/);
		expect(refusal('3P1 16.4')).toBe(
			'"3P1" is a level, but the line must start with the observed energy: write the energy first (e.g. 16.4 3P1)'
		);
		expect(refusal('1.2.3 3P1')).toMatch(/"1.2.3" is not a number/);
		expect(refusal('16.4P1')).toMatch(/leave a space between the energy and the level/);
		expect(refusal('2e4 3P1')).toMatch(/leave a space|without an exponent/);
		expect(refusal('20000000 3P1')).toMatch(/between −10⁷ and 10⁷/);
	});

	it('a bad uncertainty: missing after ±, negative, or a bare second number without ±', () => {
		expect(refusal('16.4 3P1 ±')).toMatch(/± has no uncertainty/);
		expect(refusal('16.4 3P1 ±-0.2')).toMatch(/must not be negative/);
		expect(refusal('16.4 0.2 3P1')).toMatch(/mark an uncertainty with ±|unexpected/);
		expect(refusal('16.4 3P1 ±abc')).toMatch(/is not a number/);
	});

	it('an unknown label, a term not in this configuration, a lowercase term', () => {
		expect(refusal('16.4 foo')).toMatch(/"foo" is not a level label/);
		expect(refusal('16.4 4P1')).toBe('4P is not a term of 2p2 (its terms: 3P, 1D, 1S)');
		expect(refusal('16.4 3p1')).toMatch(/capital letters/);
	});

	it('J not in the term, J not in the configuration, J and label that disagree, a J that is no J', () => {
		expect(refusal('16.4 3P3')).toBe('3P has no level J=3 in 2p2 (its J values: 0, 1, 2)');
		expect(refusal('16.4 J=3')).toBe('no level of 2p2 has J=3 (J values here: 0, 1, 2)');
		expect(refusal('16.4 3P1 J=2')).toMatch(/3P1 says J=1 but the line also says J=2/);
		expect(refusal('16.4 J=x')).toMatch(/"J=x" is not a J value/);
	});

	it('ambiguous: J=2 (³P₂ and ¹D₂), a term with several levels, a repeated term without its occurrence', () => {
		expect(refusal('16.4 J=2')).toBe('J=2 is ambiguous: 3P J=2, 1D J=2 all have it; add the term (e.g. 3P2)');
		expect(refusal('16.4 3P')).toMatch(/3P is ambiguous: 3P has J = 0, 1, 2; add J/);
		const d3 = levelsOf('3d3');
		expect(refusal('15000 2D5/2', d3, { notation: '3d3', odd: false })).toMatch(/2D occurs 2 times in 3d3; write 2D\(1\) or 2D\(2\)/);
		expect(refusal('15000 2D(3)5/2', d3, { notation: '3d3', odd: false })).toMatch(/no 2D\(3\)/);
	});

	it('an odd-parity mark on an even configuration', () => {
		expect(refusal('16.4 3P°1')).toBe('3P°1 is marked odd (°) but 2p2 has even parity');
	});

	it('two lines for one level are both refused; no level at all; more than one level on a line', () => {
		const { rows, ok } = resolvePaste('16.4 3P1\n0 3P0\n16.5 J=1', p2, even2p2);
		expect(ok).toBe(false);
		expect(rows.map((r) => r.ok)).toEqual([false, true, false]);
		expect(rows[0]).toMatchObject({ message: 'lines 1 and 3 all go to 3P J=1: keep one' });
		expect(refusal('16.4')).toMatch(/no level on this line/);
		expect(refusal('16.4 3P1 1D2')).toMatch(/one level per line/);
	});

	it('an empty paste is not ok (nothing to save)', () => {
		expect(resolvePaste('\n  \n# only a heading', p2, even2p2)).toEqual({ rows: [], ok: false });
	});
});

describe('readPastedLine', () => {
	it('reads the parts without looking up the level', () => {
		expect(readPastedLine('43.5  J=2 3P2 ±0.5 "b"')).toEqual({
			energy: { value: 43.5, text: '43.5' },
			uncertainty: { value: 0.5, text: '0.5' },
			comment: 'b',
			term: '3P',
			odd: false,
			occurrence: null,
			J: '2',
			written: '3P2 J=2'
		});
	});
});
