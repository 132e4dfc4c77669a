/**
 * The /api/v1/wigner arguments: reads the symbol's values from text ("1/2", "-3/2", "1.5"), checks
 * them against the engine's limits with messages that name the argument, and evaluates the exact
 * symbol. String handling lives here, at the edge; the engine (physics/wigner.ts) takes doubled integers.
 */
import { clebschGordan, MAX_J_9J, MAX_J_SYMBOL, wigner3j, wigner6j, wigner9j } from '../../physics/wigner';
import { exactSquaredString, exactString, exactToNumber, type ExactSqrt } from '../../physics/exact';
import { parseHalf } from '../../physics/half';

/** Kinds of symbol `evaluateSymbol` understands. */
export type SymbolKind = '3j' | '6j' | '9j' | 'cg';

const ARGUMENT_NAMES: Record<SymbolKind, string[]> = {
	'3j': ['j1', 'j2', 'j3', 'm1', 'm2', 'm3'],
	cg: ['j1', 'm1', 'j2', 'm2', 'J', 'M'],
	'6j': ['j1', 'j2', 'j3', 'j4', 'j5', 'j6'],
	'9j': ['j1', 'j2', 'j3', 'j4', 'j5', 'j6', 'j7', 'j8', 'j9']
};

/** Result of `evaluateSymbol`: the double value and the exact sign × sqrt(squared). */
export interface SymbolValue {
	kind: SymbolKind;
	value: number;
	exact: { sign: -1 | 0 | 1; squared: string };
	/** Readable exact form, e.g. "-sqrt(3/10)" or "1/6". */
	text: string;
}

/**
 * Evaluates a symbol from fraction strings, for the JSON API.
 * Argument order — 3j: j1 j2 j3 m1 m2 m3; cg: j1 m1 j2 m2 J M; 6j: j1…j6 (rows); 9j: j1…j9 (rows).
 * Each value is an integer or half-integer string ("1/2", "1", "-3/2", "1.5").
 *
 * Throws RangeError on an unknown kind, a wrong number of arguments, a value that is not an
 * integer or half-integer, a negative j, a j above MAX_J_SYMBOL (MAX_J_9J for 9j), or an
 * invalid m (see `wigner3j`). Every message names the argument at fault.
 * @example evaluateSymbol('cg', ['1', '0', '1/2', '1/2', '3/2', '1/2'])
 *   // { kind: 'cg', value: 0.816496580927726, exact: { sign: 1, squared: '2/3' }, text: 'sqrt(2/3)' }
 */
export function evaluateSymbol(kind: SymbolKind, args: string[]): SymbolValue {
	if (!Object.prototype.hasOwnProperty.call(ARGUMENT_NAMES, kind)) {
		throw new RangeError(`evaluateSymbol: kind must be one of 3j, 6j, 9j, cg, got "${String(kind)}"`);
	}
	const names = ARGUMENT_NAMES[kind];
	if (!Array.isArray(args) || args.length !== names.length) {
		const got = Array.isArray(args) ? args.length : 'no list';
		throw new RangeError(`${kind} needs ${names.length} values (${names.join(', ')}), got ${got}`);
	}
	const limit = kind === '9j' ? MAX_J_9J : MAX_J_SYMBOL;
	const twice = args.map((text, i) => {
		const name = names[i];
		let t: number;
		try {
			t = parseHalf(String(text));
		} catch {
			throw new RangeError(`${kind} argument ${i + 1} (${name}) = "${text}" is not an integer or half-integer (write e.g. 2, 3/2 or -1/2)`);
		}
		const isProjection = name.startsWith('m') || name === 'M';
		if (!isProjection && t < 0) throw new RangeError(`${kind} argument ${i + 1} (${name}) = ${text} must be ≥ 0`);
		if (Math.abs(t) > 2 * limit) {
			throw new RangeError(
				`${kind} argument ${i + 1} (${name}) = ${text} is too large: each j and |m| must be at most ${limit} for ${kind}`
			);
		}
		return t;
	});
	const [a, b, c, d, e, f, g, h, k] = twice;
	let x: ExactSqrt;
	if (kind === '3j') x = wigner3j(a, b, c, d, e, f);
	else if (kind === 'cg') x = clebschGordan(a, b, c, d, e, f);
	else if (kind === '6j') x = wigner6j(a, b, c, d, e, f);
	else x = wigner9j(a, b, c, d, e, f, g, h, k);
	return {
		kind,
		value: exactToNumber(x),
		exact: { sign: x.sign, squared: exactSquaredString(x) },
		text: exactString(x)
	};
}
