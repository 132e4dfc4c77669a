/**
 * Plain data shapes shared by the term engine.
 *
 * Angular momenta that may be half-integral are carried as *twice* their value
 * (`twoS`, `twoJ`, `twoM`), so every quantity is an exact integer. Convert to a
 * display string with `halfString` from ./half.ts ("3/2", "2", "-1/2").
 */

/** One subshell n l^N of a configuration. `l` is the orbital quantum number (0 = s). */
export interface Subshell {
	n: number;
	l: number;
	occupancy: number;
}

/** A parsed electron configuration, subshells ordered by n then l. */
export interface Configuration {
	subshells: Subshell[];
	/** Total number of electrons. */
	electrons: number;
	/** (-1)^Σl over electrons: 'even' or 'odd'. */
	parity: 'even' | 'odd';
	/** The noble-gas core the user typed, e.g. "Ar", if any (already expanded in `subshells`). */
	core: string | null;
	/** Parent terms typed after subshells, `3d6(5D) 4s` (see parse.ts); absent when none were typed. */
	parents?: ParentSpec[];
}

/** A term typed in parentheses: ⁵D is { twoS: 4, L: 2 }; `v=4` sets the seniority, `#2` the index. */
export interface TermSpec {
	twoS: number;
	L: number;
	seniority: number | null;
	index: number | null;
}

/**
 * What was typed in parentheses after one subshell: its own term (`3d6(5D)`) and/or the
 * intermediate term after coupling up to it (`4s(7S)` after 3d5(6S)).
 */
export interface ParentSpec {
	n: number;
	l: number;
	own: TermSpec | null;
	intermediate: TermSpec | null;
}

/** An LS term ^{2S+1}L, possibly occurring several times in a configuration. */
export interface Term {
	twoS: number;
	L: number;
	/** How many times the term occurs (d3 has 2D twice). */
	count: number;
	/**
	 * Racah seniority for terms of a single open subshell, as counts per seniority (ascending v,
	 * counts adding up to `count`); null with several open subshells.
	 */
	seniorities: { seniority: number; count: number }[] | null;
}
