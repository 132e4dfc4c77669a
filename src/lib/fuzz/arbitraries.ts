/**
 * fast-check generators for hostile and careless input: configuration notation, species names,
 * query strings and JSON bodies. Shared by the short fuzz run in `npm test` and `npm run fuzz`.
 * Mostly near-valid text (the parser's interesting edges) with some plain noise.
 */
import fc from 'fast-check';

const LETTERS = 'spdfghiklmnoqrtuvjxyzSPDF';

/** One subshell token: "3d5", "4f^7", "2p⁶", "12o23", "0s", "3d-1", "5g{2}" … */
export const subshellToken = fc
	.tuple(
		fc.oneof(fc.integer({ min: 0, max: 25 }), fc.constant(1), fc.constant(3)),
		fc.constantFrom(...LETTERS.split('')),
		fc.oneof(
			{ weight: 6, arbitrary: fc.integer({ min: 0, max: 8 }) },
			{ weight: 2, arbitrary: fc.integer({ min: -3, max: 40 }) },
			{ weight: 1, arbitrary: fc.constant(99999999999) }
		),
		fc.constantFrom('', '^', '^{', 'super')
	)
	.map(([n, letter, occ, style]) => {
		if (style === 'super') return `${n}${letter}${String(occ).replace(/\d/g, (d) => '⁰¹²³⁴⁵⁶⁷⁸⁹'[Number(d)])}`;
		if (style === '^{') return `${n}${letter}^{${occ}}`;
		if (occ === 1 && style === '') return `${n}${letter}`;
		return `${n}${letter}${style}${occ}`;
	});

/** A configuration as someone might type it, right or wrong. */
export const notation = fc.oneof(
	{
		weight: 8,
		arbitrary: fc
			.tuple(
				fc.constantFrom('', '[He] ', '[Ne] ', '[Ar] ', '[Kr]', '[Xe] ', '[Rn] ', '[Xx] ', '[', '[Ar'),
				fc.array(subshellToken, { minLength: 0, maxLength: 5 }),
				fc.constantFrom(' ', '.', '·', '', '  ', '\t')
			)
			.map(([core, parts, sep]) => core + parts.join(sep))
	},
	{ weight: 1, arbitrary: fc.string({ maxLength: 60 }) },
	{ weight: 1, arbitrary: fc.string({ unit: 'grapheme', maxLength: 30 }) },
	{ weight: 1, arbitrary: fc.constantFrom('12o23', '10m19', '9l17', '16v33', '17v33', '4f7 5g5 6h5 7i3 6d3 7p', '1s'.repeat(100)) }
);

/** A species as someone might type it: "Fe II", "Nd3+", "iron", "U 92+", nonsense. */
export const species = fc.oneof(
	{
		weight: 6,
		arbitrary: fc
			.tuple(
				fc.constantFrom('Fe', 'Nd', 'O', 'H', 'He', 'U', 'Og', 'Xx', 'fe', 'iron', 'Oxygen', 'Uue', 'Zz', ''),
				fc.constantFrom(' ', '', '  '),
				fc.oneof(
					fc.constantFrom('I', 'II', 'III', 'XXVII', 'ii', 'IIII', 'CM', '+', '3+', '2-', '-', '⁺', '³⁺', '0', '100+'),
					fc.integer({ min: -5, max: 200 }).map((z) => `${z}+`)
				)
			)
			.map(([el, sep, charge]) => el + sep + charge)
	},
	{ weight: 1, arbitrary: fc.string({ maxLength: 50 }) }
);

/** A value for a query parameter: notation, numbers, half-integers, lists, noise, over-long text. */
export const paramValue = fc.oneof(
	notation,
	fc.integer({ min: -1000, max: 1000 }).map(String),
	fc.constantFrom(
		'1/2',
		'3/2',
		'-1/2',
		'10',
		'11',
		'200',
		'201',
		'1e9',
		'NaN',
		'',
		' ',
		'exact',
		'free',
		'only',
		'3j',
		'6j',
		'9j',
		'cg',
		'E1',
		'M1'
	),
	fc
		.array(fc.oneof(fc.integer({ min: -60, max: 60 }).map(String), fc.constantFrom('1/2', '3/2', '50', 'x')), { maxLength: 10 })
		.map((a) => a.join(',')),
	fc.string({ maxLength: 40 }),
	fc.constant('9'.repeat(400))
);

/** Query parameters named like the compute routes' ones (and some unknown names). */
export const PARAM_NAMES = [
	'config',
	'gs',
	'counts',
	'j1',
	'j2',
	'symbol',
	'args',
	'name',
	'offset',
	'limit',
	'lower',
	'upper',
	'types',
	'vacuum',
	'air',
	'x'
] as const;

/** A query string of 0–4 parameters with hostile values. */
export const queryString = fc
	.array(fc.tuple(fc.constantFrom(...PARAM_NAMES), paramValue), { maxLength: 4 })
	.map((pairs) => new URLSearchParams(pairs).toString());

/** A JSON body: objects of plausible and implausible fields, arrays, scalars, or broken text. */
export const jsonBodyText = fc.oneof(
	fc.jsonValue({ maxDepth: 3 }).map((v) => JSON.stringify(v)),
	fc
		.dictionary(fc.constantFrom('config', 'lines', 'levels', 'tolerance', 'energies', 'species', 'notation'), fc.jsonValue({ maxDepth: 2 }))
		.map((v) => JSON.stringify(v)),
	fc.string({ maxLength: 80 })
);
