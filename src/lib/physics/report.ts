/**
 * The Term sheet of a configuration as plain JSON-ready data: what the `/api/v1/terms`
 * endpoint returns and what the pages draw. It only gathers results of the engine modules
 * (parse, microstates, terms, lande, hund); no physics is computed here.
 *
 * Fractions are strings ("3/2", "2"). Counts above 2^53 are decimal strings.
 */
import type { Configuration } from './types';
import { halfString } from './half';
import { termLetter } from './letters';
import { formatConfiguration, parseConfiguration, subshellLabel } from './parse';
import { countAt, microstateGrid, microstateTotal, type MicrostateGrid } from './microstates';
import { levelsOf, statisticalWeight, termLabel, termsOf } from './terms';
import { fractionString, GS_FREE_ELECTRON, landeG } from './lande';
import { HUND_CAUTION, hundGround, hundOrder, hundWording } from './hund';
import { levelDisplay, termDisplay } from './display';
import { parentageItems, type ParentageItem, type ParentageStatus } from './parentageReport';

export type CountValue = number | string;

export interface TermSheetLevel {
	J: string;
	/** Landé g_J: exact fraction with g_s = 2; null for J = 0. */
	g: string | null;
	/** The same as a decimal, with the chosen g_s. */
	gDecimal: number | null;
	weight: number;
}

export interface TermSheetTerm {
	/** "4F"; odd parity is marked by `parity`, not in the label (a machine key). */
	label: string;
	/** The person-facing label with ° where odd: "⁴F°". */
	display: string;
	/** One item per occurrence with its parent terms (omitted over the limit: see `parentageStatus`). */
	parentage?: ParentageItem[];
	S: string;
	L: number;
	letter: string;
	multiplicity: number;
	count: number;
	/** The seniority when the term occurs once (or all occurrences share it); null otherwise or with several open subshells. */
	seniority: number | null;
	/** One seniority per occurrence for a single open subshell (Racah); null with several open subshells. */
	seniorities: number[] | null;
	weight: number;
	/** 1 = lowest in Hund's heuristic order. */
	hundRank: number;
	/** J values in the expected energy order of Hund's third rule (normal or inverted multiplet). */
	jOrder: string[];
	levels: TermSheetLevel[];
}

export interface TermSheet {
	configuration: {
		notation: string;
		pretty: string;
		electrons: number;
		parity: 'even' | 'odd';
		core: string | null;
		subshells: { n: number; l: number; occupancy: number; label: string; open: boolean }[];
	};
	microstates: CountValue;
	termCount: number;
	levelCount: number;
	/** Σ over terms of count × (2S+1)(2L+1): must equal `microstates`. */
	weightSum: CountValue;
	gs: { value: number; exact: boolean };
	terms: TermSheetTerm[];
	/** Whether `parentage` is listed on the terms, and why not. */
	parentageStatus: ParentageStatus;
	hund: {
		term: string;
		J: string;
		level: string;
		/** "⁹D°₂". */
		display: string;
		rigorous: boolean;
		reason: string;
		caution: string;
		/** 'ground' or 'lowest', and the words to use: "lowest level by Hund's rules (heuristic)". */
		kind: 'ground' | 'lowest';
		phrase: string;
		why: string;
	};
	grid: { ML: number[]; MS: string[]; counts: CountValue[][] };
}

const count = (v: bigint): CountValue => (v <= BigInt(Number.MAX_SAFE_INTEGER) ? Number(v) : v.toString());

function gridRows(grid: MicrostateGrid): TermSheet['grid'] {
	const ML: number[] = [];
	for (let m = grid.maxML; m >= grid.minML; m--) ML.push(m);
	const twoMS: number[] = [];
	for (let t = -grid.maxTwoMS; t <= grid.maxTwoMS; t += 2) twoMS.push(t);
	return { ML, MS: twoMS.map(halfString), counts: ML.map((m) => twoMS.map((t) => count(countAt(grid, m, t)))) };
}

export interface TermSheetOptions {
	/** 'exact' (g_s = 2, default) or 'free' (g_s = 2.00231930436256, CODATA 2018). */
	gs?: 'exact' | 'free';
}

/**
 * The Term sheet of a configuration given as text or parsed.
 * Throws ConfigurationError (with `.token`) for bad notation, RangeError when a count is too large to report.
 * @example termSheet('3d5 4s').hund.level // '7S3'
 */
export function termSheet(input: string | Configuration, options: TermSheetOptions = {}): TermSheet {
	const cfg = typeof input === 'string' ? parseConfiguration(input) : input;
	const free = options.gs === 'free';
	const terms = termsOf(cfg);
	const order = hundOrder(cfg);
	const rank = new Map(order.map((t, i) => [`${t.term.twoS}|${t.term.L}`, { rank: i + 1, twoJs: t.twoJs }]));
	const ground = hundGround(cfg);
	const grid = microstateGrid(cfg);
	const odd = cfg.parity === 'odd';
	const parentage = parentageItems(
		cfg,
		terms.reduce((a, t) => a + t.count, 0)
	);

	let weightSum = 0n;
	let levelCount = 0;
	const rows: TermSheetTerm[] = terms.map((t) => {
		weightSum += BigInt(t.count) * BigInt(statisticalWeight(t));
		const levels = levelsOf(t).map((lv) => {
			const exact = landeG(t.twoS, t.L, lv.twoJ);
			const decimal = free ? landeG(t.twoS, t.L, lv.twoJ, { gs: GS_FREE_ELECTRON }) : exact === null ? null : exact.valueOf();
			return { J: halfString(lv.twoJ), g: exact === null ? null : fractionString(exact), gDecimal: decimal, weight: lv.weight };
		});
		levelCount += t.count * levels.length;
		const seniorities = t.seniorities;
		const sameSeniority = seniorities && seniorities.every((v) => v === seniorities[0]) ? seniorities[0] : null;
		const r = rank.get(`${t.twoS}|${t.L}`)!;
		return {
			label: termLabel(t),
			display: termDisplay(t.twoS, t.L, odd),
			...(parentage.status.listed ? { parentage: parentage.byTerm.get(`${t.twoS}|${t.L}`) ?? [] } : {}),
			S: halfString(t.twoS),
			L: t.L,
			letter: termLetter(t.L),
			multiplicity: t.twoS + 1,
			count: t.count,
			seniority: sameSeniority,
			seniorities,
			weight: statisticalWeight(t),
			hundRank: r.rank,
			jOrder: r.twoJs.map(halfString),
			levels
		};
	});

	const groundLabel = termLabel(ground.term);
	return {
		configuration: {
			notation: formatConfiguration(cfg),
			pretty: formatConfiguration(cfg, { superscripts: true }),
			electrons: cfg.electrons,
			parity: cfg.parity,
			core: cfg.core,
			subshells: cfg.subshells.map((s) => ({
				n: s.n,
				l: s.l,
				occupancy: s.occupancy,
				label: subshellLabel(s),
				open: s.occupancy < 2 * (2 * s.l + 1)
			}))
		},
		microstates: count(microstateTotal(cfg)),
		termCount: terms.reduce((a, t) => a + t.count, 0),
		levelCount,
		weightSum: count(weightSum),
		gs: { value: free ? GS_FREE_ELECTRON : 2, exact: !free },
		terms: rows,
		parentageStatus: parentage.status,
		hund: {
			term: groundLabel,
			J: halfString(ground.twoJ),
			level: groundLabel + halfString(ground.twoJ),
			display: levelDisplay(ground.term.twoS, ground.term.L, ground.twoJ, odd),
			rigorous: ground.rigorous,
			reason: ground.reason,
			caution: HUND_CAUTION,
			...hundWording(cfg)
		},
		grid: gridRows(grid)
	};
}
