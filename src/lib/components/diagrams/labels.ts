/**
 * Label pieces for SVG text: the diagrams turn the engine's plain labels ("3P2", "4F3/2 (2)",
 * "(3/2, 1/2)_2", "2p1/2^2 2p3/2") into runs of normal, superscript and subscript text.
 * Only text layout happens here; every label comes from the API as it is.
 */

export type PieceKind = 'normal' | 'sup' | 'sub' | 'note';
export interface Piece {
	text: string;
	kind: PieceKind;
}

const piece = (text: string, kind: PieceKind = 'normal'): Piece => ({ text, kind });

/** ^{2S+1}L°_J (index): odd parity as a ° after L, a repeated term's occurrence as a small "(k)". */
export function termPieces(multiplicity: number | string, letter: string, odd: boolean, J?: string | null, index?: number | null): Piece[] {
	const out = [piece(String(multiplicity), 'sup'), piece(letter)];
	if (odd) out.push(piece('°'));
	if (J != null && J !== '') out.push(piece(J, 'sub'));
	if (index) out.push(piece(` (${index})`, 'note'));
	return out;
}

/** The same as plain text with Unicode super/subscripts where they exist: "³P°₂", "⁴F₃/₂ (2)". */
export function termText(multiplicity: number | string, letter: string, odd: boolean, J?: string | null, index?: number | null): string {
	const sup = '⁰¹²³⁴⁵⁶⁷⁸⁹';
	const sub = '₀₁₂₃₄₅₆₇₈₉';
	const map = (s: string, digits: string) => s.replace(/\d/g, (d) => digits[Number(d)]);
	return `${map(String(multiplicity), sup)}${letter}${odd ? '°' : ''}${J != null ? map(J, sub) : ''}${index ? ` (${index})` : ''}`;
}

const LS_LEVEL = /^(\d+)([A-Z])(°?)(\d+(?:\/2)?)(?:\s*\((\d+)\))?$/;

/** Splits an LS level label of the bridge ("2D3/2 (1)") into its parts; null if it does not look like one. */
export function parseLsLevel(
	label: string
): { multiplicity: string; letter: string; odd: boolean; J: string; index: number | null } | null {
	const m = LS_LEVEL.exec(label.trim());
	if (!m) return null;
	return { multiplicity: m[1], letter: m[2], odd: m[3] === '°', J: m[4], index: m[5] ? Number(m[5]) : null };
}

/** "(3/2, 1/2)_2" or "((1/2, 1/2)_1, 3/2)_1/2": every "_X" becomes a subscript. */
export function groupPieces(group: string): Piece[] {
	const out: Piece[] = [];
	const re = /_(\d+(?:\/2)?)/g;
	let last = 0;
	for (let m = re.exec(group); m; m = re.exec(group)) {
		if (m.index > last) out.push(piece(group.slice(last, m.index)));
		out.push(piece(m[1], 'sub'));
		last = m.index + m[0].length;
	}
	if (last < group.length) out.push(piece(group.slice(last)));
	return out;
}

/** "2p1/2^2 2p3/2": each j-subshell as nl with j as a subscript and the occupancy as a superscript. */
export function subshellPieces(text: string): Piece[] {
	const out: Piece[] = [];
	text
		.trim()
		.split(/\s+/)
		.forEach((token, i) => {
			if (i > 0) out.push(piece(' '));
			const m = /^(\d+[a-z])(\d+\/2)(?:\^(\d+))?$/.exec(token);
			if (!m) return out.push(piece(token));
			out.push(piece(m[1]), piece(m[2], 'sub'));
			if (m[3]) out.push(piece(m[3], 'sup'));
		});
	return out;
}

/** Plain text of pieces with "_" and "^" dropped, for aria labels. */
export function piecesText(pieces: Piece[]): string {
	return pieces.map((p) => p.text).join('');
}

/** Pieces of an LS level label of the bridge, with ° added when the configuration has odd parity. */
export function lsLevelPieces(label: string, odd: boolean): Piece[] {
	const p = parseLsLevel(label);
	return p ? termPieces(p.multiplicity, p.letter, odd || p.odd, p.J, p.index) : [piece(label)];
}

/** A jj level as pieces: its j-subshells, then the coupling group with J as a subscript. */
export function jjLevelPieces(subshells: string, group: string): Piece[] {
	return [...subshellPieces(subshells), piece('  '), ...groupPieces(group)];
}
