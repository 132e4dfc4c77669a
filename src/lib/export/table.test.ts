import { parseConfiguration } from '../physics/parse';
import { describe, expect, it } from 'vitest';
import { csvSafeCell, latexConfiguration, latexEscape, latexTerm, toCsv, toLatex, type Column } from './table';
import { latexLabel, levelColumns, levelRows } from './term-sheet';
import { termSheet } from '../physics/report';

type Row = { name: string; value: number | null };
const columns: Column<Row>[] = [
	{ key: 'name', value: (r) => r.name },
	{ key: 'value', align: 'r', value: (r) => r.value }
];

describe('exports', () => {
	it('CSV quotes commas and quotes (RFC 4180)', () => {
		expect(toCsv([{ name: 'a, "b"', value: 1 }], columns)).toBe('name,value\r\n"a, ""b""",1');
	});

	// OWASP "CSV Injection" cheat sheet: prefix cells starting with = + - @ tab CR with an apostrophe.
	it('CSV neutralises formula cells with a leading apostrophe', () => {
		const csv = toCsv(
			[
				{ name: '=HYPERLINK("http://evil.example","x")', value: 1 },
				{ name: '+1+cmd|calc', value: 2 },
				{ name: '-2+3', value: 3 },
				{ name: '@SUM(A1)', value: 4 },
				{ name: '\t=1', value: 5 },
				{ name: '\r=1', value: 6 }
			],
			columns
		);
		const lines = csv.split('\r\n');
		expect(lines[1]).toBe(`"'=HYPERLINK(""http://evil.example"",""x"")",1`);
		expect(lines[2]).toBe("'+1+cmd|calc,2");
		expect(lines[3]).toBe("'-2+3,3");
		expect(lines[4]).toBe("'@SUM(A1),4");
		expect(lines[5]).toBe("'\t=1,5");
		expect(lines[6]).toBe(`"'\r=1",6`);
	});

	it('CSV keeps negative numbers and exact fractions as numbers', () => {
		const csv = toCsv(
			[
				{ name: '-5', value: -12400 },
				{ name: '-4/7', value: -0.5 },
				{ name: '+1.5e-3', value: 0 },
				{ name: '−12400', value: null }
			],
			columns
		);
		expect(csv.split('\r\n').slice(1)).toEqual(['-5,-12400', '-4/7,-0.5', '+1.5e-3,0', '−12400,']);
		expect(csvSafeCell(-3)).toBe(-3);
		expect(csvSafeCell('-3 cm-1')).toBe("'-3 cm-1");
		expect(csvSafeCell('=')).toBe("'=");
		expect(csvSafeCell('a=b')).toBe('a=b');
	});

	// The ten LaTeX special characters (Lamport, LaTeX user's guide); booktabs rules (booktabs package manual).
	it('LaTeX escapes the ten specials and uses booktabs rules', () => {
		expect(latexEscape('50% of $x_1 & {y}#')).toBe('50\\% of \\$x\\_1 \\& \\{y\\}\\#');
		const tex = toLatex([{ name: 'x_1', value: null }], columns, 'Test');
		expect(tex).toContain('\\toprule');
		expect(tex).toContain('\\midrule');
		expect(tex).toContain('\\bottomrule');
		expect(tex).toContain('\\begin{longtable}{lr}');
		expect(tex).toContain('x\\_1 &  \\\\');
	});

	it('term symbols in LaTeX: ⁴F°₃/₂ → $^{4}\\mathrm{F}^{\\circ}_{3/2}$', () => {
		expect(latexTerm(4, 'F', '3/2', true)).toBe('$^{4}\\mathrm{F}^{\\circ}_{3/2}$');
	});

	it('the Term sheet export of 3d5 4s has one row per J of each term occurrence and the ⁷S₃ row with g = 2', () => {
		// ⁷S₃: g = 2 exactly for L = 0 (Landé formula); Cr I ground 3d⁵(⁶S)4s ⁷S₃ (NIST ASD, from memory).
		const sheet = termSheet(parseConfiguration('3d5 4s'));
		const rows = levelRows(sheet);
		expect(rows).toHaveLength(sheet.terms.reduce((n, t) => n + Number(t.count) * t.levels.length, 0));
		const csv = toCsv(rows, levelColumns);
		expect(csv.split('\r\n')[0]).toBe('term,occurrence,parentage,count,seniority,S,L,parity,J,g,g_decimal,weight');
		expect(csv).toContain('7S,1,3d⁵(⁶S)4s ⁷S,1,,3,0,even,3,2,2,7');
	});

	it('odd terms carry ° in the export, and parentage labels become LaTeX: 2p3 and 3d5 4s 4p', () => {
		// N I 2p³ ⁴S° (NIST ASD); LaTeX superscripts as in any typeset table (common practice, no source).
		const csv = toCsv(levelRows(termSheet(parseConfiguration('2p3'))), levelColumns);
		expect(csv).toContain('4S°,1,2p³ ⁴S°');
		expect(latexLabel('3d⁵(⁶S)4s(⁷S)4p ⁸P°')).toBe('3d$^{5}$($^{6}$S)4s($^{7}$S)4p $^{8}$P$^{\\circ}$');
		expect(latexLabel('2p⁵(²P°₃/₂)3p ²[5/2]₃')).toBe('2p$^{5}$($^{2}$P$^{\\circ}$$_{3/2}$)3p $^{2}$[5/2]$_{3}$');
	});

	// longtable package manual (Carlisle): \endfirsthead, \endhead, \endfoot, \endlastfoot.
	it('long tables break across pages: longtable with the header repeated and a typeset caption', () => {
		const rows = Array.from({ length: 80 }, (_, i) => ({ name: `r${i}`, value: i }));
		const tex = toLatex(rows, columns, { text: 'Levels of 3d6 4s', latex: `Levels of ${latexConfiguration('3d6 4s')}` });
		expect(tex).toContain('\\usepackage{longtable}');
		expect(tex).not.toContain('\\begin{table}');
		for (const cmd of ['\\endfirsthead', '\\endhead', '\\endfoot', '\\endlastfoot']) expect(tex).toContain(cmd);
		expect(tex).toContain('\\caption{Levels of 3d$^{6}$~4s}');
		expect(tex.split('\n').filter((l) => /^ {2}r\d+ & /.test(l))).toHaveLength(80);
	});

	it('configurations in LaTeX keep the core as typed and raise occupancies: [Ar] 3d6 4s, 4f⁷5d6s², 2p^{3}', () => {
		// Spectroscopic notation with superscript occupancies (Cowan 1981 §1-5), core shorthand as typed.
		expect(latexConfiguration('[Ar] 3d6 4s')).toBe('[Ar]~3d$^{6}$~4s');
		expect(latexConfiguration('[Xe] 4f⁷5d6s²')).toBe('[Xe]~4f$^{7}$~5d~6s$^{2}$');
		expect(latexConfiguration('1s2.2s2.2p^{3}')).toBe('1s$^{2}$~2s$^{2}$~2p$^{3}$');
	});
});
