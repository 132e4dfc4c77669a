/**
 * The Builder's configuration, held two ways that stay in sync: the chips on the Rail and the
 * notation text. The text is what the user typed (kept as typed); the Rail follows it whenever it
 * parses. Rail edits rewrite the text in the Rail's order (the parser accepts any order), keeping a
 * noble-gas core written as a core; typed text puts the Rail in the text's order. So the Rail and
 * the notation field always show the subshells in the same order.
 */
import { ConfigurationError, parseConfiguration, subshellLabel } from '$lib/physics/parse';
import type { Configuration } from '$lib/physics/types';
import { CORE_SPECS, TRAY_SPECS, capacityOf, coreKey, coreName, freshId, inCore, subshellKey, type Chip } from './chips';

export interface NotationProblem {
	message: string;
	/** The offending piece of the text ('' when it is the text as a whole). */
	token: string;
}

/** Text of a Rail in the Rail's order: "[Ar] 4s 3d5" for a Rail [Ar] | 4s | 3d⁵. */
export function railText(rail: readonly Chip[]): string {
	const core = rail.find((c) => c.kind === 'core');
	const subshells = rail.filter((c) => c.kind === 'subshell').map(({ n, l, occupancy }) => subshellLabel({ n, l, occupancy }));
	return [core?.key ?? '', ...subshells].filter((s) => s.length > 0).join(' ');
}

/** Where a chip's subshell is written in the text ("4s" in "3d5 4s" is at 4; not inside "14s"). */
function positionIn(text: string, chip: Chip): number {
	if (chip.kind === 'core') return -1;
	const m = new RegExp(`(?<!\\d)${chip.key}`, 'u').exec(text);
	return m ? m.index : Number.MAX_SAFE_INTEGER;
}

/** The Rail in the order the subshells are written in the text (core first). */
export function inTextOrder(rail: readonly Chip[], text: string): Chip[] {
	return rail
		.map((c, i) => ({ c, i, at: positionIn(text, c) }))
		.sort((a, b) => a.at - b.at || a.i - b.i)
		.map((x) => x.c);
}

/** The chips that show a parsed configuration: its core (if written) and the subshells outside it. */
function chipsOf(cfg: Configuration): Omit<Chip, 'id'>[] {
	const chips: Omit<Chip, 'id'>[] = [];
	if (cfg.core) chips.push({ ...CORE_SPECS.find((c) => c.key === coreKey(cfg.core!))!, kind: 'core' });
	for (const s of cfg.subshells) {
		if (inCore(cfg.core, s.n, s.l)) continue;
		chips.push({ key: subshellKey(s.n, s.l), kind: 'subshell', n: s.n, l: s.l, occupancy: s.occupancy });
	}
	return chips;
}

/** New Rail for a parsed text, keeping the order and ids of chips that stay. */
function reconcile(rail: readonly Chip[], cfg: Configuration): Chip[] {
	const wanted = chipsOf(cfg);
	const byKey = new Map(wanted.map((c) => [c.key, c]));
	const kept = rail.filter((c) => byKey.has(c.key)).map((c) => ({ ...c, occupancy: byKey.get(c.key)!.occupancy }));
	const keys = new Set(kept.map((c) => c.key));
	const added = wanted.filter((c) => !keys.has(c.key)).map((c) => ({ ...c, id: freshId('rail') }));
	return coreFirst([...kept, ...added]);
}

const coreFirst = (rail: Chip[]) => [...rail.filter((c) => c.kind === 'core'), ...rail.filter((c) => c.kind === 'subshell')];

/** Local check of the notation with the engine's parser (the same one the API uses). */
export function checkNotation(text: string): { cfg: Configuration | null; problem: NotationProblem | null } {
	if (text.trim() === '') return { cfg: null, problem: null };
	try {
		return { cfg: parseConfiguration(text), problem: null };
	} catch (e) {
		if (e instanceof ConfigurationError) return { cfg: null, problem: { message: e.message, token: e.token } };
		throw e;
	}
}

export class BuilderState {
	/** The notation as typed. */
	text = $state('');
	/** The chips on the Rail, in the user's order (a core, if any, first). */
	rail = $state<Chip[]>([]);
	/** True while a Tray chip that may not be added is being dragged (the Rail then refuses drops). */
	dragBlocked = $state(false);
	/** A short message for screen readers about the last Rail change. */
	announcement = $state('');

	readonly check = $derived(checkNotation(this.text));
	/** The text when it parses, else null. */
	readonly valid = $derived(this.check.cfg ? this.text.trim() : null);
	readonly core = $derived(this.rail.find((c) => c.kind === 'core')?.key ?? null);

	constructor(initial = '') {
		this.setText(initial);
	}

	/** The user typed: keep the text, move the Rail along when it parses. */
	setText(text: string) {
		this.text = text;
		const { cfg } = checkNotation(text);
		if (cfg) this.rail = inTextOrder(reconcile(this.rail, cfg), text);
		else if (text.trim() === '') this.rail = [];
	}

	/** The Rail changed: rewrite the text from it. */
	setRail(rail: Chip[], announcement = '') {
		this.rail = coreFirst(rail);
		this.text = railText(this.rail);
		if (announcement) this.announcement = announcement;
	}

	/**
	 * A chip was dropped on the Rail (svelte-dnd-action finalize). A dropped core replaces the
	 * current core; a subshell already on the Rail is not added twice.
	 */
	drop(items: Chip[], droppedId: string) {
		const dropped = items.find((c) => c.id === droppedId);
		let next = items;
		if (dropped) {
			const twin = items.some((c) => c.id !== droppedId && c.key === dropped.key);
			next = twin
				? items.filter((c) => c.id !== droppedId)
				: items.filter((c) => c.id === droppedId || dropped.kind !== 'core' || c.kind !== 'core');
		}
		this.setRail(next, dropped ? `${dropped.key} is on the Rail` : '');
	}

	/** Why a Tray chip cannot be added now, or null when it can. */
	blockedReason(key: string): string | null {
		if (this.rail.some((c) => c.key === key)) return `${key} is already on the Rail`;
		const spec = TRAY_SPECS.find((s) => s.key === key);
		const core = this.core ? coreName(this.core) : null;
		if (spec && inCore(core, spec.n, spec.l)) return `${key} is inside the ${this.core} core`;
		return null;
	}

	/** Adds a Tray chip at the end of the Rail (a core replaces the current core). */
	add(key: string) {
		if (this.blockedReason(key)) return;
		const spec = [...TRAY_SPECS, ...CORE_SPECS].find((s) => s.key === key);
		if (!spec) return;
		const chip: Chip = { id: freshId('rail'), key, kind: spec.kind, n: spec.n, l: spec.l, occupancy: spec.occupancy };
		const rest = spec.kind === 'core' ? this.rail.filter((c) => c.kind !== 'core') : this.rail;
		this.setRail([...rest, chip], `${key} added to the Rail`);
	}

	remove(id: string) {
		const chip = this.rail.find((c) => c.id === id);
		this.setRail(
			this.rail.filter((c) => c.id !== id),
			chip ? `${chip.key} removed from the Rail` : ''
		);
	}

	/** Steps the occupancy by ±1 within 1 … 2(2l+1). */
	step(id: string, delta: number) {
		const chip = this.rail.find((c) => c.id === id);
		if (!chip || chip.kind === 'core') return;
		const occupancy = Math.min(capacityOf(chip), Math.max(1, chip.occupancy + delta));
		if (occupancy === chip.occupancy) return;
		this.setRail(
			this.rail.map((c) => (c.id === id ? { ...c, occupancy } : c)),
			`${chip.key} occupancy ${occupancy}`
		);
	}

	/** Moves a chip one place left (−1) or right (+1) on the Rail. */
	move(id: string, dir: -1 | 1) {
		const i = this.rail.findIndex((c) => c.id === id);
		const j = i + dir;
		if (i < 0 || j < 0 || j >= this.rail.length || this.rail[j].kind !== this.rail[i].kind) return;
		const next = [...this.rail];
		[next[i], next[j]] = [next[j], next[i]];
		this.setRail(next, `${this.rail[i].key} moved to place ${j + 1}`);
	}
}
