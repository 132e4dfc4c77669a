/**
 * The radial parameters of one configuration's energy matrix, and how users name them.
 *
 * Parameters are the Slater integrals themselves, in cm⁻¹ (Slater 1960; Cowan 1981, §6-2, §13-1):
 * - F^k(nl, nl), k = 2, 4, …, 2l, within an open subshell with at least two electrons;
 * - F^k(nl, n'l'), k = 2, 4, …, 2·min(l, l'), between two open subshells;
 * - G^k(nl, n'l'), k = |l − l'|, |l − l'| + 2, …, l + l', between two open subshells;
 * - ζ(nl), one spin–orbit parameter per open subshell with l ≥ 1;
 * - E_av, the centre of gravity of the whole configuration (every determinant weighted equally).
 * F^0 only shifts every level of a configuration by the same amount and is folded into E_av, as are
 * all interactions with closed subshells (Cowan 1981, §6-1 and eq. 6.38 ff.). With E_av as a
 * parameter every F^k, G^k and ζ term enters with its configuration average subtracted, so the
 * trace of the full matrix (all M_J) is exactly N_det·E_av (Cowan 1981, §13-1).
 */
import type { Subshell } from './types';
import type { OrbitalSet } from './determinants';
import { L_LETTERS, letterToL } from './letters';

/** One radial parameter of a configuration. `shells` index the open-subshell list. */
export interface RadialParameter {
	/** Stable text id: "F2(3d,3d)", "G1(2p,3s)", "zeta(3d)". */
	id: string;
	kind: 'F' | 'G' | 'zeta';
	k: number | null;
	shells: number[];
}

/** What users send: every integral missing from the lists counts as 0 cm⁻¹. */
export interface EnergyParameterInput {
	Eav?: number;
	F?: { k: number; a: string; b: string; value: number }[];
	G?: { k: number; a: string; b: string; value: number }[];
	zeta?: { shell: string; value: number }[];
}

/** Parameters resolved against a configuration: E_av and one value per `RadialParameter` (same order). */
export interface ResolvedParameters {
	Eav: number;
	values: Float64Array;
}

/** "3d" for n = 3, l = 2. */
export function shellName(s: Pick<Subshell, 'n' | 'l'>): string {
	return `${s.n}${L_LETTERS[s.l]}`;
}

/**
 * Every radial parameter of the configuration's open subshells, in a fixed order: per subshell
 * F^k then ζ, then per pair F^k and G^k.
 * @example radialParameters(orbitalSet(parseConfiguration('3d2'))).map((p) => p.id) // ['F2(3d,3d)', 'F4(3d,3d)', 'zeta(3d)']
 */
export function radialParameters(set: OrbitalSet): RadialParameter[] {
	const out: RadialParameter[] = [];
	const names = set.shells.map(shellName);
	set.shells.forEach((s, i) => {
		if (s.occupancy >= 2)
			for (let k = 2; k <= 2 * s.l; k += 2) out.push({ id: `F${k}(${names[i]},${names[i]})`, kind: 'F', k, shells: [i, i] });
		if (s.l >= 1) out.push({ id: `zeta(${names[i]})`, kind: 'zeta', k: null, shells: [i] });
	});
	for (let i = 0; i < set.shells.length; i++) {
		for (let j = i + 1; j < set.shells.length; j++) {
			const a = set.shells[i];
			const b = set.shells[j];
			for (let k = 2; k <= 2 * Math.min(a.l, b.l); k += 2) out.push({ id: `F${k}(${names[i]},${names[j]})`, kind: 'F', k, shells: [i, j] });
			for (let k = Math.abs(a.l - b.l); k <= a.l + b.l; k += 2)
				out.push({ id: `G${k}(${names[i]},${names[j]})`, kind: 'G', k, shells: [i, j] });
		}
	}
	return out;
}

function parseShell(text: string): { n: number; l: number } | null {
	const m = /^\s*(\d{1,2})\s*([a-z])\s*$/i.exec(String(text));
	if (!m) return null;
	const l = letterToL(m[2].toLowerCase());
	return l === null ? null : { n: Number(m[1]), l };
}

/** Describes why a subshell named in a parameter is not usable: unknown, closed, or not in the configuration. */
function shellIndex(set: OrbitalSet, all: readonly Subshell[], text: string, what: string): number {
	const s = parseShell(text);
	if (!s) throw new RangeError(`${what}: "${text}" is not a subshell name (write it like 3d or 4f)`);
	const i = set.shells.findIndex((x) => x.n === s.n && x.l === s.l);
	if (i >= 0) return i;
	const open = set.shells.map(shellName).join(', ') || 'none';
	if (all.some((x) => x.n === s.n && x.l === s.l)) {
		throw new RangeError(`${what}: ${shellName(s)} is a closed subshell; its interactions only shift E_av (open subshells: ${open})`);
	}
	throw new RangeError(`${what}: ${shellName(s)} is not a subshell of the configuration (open subshells: ${open})`);
}

/**
 * Resolves user parameters against the configuration. A missing F^k, G^k or ζ counts as 0.
 * Throws RangeError naming the integral when it cannot occur in the configuration (k of the wrong
 * parity or out of range, F^0 given, a subshell that is unknown, closed, or has one electron for
 * F^k within it, ζ of an s subshell), when one is given twice, or when a value is not finite.
 * @example resolveParameters(set3d2, { F: [{ k: 2, a: '3d', b: '3d', value: 60000 }] }).values[0] // 60000
 */
export function resolveParameters(set: OrbitalSet, all: readonly Subshell[], input: EnergyParameterInput): ResolvedParameters {
	const params = radialParameters(set);
	const byId = new Map(params.map((p, i) => [p.id, i]));
	const values = new Float64Array(params.length);
	const seen = new Set<string>();
	const put = (id: string, value: number, what: string) => {
		if (!Number.isFinite(value)) throw new RangeError(`${what}: the value must be a finite number of cm⁻¹`);
		if (seen.has(id)) throw new RangeError(`${what} is given twice`);
		seen.add(id);
		values[byId.get(id)!] = value;
	};
	const Eav = input.Eav ?? 0;
	if (!Number.isFinite(Eav)) throw new RangeError('Eav must be a finite number of cm⁻¹');
	const names = set.shells.map(shellName);
	for (const kind of ['F', 'G'] as const) {
		for (const item of input[kind] ?? []) {
			const what = `${kind}^${item.k}(${item.a},${item.b})`;
			if (!Number.isInteger(item.k) || item.k < 0) throw new RangeError(`${what}: k must be a non-negative integer`);
			let i = shellIndex(set, all, item.a, what);
			let j = shellIndex(set, all, item.b, what);
			if (i > j) [i, j] = [j, i];
			const a = set.shells[i];
			const b = set.shells[j];
			if (kind === 'F' && item.k === 0)
				throw new RangeError(`${what}: F^0 shifts every level equally and is part of E_av; give Eav instead`);
			if (kind === 'G' && i === j)
				throw new RangeError(`${what}: exchange integrals G^k join two different subshells; within ${names[i]} use F^k`);
			if (kind === 'F' && i === j && a.occupancy < 2)
				throw new RangeError(`${what}: ${names[i]} holds one electron, so F^k within it does not occur`);
			const lo = kind === 'F' ? 2 : Math.abs(a.l - b.l);
			const hi = kind === 'F' ? 2 * Math.min(a.l, b.l) : a.l + b.l;
			if (item.k < lo || item.k > hi || (item.k - lo) % 2 !== 0) {
				const allowed = [];
				for (let k = lo; k <= hi; k += 2) allowed.push(k);
				throw new RangeError(`${what} cannot occur: for ${names[i]} and ${names[j]} k must be one of ${allowed.join(', ') || 'none'}`);
			}
			put(`${kind}${item.k}(${names[i]},${names[j]})`, item.value, what);
		}
	}
	for (const item of input.zeta ?? []) {
		const what = `zeta(${item.shell})`;
		const i = shellIndex(set, all, item.shell, what);
		if (set.shells[i].l === 0) throw new RangeError(`${what}: an s subshell has no spin–orbit splitting (l = 0)`);
		put(`zeta(${names[i]})`, item.value, what);
	}
	return { Eav, values };
}

/**
 * Condon–Shortley denominators D_k with F_k = F^k / D_k (Condon & Shortley 1935, §6⁸; the usual
 * values p: D₂ = 25; d: D₂ = 49, D₄ = 441; f: D₂ = 225, D₄ = 1089, D₆ = 184041/25 = 7361.64, quoted
 * from memory; p and d checked in the tests against the p² and d² term energies). Returns null for other l or k.
 * @example condonShortleyDenominator(2, 4) // 441
 */
export function condonShortleyDenominator(l: number, k: number): number | null {
	const table: Record<string, number> = { '1,2': 25, '2,2': 49, '2,4': 441, '3,2': 225, '3,4': 1089, '3,6': 184041 / 25 };
	return table[`${l},${k}`] ?? null;
}

/**
 * Racah's B and C of a d subshell from F² and F⁴ (cm⁻¹): B = F₂ − 5F₄, C = 35F₄ with F₂ = F²/49,
 * F₄ = F⁴/441 (Racah 1942, Phys. Rev. 62, 438; Griffith 1961, Table A20).
 * @example racahFromSlater(49 * 1000 + 7 * 4000, 63 * 4000 / 5) // { B: 1000, C: 4000 }
 */
export function racahFromSlater(F2: number, F4: number): { B: number; C: number } {
	const f2 = F2 / 49;
	const f4 = F4 / 441;
	return { B: f2 - 5 * f4, C: 35 * f4 };
}

/**
 * F² and F⁴ of a d subshell from Racah's B and C: F² = 49B + 7C, F⁴ = 63C/5 (inverse of `racahFromSlater`).
 * @example slaterFromRacah(1000, 4000) // { F2: 77000, F4: 50400 }
 */
export function slaterFromRacah(B: number, C: number): { F2: number; F4: number } {
	return { F2: 49 * B + 7 * C, F4: (63 * C) / 5 };
}
