/**
 * The Term sheet of a configuration as plain JSON-ready data: what the `/api/v1/terms`
 * endpoint returns and what the pages draw. It only gathers results of the engine modules
 * (parse, microstates, terms, lande, hund); no physics is computed here.
 *
 * Fractions are strings ("3/2", "2"). Every count that can pass 2^53 (microstates, the weight
 * sum, term and level totals, term occurrences, seniority counts, grid cells) is a `Count`: an
 * exact decimal string ("504"), whatever its size, so readers never meet a rounded number.
 * Statistical weights (2S+1)(2L+1) and 2J+1 stay numbers: they are small by construction.
 */
import type { Configuration } from './types';
import { halfString } from './half';
import { termLetter } from './letters';
import { displayConfiguration, formatConfiguration, subshellLabel } from './parse';
import { countAt, microstateGrid, microstateTotal, type MicrostateGrid } from './microstates';
import { levelsOf, statisticalWeight, termLabel, termsOf } from './terms';
import { fractionString, GS_FREE_ELECTRON, landeG } from './lande';
import { HUND_CAUTION, hundGround, hundOrder, hundWording } from './hund';
import { levelDisplay, termDisplay } from './display';
import { parentageItems, type ParentageItem, type ParentageStatus } from './parentageReport';
import { checkTermSheetBudget } from './budget';

/** An exact count as a decimal string of digits, e.g. "504" or "1449604113205248000". */
export type Count = string;

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
	/** How often the term occurs. */
	count: Count;
	/** The seniority when the term occurs once (or all occurrences share it); null otherwise or with several open subshells. */
	seniority: number | null;
	/** How many occurrences have each seniority, ascending v, for a single open subshell (Racah); null with several open subshells. */
	seniorities: { seniority: number; count: Count }[] | null;
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
	microstates: Count;
	/** Terms counted with multiplicity (d³: 8). */
	termCount: Count;
	/** Single J levels, every occurrence counted (d³: 19). */
	levelCount: Count;
	/** Σ over terms of count × (2S+1)(2L+1): must equal `microstates`. */
	weightSum: Count;
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
	grid: { ML: number[]; MS: string[]; counts: Count[][] };
}

const count = (v: bigint | number): Count => v.toString();

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
 * Throws ConfigurationError (with `.token`) for bad notation, BudgetError (a RangeError) before
 * any work when the configuration is over a budget of ./budget.ts (counting work, grid cells,
 * J-level rows), RangeError when a term count is too large to report.
 * @example termSheet(parseConfiguration('3d5 4s')).hund.level // '7S3'
 */
export function termSheet(cfg: Configuration, options: TermSheetOptions = {}): TermSheet {
	checkTermSheetBudget(cfg.subshells, microstateTotal(cfg) <= BigInt(Number.MAX_SAFE_INTEGER));
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
	let levelCount = 0n;
	let termCount = 0n;
	const rows: TermSheetTerm[] = terms.map((t) => {
		weightSum += BigInt(t.count) * BigInt(statisticalWeight(t));
		termCount += BigInt(t.count);
		const levels = levelsOf(t).map((lv) => {
			const exact = landeG(t.twoS, t.L, lv.twoJ);
			const decimal = free ? landeG(t.twoS, t.L, lv.twoJ, { gs: GS_FREE_ELECTRON }) : exact === null ? null : exact.valueOf();
			return { J: halfString(lv.twoJ), g: exact === null ? null : fractionString(exact), gDecimal: decimal, weight: lv.weight };
		});
		levelCount += BigInt(t.count) * BigInt(levels.length);
		const seniorities = t.seniorities;
		const sameSeniority = seniorities && seniorities.length === 1 ? seniorities[0].seniority : null;
		const r = rank.get(`${t.twoS}|${t.L}`)!;
		return {
			label: termLabel(t),
			display: termDisplay(t.twoS, t.L, odd),
			...(parentage.status.listed ? { parentage: parentage.byTerm.get(`${t.twoS}|${t.L}`) ?? [] } : {}),
			S: halfString(t.twoS),
			L: t.L,
			letter: termLetter(t.L),
			multiplicity: t.twoS + 1,
			count: count(t.count),
			seniority: sameSeniority,
			seniorities: seniorities && seniorities.map((v) => ({ seniority: v.seniority, count: count(v.count) })),
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
			pretty: displayConfiguration(cfg),
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
		termCount: count(termCount),
		levelCount: count(levelCount),
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
