/**
 * Reading a pasted column of observed energies and deciding, line by line, which level of a Shelf
 * entry each one goes to — or why it cannot go anywhere. Shared by the entry page (live preview) and
 * the server (which reads the text again before saving). Pure: plain text and plain data.
 *
 * THE FORMAT (one level per line; blank lines and lines starting with # are skipped):
 *
 *     <energy> [± <uncertainty>] <level> ["comment"]
 *
 * - energy: first on the line, in cm⁻¹, read by `parseEnergyText` (digits kept as typed, a point as
 *   the decimal mark, spaces or thin spaces between groups of three digits, "-" or "−"; a comma is
 *   refused because it is ambiguous).
 * - uncertainty: optional, anywhere after the energy, marked `±0.2`, `± 0.2`, `+/-0.2` or `+-0.2`.
 * - level: a term with J — `3P1`, `3P_1`, `³P₁`, `4F°3/2`, `4Fo3/2`, `2D(2)5/2` (second ²D), or the
 *   level's key `2D#2|5/2` — and/or `J=2` (`J 2`, `J:2`). J alone is enough when one level has it; a
 *   term alone is enough when it has one level. Both together must agree.
 * - comment: optional, in double quotes, goes into the note's comment; ` # …` after a space is a
 *   remark for the reader of the paste and is not saved.
 * Columns are separated by spaces, tabs or semicolons; commas are not separators (they would be
 * read as decimal commas in some countries). Common practice for plain-text level lists, no source.
 */
import { parseEnergyText } from './energyText';

/** What the preview needs of each level of the entry (a subset of the page's level rows). */
export interface PasteLevel {
	key: string;
	term: string;
	occurrence: number;
	J: string;
	/** How often the term occurs in the configuration. */
	count: number;
	annotation: {
		observedEnergyText: string | null;
		uncertaintyText: string | null;
		status: string;
		comment: string;
		version: number;
	} | null;
}

type Reading = { value: number; text: string };

export type PasteRow =
	| {
			line: number;
			text: string;
			ok: true;
			levelKey: string;
			energy: Reading;
			uncertainty: Reading | null;
			comment: string | null;
			/** The attached note this line replaces, as the preview saw it (its version is checked on save). */
			replaces: PasteLevel['annotation'];
	  }
	| { line: number; text: string; ok: false; message: string };

export interface PastePreview {
	rows: PasteRow[];
	/** True when there is at least one line and every line goes to a level. */
	ok: boolean;
}

/** At most this many lines per paste: more than any entry has levels worth typing by hand. */
export const MAX_PASTE_LINES = 1000;

const SUPERSCRIPTS = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const SUBSCRIPTS = '₀₁₂₃₄₅₆₇₈₉';

/** Unicode super- and subscript digits (as the app prints term symbols) become plain digits. */
function plainDigits(s: string): string {
	return s.replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹₀₁₂₃₄₅₆₇₈₉⁄]/g, (c) => {
		if (c === '⁄') return '/';
		const i = SUPERSCRIPTS.indexOf(c);
		return String(i >= 0 ? i : SUBSCRIPTS.indexOf(c));
	});
}

const GROUP = '[ \\u00a0\\u2009\\u202f]';
/**
 * The number at the start of a line: digits with optional groups of three after a space, and a
 * decimal part. A comma is taken in (so the energy reader can refuse it with its message); a group
 * must not run into a letter, so "0 3P0" reads 0, not 03.
 */
const NUMBER = `[+\\-\\u2212]?\\d[\\d,]*(?:${GROUP}\\d{3}(?![\\dA-Za-z/]))*(?:\\.[\\d,]*(?:${GROUP}\\d{1,3}(?![\\dA-Za-z/.]))*)?`;
const LEADING_NUMBER = new RegExp(`^${NUMBER}`);
/** ± and what follows it: a number that ends at a space (so "± 3P1" is not read as ±3), or the word that is there. */
const UNCERTAINTY = new RegExp(`(?:±|\\+/-|\\+-)\\s*(${NUMBER}(?=\\s|$|["“])|\\S*)`);
const COMMENT = /["“”„]([^"“”]*)["“”]/;
const J_TOKEN = /(?:^|\s)J\s*[=:]?\s*(\S+)/;
/** 3P1, 3P_1, 4F°3/2, 4Fo3/2, 2D(2)5/2, 2D#2|5/2, 3P (term only). */
const LABEL = /^(\d+)([A-Z](?:\[L=\d+\])?)(°|o)?(?:\((\d+)\)|#(\d+))?(?:[_|]?(\d+(?:\/2)?))?$/;

const FORMAT_HINT = 'write a term with J (3P1, 2D(2)5/2), J=2, or both';

interface ReadLine {
	energy: Reading;
	uncertainty: Reading | null;
	comment: string | null;
	term: string | null;
	odd: boolean;
	occurrence: number | null;
	J: string | null;
	/** The level as written, for messages. */
	written: string;
}

/** Reads one line's parts; the level is not looked up yet. Returns a message when the line cannot be read. */
export function readPastedLine(raw: string): ReadLine | string {
	let rest = plainDigits(raw.replace(/[\t;]/g, '  ').trim());
	const num = LEADING_NUMBER.exec(rest);
	if (!num) return `the line must start with the observed energy in cm⁻¹ (e.g. 16.4 3P1); put # before a heading to skip it`;
	const energy = parseEnergyText(num[0], 'Observed energy');
	if (!energy || !energy.ok) return energy?.message ?? 'no observed energy';
	if (energy.value < -1e7 || energy.value > 1e7) return `the observed energy ${num[0]} must be between −10⁷ and 10⁷ cm⁻¹`;
	// A # after a space starts a remark to the end of the line (the key form 2D#2|5/2 has no space before #).
	rest = rest.slice(num[0].length).replace(/\s#.*$/, '');
	if (rest !== '' && !/^\s/.test(rest) && !/^(±|\+\/-|\+-)/.test(rest)) {
		const glued = `${num[0]}${rest.split(/\s/)[0]}`;
		if (LABEL.test(glued))
			return `"${glued}" is a level, but the line must start with the observed energy: write the energy first (e.g. 16.4 ${glued})`;
		return `"${glued}" is not a number: leave a space between the energy and the level`;
	}

	let uncertainty: Reading | null = null;
	const unc = UNCERTAINTY.exec(rest);
	if (unc) {
		const u = parseEnergyText(unc[1], 'Uncertainty');
		if (!u) return 'the ± has no uncertainty after it: write ±0.2, or leave the ± out';
		if (!u.ok) return u.message;
		if (u.value < 0) return `the uncertainty ${unc[1]} must not be negative`;
		if (u.value > 1e6) return `the uncertainty ${unc[1]} must be at most 10⁶ cm⁻¹`;
		uncertainty = { value: u.value, text: u.text };
		rest = rest.replace(unc[0], ' ');
	}

	let comment: string | null = null;
	const c = COMMENT.exec(rest);
	if (c) {
		comment = c[1].trim();
		if (comment.length > 2000) return 'the comment must be at most 2000 characters';
		rest = rest.replace(c[0], ' ');
	}

	let J: string | null = null;
	const written: string[] = [];
	const j = J_TOKEN.exec(rest);
	if (j) {
		if (!/^\d+(?:\/2)?$/.test(j[1])) return `"J=${j[1]}" is not a J value: write a whole number or a half (J=2, J=5/2)`;
		J = j[1];
		written.push(`J=${J}`);
		rest = rest.replace(j[0], ' ');
	}

	const tokens = rest.split(/\s+/).filter(Boolean);
	if (tokens.length > 1)
		return `unexpected "${tokens.slice(1).join(' ')}" after "${tokens[0]}": one level per line (${FORMAT_HINT}); a second number needs ± to be an uncertainty`;
	let term: string | null = null;
	let odd = false;
	let occurrence: number | null = null;
	if (tokens.length === 1) {
		const m = LABEL.exec(tokens[0]);
		if (!m) {
			if (/^[+\-\u2212]?[\d.]+$/.test(tokens[0]))
				return `a second number "${tokens[0]}": mark an uncertainty with ± (±${tokens[0]}), and name the level (${FORMAT_HINT})`;
			return `"${tokens[0]}" is not a level label: ${FORMAT_HINT}; terms use capital letters (3P, not 3p)`;
		}
		term = `${m[1]}${m[2]}`;
		odd = m[3] !== undefined;
		occurrence = (m[4] ?? m[5]) === undefined ? null : Number(m[4] ?? m[5]);
		const labelJ = m[6] ?? null;
		if (labelJ !== null && J !== null && labelJ !== J) return `${tokens[0]} says J=${labelJ} but the line also says J=${J}`;
		J = labelJ ?? J;
		written.unshift(tokens[0]);
	}
	if (term === null && J === null) return `no level on this line: ${FORMAT_HINT}`;
	return { energy: { value: energy.value, text: energy.text }, uncertainty, comment, term, odd, occurrence, J, written: written.join(' ') };
}

const jValue = (J: string) => (J.endsWith('/2') ? Number(J.slice(0, -2)) / 2 : Number(J));
const listJ = (levels: PasteLevel[]) => [...new Set(levels.map((l) => l.J))].sort((a, b) => jValue(a) - jValue(b)).join(', ');
const termName = (l: Pick<PasteLevel, 'term' | 'occurrence' | 'count'>) => (l.count > 1 ? `${l.term}(${l.occurrence})` : l.term);
const levelName = (l: PasteLevel) => `${termName(l)} J=${l.J}`;

/** Finds the one level a read line names, or says why there is none or more than one. */
function findLevel(r: ReadLine, levels: PasteLevel[], where: { notation: string; odd: boolean }): PasteLevel | string {
	const { notation } = where;
	if (r.term !== null) {
		let pool = levels.filter((l) => l.term === r.term);
		if (pool.length === 0) {
			const terms = [...new Set(levels.map((l) => l.term))].join(', ');
			return `${r.term} is not a term of ${notation} (its terms: ${terms})`;
		}
		if (r.odd && !where.odd) return `${r.written} is marked odd (°) but ${notation} has even parity`;
		const count = pool[0].count;
		if (r.occurrence !== null) {
			if (r.occurrence < 1 || r.occurrence > count)
				return `${r.term} occurs ${count === 1 ? 'once' : `${count} times`} in ${notation}: there is no ${r.term}(${r.occurrence})`;
			pool = pool.filter((l) => l.occurrence === r.occurrence);
		} else if (count > 1) {
			const choices = Array.from({ length: count }, (_, k) => `${r.term}(${k + 1})`).join(' or ');
			return `${r.written} is ambiguous: ${r.term} occurs ${count} times in ${notation}; write ${choices}`;
		}
		if (r.J === null) {
			if (pool.length === 1) return pool[0];
			return `${r.written} is ambiguous: ${r.term} has J = ${listJ(pool)}; add J (e.g. ${r.term}${pool[0].J} or J=${pool[0].J})`;
		}
		const hit = pool.find((l) => l.J === r.J);
		return hit ?? `${r.term} has no level J=${r.J} in ${notation} (its J values: ${listJ(pool)})`;
	}
	const withJ = levels.filter((l) => l.J === r.J);
	if (withJ.length === 0) return `no level of ${notation} has J=${r.J} (J values here: ${listJ(levels)})`;
	if (withJ.length > 1)
		return `J=${r.J} is ambiguous: ${withJ.map(levelName).join(', ')} all have it; add the term (e.g. ${withJ[0].term}${r.J})`;
	return withJ[0];
}

/**
 * Reads a pasted text against an entry's levels. Every non-blank line becomes one row: the level it
 * goes to, with the note it would replace, or the reason it is refused. Two lines for one level are
 * both refused. `ok` is true only when there is at least one row and none is refused.
 * @example resolvePaste('0 3P0\n16.4 3P1 ±0.2', levels, { notation: '2p2', odd: false }).ok // true
 */
export function resolvePaste(text: string, levels: PasteLevel[], where: { notation: string; odd: boolean }): PastePreview {
	const lines = String(text ?? '').split(/\r\n|\r|\n/);
	const rows: PasteRow[] = [];
	lines.forEach((raw, i) => {
		const trimmed = raw.trim();
		if (trimmed === '' || trimmed.startsWith('#')) return;
		const line = i + 1;
		if (rows.length >= MAX_PASTE_LINES) {
			if (rows.length === MAX_PASTE_LINES)
				rows.push({ line, text: trimmed, ok: false, message: `at most ${MAX_PASTE_LINES} lines at a time: paste the rest separately` });
			return;
		}
		const read = readPastedLine(trimmed);
		if (typeof read === 'string') return rows.push({ line, text: trimmed, ok: false, message: read });
		const level = findLevel(read, levels, where);
		if (typeof level === 'string') return rows.push({ line, text: trimmed, ok: false, message: level });
		rows.push({
			line,
			text: trimmed,
			ok: true,
			levelKey: level.key,
			energy: read.energy,
			uncertainty: read.uncertainty,
			comment: read.comment,
			replaces: level.annotation
		});
	});
	// Two lines for one level: neither wins silently.
	const byKey = new Map<string, number[]>();
	for (const r of rows) if (r.ok) byKey.set(r.levelKey, [...(byKey.get(r.levelKey) ?? []), r.line]);
	const result = rows.map((r): PasteRow => {
		const same = r.ok ? byKey.get(r.levelKey)! : [];
		if (!r.ok || same.length === 1) return r;
		const level = levels.find((l) => l.key === r.levelKey)!;
		return { line: r.line, text: r.text, ok: false, message: `lines ${same.join(' and ')} all go to ${levelName(level)}: keep one` };
	});
	return { rows: result, ok: result.length > 0 && result.every((r) => r.ok) };
}
