/**
 * Intermediate-coupling levels of one configuration from its Slater and spin–orbit parameters:
 * energy, J, parity, LS composition (seniority-resolved for one open subshell), jj composition
 * (by the number of electrons in j = l − ½ of each subshell), Landé g and a label from the
 * leading LS component (Condon & Shortley 1935, ch. XI; Cowan 1981, ch. 10–12).
 * Computed energies are models, not measurements.
 */
import type { Configuration, Subshell } from './types';
import { energyStructure, jjWeight, type EnergyStructure } from './energy-structure';
import { resolveParameters, type EnergyParameterInput } from './slater-parameters';
import { symmetricEigen } from './symmetric-eigen';
import { asSubshells, parseConfiguration } from './parse';
import { halfString } from './half';
import { termLabel } from './terms';

/** Shown beside every computed energy. */
export const MODEL_ENERGY_CAUTION =
	'Energies computed from parameters are models of one configuration, not measurements; LS labels name the leading component only, and strongly mixed levels have no good LS name.';

/** Relative tolerance of the trace identity Σ_levels (2J+1) E = N_det · E_av (rounding only; common practice, no source). */
export const TRACE_TOLERANCE = 1e-8;

export interface IcComponent {
	term: string;
	twoS: number;
	L: number;
	seniority: number | null;
	percent: number;
}

export interface IcLevel {
	/** cm⁻¹ on the same scale as E_av. */
	energy: number;
	/** cm⁻¹ above the lowest level. */
	relative: number;
	twoJ: number;
	J: string;
	parity: 'even' | 'odd';
	/** Landé g with the chosen g_s; null for J = 0. */
	g: number | null;
	label: string;
	components: IcComponent[];
	jj: { label: string; percent: number }[];
}

/** One eigenvector as the solver keeps it: its J space and coefficients in that space's basis. */
export interface RawLevel {
	energy: number;
	space: number;
	vector: Float64Array;
}

/** Options of `intermediateLevels`. */
export interface IcOptions {
	/** Spin g-factor: 2 (default) or e.g. GS_FREE_ELECTRON from lande.ts. */
	gs?: number;
	limits?: { maxBlock?: number; maxTotal?: number };
}

export interface IcResult {
	config: string;
	parity: 'even' | 'odd';
	determinants: { total: number; block: number };
	Eav: number;
	parameters: { id: string; value: number }[];
	levels: IcLevel[];
	caution: string;
}

/**
 * Diagonalises every J space for the given parameter values; levels sorted by energy.
 * Asserts the trace identity Σ (2J+1) E = N_det·E_av (throws Error otherwise: a defect, not bad input).
 * @example solveRaw(structure, 0, values).length // number of levels
 */
export function solveRaw(structure: EnergyStructure, Eav: number, values: ArrayLike<number>): RawLevel[] {
	const out: RawLevel[] = [];
	let weighted = 0;
	let scale = Math.abs(Eav);
	for (let p = 0; p < values.length; p++) scale += Math.abs(values[p]);
	structure.spaces.forEach((sp, s) => {
		const d = sp.dim;
		const H = new Float64Array(d * d);
		for (let p = 0; p < values.length; p++) {
			const v = values[p];
			if (v === 0) continue;
			const M = sp.param[p];
			for (let i = 0; i < d * d; i++) H[i] += v * M[i];
		}
		for (let a = 0; a < d; a++) H[a * d + a] += Eav;
		const eig = symmetricEigen(H, d);
		for (let r = 0; r < d; r++) {
			out.push({ energy: eig.values[r], space: s, vector: eig.vectors.slice(r * d, r * d + d) });
			weighted += (sp.twoJ + 1) * eig.values[r];
		}
	});
	const expected = structure.totalDeterminants * Eav;
	if (Math.abs(weighted - expected) > TRACE_TOLERANCE * structure.totalDeterminants * Math.max(1, scale)) {
		throw new Error(`internal error: trace identity fails (Σ(2J+1)E = ${weighted}, N·E_av = ${expected})`);
	}
	return out.sort((a, b) => a.energy - b.energy);
}

/** Squared coefficients below this are left out of compositions (they are rounding noise; common practice, no source). */
export const COMPONENT_FLOOR = 1e-12;

/** LS composition of a raw level, percent, largest first (classes with a weight above COMPONENT_FLOOR). */
export function lsComposition(structure: EnergyStructure, level: RawLevel): IcComponent[] {
	const sp = structure.spaces[level.space];
	const weight = new Float64Array(structure.lsClasses.length);
	for (let a = 0; a < sp.dim; a++) weight[sp.lsOf[a]] += level.vector[a] * level.vector[a];
	const out: IcComponent[] = [];
	weight.forEach((w, cls) => {
		if (w <= COMPONENT_FLOOR) return;
		const c = structure.lsClasses[cls];
		out.push({ term: termLabel(c, { parity: structure.parity }), twoS: c.twoS, L: c.L, seniority: c.seniority, percent: 100 * w });
	});
	return out.sort((a, b) => b.percent - a.percent);
}

/** A term's label with its seniority when the same ^{2S+1}L has more than one: "2D3" style is avoided, we write "2D (v=3)". */
function labelOf(structure: EnergyStructure, c: IcComponent): string {
	const same = structure.lsClasses.filter((x) => x.twoS === c.twoS && x.L === c.L).length;
	return same > 1 && c.seniority !== null ? `${c.term} (v=${c.seniority})` : c.term;
}

/**
 * Landé g of a level from its LS composition: with ⟨L²⟩ = Σ w L(L+1) and ⟨S²⟩ = Σ w S(S+1) over the
 * LS classes (which are eigenspaces of L² and S²), the projection theorem gives
 *   g = [J(J+1) + ⟨L²⟩ − ⟨S²⟩ + g_s (J(J+1) + ⟨S²⟩ − ⟨L²⟩)] / [2J(J+1)]
 * (Condon & Shortley 1935, ch. XVI; Cowan 1981, ch. 17: the same as Σ_LS c² g_LS with g_L = 1).
 * Null for J = 0.
 */
export function landeFromComposition(twoJ: number, components: readonly IcComponent[], gs = 2): number | null {
	if (twoJ === 0) return null;
	const jj = (twoJ * (twoJ + 2)) / 4;
	let l2 = 0;
	let s2 = 0;
	let w = 0;
	for (const c of components) {
		const f = c.percent / 100;
		l2 += f * c.L * (c.L + 1);
		s2 += (f * c.twoS * (c.twoS + 2)) / 4;
		w += f;
	}
	l2 /= w;
	s2 /= w;
	return (jj + l2 - s2 + gs * (jj + s2 - l2)) / (2 * jj);
}

/**
 * All levels of the configuration with energies, J, compositions, g and labels, sorted by energy.
 * Parameters: E_av and the Slater integrals F^k, G^k and ζ(nl) in cm⁻¹ (missing ones count as 0).
 * Throws ConfigurationError (notation), RangeError (an integral that cannot occur, a budget limit,
 * no open subshell, a bad g_s).
 * @example intermediateLevels('2p2', { F: [{ k: 2, a: '2p', b: '2p', value: 25000 }] }).levels[0].label // '3P'
 */
export function intermediateLevels(
	cfg: string | Configuration | readonly Subshell[],
	input: EnergyParameterInput,
	options: IcOptions = {}
): IcResult {
	const gs = options.gs ?? 2;
	if (!Number.isFinite(gs) || gs <= 0) throw new RangeError(`gs = ${gs} is not allowed: give a positive number such as 2 or 2.00231930436`);
	const all = asSubshells(typeof cfg === 'string' ? parseConfiguration(cfg) : cfg);
	const structure = energyStructure(all, options.limits);
	const resolved = resolveParameters(structure.set, all, input);
	const raw = solveRaw(structure, resolved.Eav, resolved.values);
	const lowest = raw.length ? raw[0].energy : 0;
	const levels = raw.map((r) => {
		const twoJ = structure.spaces[r.space].twoJ;
		const components = lsComposition(structure, r);
		const jj = structure.spaces[r.space].jj
			.map((entry) => ({ label: structure.jjClasses[entry.cls].label, percent: 100 * Math.min(1, jjWeight(entry, r.vector)) }))
			.filter((x) => x.percent > 100 * COMPONENT_FLOOR)
			.sort((a, b) => b.percent - a.percent);
		return {
			energy: r.energy,
			relative: r.energy - lowest,
			twoJ,
			J: halfString(twoJ),
			parity: structure.parity,
			g: landeFromComposition(twoJ, components, gs),
			label: components.length ? labelOf(structure, components[0]) : '',
			components,
			jj
		};
	});
	return {
		config: structure.config,
		parity: structure.parity,
		determinants: { total: structure.totalDeterminants, block: structure.blockSize },
		Eav: resolved.Eav,
		parameters: structure.params.map((p, i) => ({ id: p.id, value: resolved.values[i] })),
		levels,
		caution: MODEL_ENERGY_CAUTION
	};
}
