/**
 * The compute tasks of the JSON API: each takes plain, already validated arguments, calls the
 * engine and returns the route's whole answer as a JSON string, so that a worker thread can run
 * it and hand back one string (no large object crosses threads, and no JSON is written on the
 * request thread). The same functions run inline for light requests: `light(args)` says, from a
 * closed-form estimate, whether a task is cheap enough (well under ~50 ms) to run on the
 * request thread. Engine errors that mean bad input (InputError such as ConfigurationError,
 * RangeError, including the engine's BudgetError) become a 400 in the API's error shape.
 *
 * This module may import only the engine, plain packages and dependency-free modules such as
 * ../recent: it is bundled for the worker
 * (scripts/build-worker.js) without SvelteKit.
 */
import type { ApiResponses } from '../../api/types';
import { RecentMap } from '../recent';
import { termSheet } from '../../physics/report';
import { displayConfiguration, formatConfiguration, parseConfiguration, openSubshells } from '../../physics/parse';
import { jjLevels, jjLevelCountsByJ, assertLsJjAgree, MAX_JJ_LEVELS } from '../../physics/jj';
import { levelCountsByJ } from '../../physics/terms';
import { halfString } from '../../physics/half';
import { couplingBridge, parseZetaList, ZETA_SOURCE } from '../../physics/bridge';
import { lLetter } from '../../physics/letters';
import { couplingTable } from '../../physics/basis';
import { exactJson } from '../../physics/exact';
import { evaluateSymbol, type SymbolKind } from './symbol-args';
import { gridExtent, gridWork, seniorityWork, sheetLevelRowsBound } from '../../physics/budget';
import { microstateTotal } from '../../physics/microstates';
import { InputError } from '../../physics/input-error';
import { energies, fit, sweep } from './energy-tasks';

/** A finished answer: HTTP status and the JSON body as text. */
export interface TaskResult {
	status: number;
	body: string;
}

/**
 * One compute task: `run` does the work, `light` says whether it may run on the request thread,
 * `timeoutMs` (when set) replaces the pool's default time limit for this task.
 */
export interface ComputeTask<A> {
	run(args: A): unknown;
	light(args: A): boolean;
	timeoutMs?: number;
}

const SAFE = BigInt(Number.MAX_SAFE_INTEGER);

/** Measured on this machine (see README, Reliability): below these estimates a task takes a few ms. */
const LIGHT_SHEET_ROWS = 1500;
const LIGHT_GRID_WORK = 1e6;
const LIGHT_MICROSTATES = 5000n;
const LIGHT_BASIS_STATES = 36;
const LIGHT_SYMBOL_J = 30;
const LIGHT_9J_J = 6;

function sheetIsLight(config: string): boolean {
	const cfg = parseConfiguration(config);
	const open = openSubshells(cfg);
	const exact = microstateTotal(cfg) <= SAFE;
	const seniority = open.length === 1 ? seniorityWork(open[0].l, open[0].occupancy) : 0;
	return (
		sheetLevelRowsBound(gridExtent(cfg.subshells)) <= LIGHT_SHEET_ROWS && gridWork(cfg.subshells, exact) + seniority <= LIGHT_GRID_WORK
	);
}

function fewMicrostates(config: string): boolean {
	return microstateTotal(parseConfiguration(config)) <= LIGHT_MICROSTATES;
}

const terms: ComputeTask<{ config: string; gs: 'exact' | 'free' }> = {
	light: ({ config }) => sheetIsLight(config),
	run: ({ config, gs }): ApiResponses['GET /api/v1/terms'] => termSheet(parseConfiguration(config), { gs })
};

const jj: ComputeTask<{ config: string; countsOnly: boolean }> = {
	light: ({ config }) => fewMicrostates(config),
	run: ({ config, countsOnly }): ApiResponses['GET /api/v1/jj'] => {
		const cfg = parseConfiguration(config);
		const jjCounts = jjLevelCountsByJ(cfg);
		// The level count of each J must agree with LS coupling; this throws if it does not.
		assertLsJjAgree(levelCountsByJ(cfg), jjCounts);
		const countsByJ = Object.fromEntries([...jjCounts.entries()].sort((a, b) => a[0] - b[0]).map(([tj, n]) => [halfString(tj), n]));
		if (countsOnly) return { configuration: formatConfiguration(cfg), countsByJ, countsAgreeWithLS: true };
		const total = [...jjCounts.values()].reduce((a, b) => a + b, 0);
		if (total > MAX_JJ_LEVELS)
			throw new RangeError(
				`This configuration has ${total} jj levels; at most ${MAX_JJ_LEVELS} are listed. Add &counts=only for the number of levels of each J.`
			);
		const levels = jjLevels(cfg).map((lv) => ({
			J: halfString(lv.twoJ),
			group: lv.couplingLabel,
			subshells: lv.subshellLabel,
			label: lv.label,
			pieces: lv.labelPieces,
			intermediates: lv.intermediates.map(halfString)
		}));
		return { configuration: formatConfiguration(cfg), levels, countsByJ, countsAgreeWithLS: true };
	}
};

const bridge: ComputeTask<{ config: string; zeta?: string }> = {
	light: ({ config }) => fewMicrostates(config),
	run: ({ config, zeta }): ApiResponses['GET /api/v1/bridge'] => {
		const cfg = parseConfiguration(config);
		// Say what the user can do instead, in words of the app (not the engine's function names).
		let levels = 0;
		for (const n of jjLevelCountsByJ(cfg).values()) levels += n;
		if (levels > MAX_JJ_LEVELS)
			throw new RangeError(
				`${formatConfiguration(cfg)} has ${levels} levels, more than the ${MAX_JJ_LEVELS} the Coupling bridge can join one by one. The Term sheet still gives its terms and the number of levels of each J, and the jj levels can be counted by J (GET /api/v1/jj?counts=only); or bridge a smaller configuration, e.g. with fewer open subshells.`
			);
		const b = couplingBridge(cfg, parseZetaList(zeta ?? ''));
		return {
			configuration: {
				notation: formatConfiguration(cfg),
				pretty: displayConfiguration(cfg),
				parity: cfg.parity
			},
			schematic: true,
			ls: b.ls.map((x) => ({ label: x.label, J: halfString(x.twoJ) })),
			jj: b.jj.map((x) => ({
				label: x.label,
				J: halfString(x.twoJ),
				group: x.level.couplingLabel,
				subshells: x.level.subshellLabel,
				spinOrbitWeight: x.spinOrbitWeight
			})),
			links: b.links.map((l) => ({ J: halfString(l.twoJ), ls: l.ls, jj: l.jj })),
			jk: b.jk ? b.jk.map((x) => ({ label: x.label, J: halfString(x.twoJ), coreJ: halfString(x.core.twoJ), K: halfString(x.twoK) })) : null,
			jkReason: b.jkReason,
			jkLinks: b.jkLinks.map((l) => ({ J: halfString(l.twoJ), ls: l.ls, jk: l.jk, jj: l.jj })),
			zeta: b.zeta.map((z) => ({ subshell: `${z.n}${lLetter(z.l)}`, zeta: z.zeta })),
			zetaSource: ZETA_SOURCE
		};
	}
};

const basis: ComputeTask<{ tj1: number; tj2: number }> = {
	light: ({ tj1, tj2 }) => (tj1 + 1) * (tj2 + 1) <= LIGHT_BASIS_STATES,
	run: ({ tj1, tj2 }): ApiResponses['GET /api/v1/basis'] => {
		const t = couplingTable(tj1, tj2);
		return {
			j1: halfString(t.tj1),
			j2: halfString(t.tj2),
			coupled: t.rows.map((r) => ({
				J: halfString(r.twoJ),
				M: halfString(r.twoM),
				components: r.components.map((c) => ({ m1: halfString(c.tm1), m2: halfString(c.tm2), coefficient: exactJson(c.coefficient) }))
			})),
			uncoupled: t.inverse.map((r) => ({
				m1: halfString(r.tm1),
				m2: halfString(r.tm2),
				components: r.components.map((c) => ({ J: halfString(c.twoJ), M: halfString(c.twoM), coefficient: exactJson(c.coefficient) }))
			}))
		};
	}
};

/** Largest |value| among symbol arguments such as "3/2" or "-7" (NaN-safe: unreadable counts as 0). */
function largestArgument(args: readonly string[]): number {
	let max = 0;
	for (const a of args) {
		const m = /^-?(\d{1,9})(?:\/2)?$/.exec(a.trim());
		if (m) max = Math.max(max, Number(m[1]));
	}
	return max;
}

const wigner: ComputeTask<{ symbol: SymbolKind; args: string[] }> = {
	light: ({ symbol, args }) => largestArgument(args) <= (symbol === '9j' ? LIGHT_9J_J : LIGHT_SYMBOL_J),
	run: ({ symbol, args }): ApiResponses['GET /api/v1/wigner'] => {
		const v = evaluateSymbol(symbol, args);
		return { symbol: v.kind, args, value: v.value, exact: v.exact, text: v.text };
	}
};

/**
 * Every task by name. To add one (Energy solver, Transition finder …): write a `ComputeTask`,
 * add it here, and call `compute('name', args)` from the route (see DEVELOPERS.md).
 */
export const TASKS = { terms, jj, bridge, basis, wigner, energies, sweep, fit } as const;

export type TaskName = keyof typeof TASKS;
export type TaskArgs<N extends TaskName> = Parameters<(typeof TASKS)[N]['run']>[0];

/** Recent answers (the engine is pure, so an answer never goes stale): at most CACHE_ENTRIES, small bodies only. */
const CACHE_ENTRIES = 500;
const CACHE_BODY_CHARS = 200_000;
const answers = new RecentMap<string>(CACHE_ENTRIES);

function remember(key: string, body: string): void {
	if (body.length <= CACHE_BODY_CHARS) answers.set(key, body);
}

/** The API's error body (`{ "error": { "message", … } }`) as text. */
export function errorBody(message: string, details: Record<string, unknown> = {}): string {
	return JSON.stringify({ error: { message, ...details } });
}

/**
 * Runs a task and writes its answer; engine errors that mean bad input become a 400. Anything
 * else is a bug and is thrown (the caller answers 500 without internals).
 */
export function runTask<N extends TaskName>(name: N, args: TaskArgs<N>): TaskResult {
	const task = TASKS[name] as ComputeTask<TaskArgs<N>>;
	if (!task) return { status: 400, body: errorBody(`unknown compute task "${String(name)}"`) };
	const key = `${String(name)} ${JSON.stringify(args)}`;
	const hit = answers.get(key);
	if (hit !== undefined) return { status: 200, body: hit };
	try {
		const body = JSON.stringify(task.run(args));
		remember(key, body);
		return { status: 200, body };
	} catch (e) {
		if (e instanceof InputError) return { status: 400, body: errorBody(e.message, { token: e.token }) };
		if (e instanceof RangeError) return { status: 400, body: errorBody(e.message) };
		throw e;
	}
}

/** The task's own time limit in ms, if it has one. */
export function taskTimeoutMs(name: TaskName): number | undefined {
	return (TASKS[name] as ComputeTask<unknown> | undefined)?.timeoutMs;
}

/** Whether the task may run on the request thread; bad input (which fails fast anyway) counts as light. */
export function isLight<N extends TaskName>(name: N, args: TaskArgs<N>): boolean {
	try {
		return (TASKS[name] as ComputeTask<TaskArgs<N>>).light(args);
	} catch {
		return true;
	}
}
