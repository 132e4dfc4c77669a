/**
 * Termwright's term engine: pure TypeScript, plain data in and out, no framework or database.
 * Import from here in scripts; the app imports the modules directly.
 */
export type { Configuration, Subshell, Term, ParentSpec, TermSpec } from './types';
export { halfString, parseHalf } from './half';
export { L_LETTERS, TERM_LETTERS, lLetter, letterToL, termLetter, termLetterToL } from './letters';
export {
	ConfigurationError,
	parseConfiguration,
	formatConfiguration,
	configurationOf,
	subshellLabel,
	subshellCapacity,
	parityOf,
	openSubshells,
	NOBLE_GAS_CORES,
	MAX_CONFIGURATION_LENGTH
} from './parse';
export { SpeciesError, parseSpecies, groundConfiguration, speciesLabel, elementByZ, ION_CAUTION } from './elements';
export { impliedClosedSubshells, completeConfiguration, sameConfiguration, checkElectrons } from './implied';
export type { ElectronCheck } from './implied';
export { microstateGrid, microstateTotal, countAt, decomposeGrid, mjCounts, subshellGrid, MAX_GRID_WORK } from './microstates';
export { termsOf, levelsOf, statisticalWeight, levelCountsByJ, termLabel, levelLabel, termSummary, termAndLevelCounts } from './terms';
export { seniorityTable, senioritiesOf } from './seniority';
export { landeG, effectiveMagnetonNumber, fractionString, GS_FREE_ELECTRON, LANDE_J0_NOTE } from './lande';
export { hundGround, hundOrder, hundWording, HUND_CAUTION } from './hund';
export { termDisplay, levelDisplay } from './display';
export { parentageOf, onTypedParents, MAX_PARENTAGE_OCCURRENCES, type ParentagePath } from './parentage';
export { listMicrostates, iterateMicrostates } from './listing';
export { termsByEnumeration } from './enumerate';
export { jkLevels, jkSplit, jkLevelCountsByJ, JkNotApplicable, MAX_JK_LEVELS, type JkLevel } from './jk';
export { jjLevels, jjLevelCountsByJ, assertLsJjAgree, MAX_JJ_LEVELS } from './jj';
export {
	wigner3j,
	wigner6j,
	wigner9j,
	clebschGordan,
	wigner3jFloat,
	wigner6jFloat,
	wigner9jFloat,
	clebschGordanFloat,
	evaluateSymbol
} from './wigner';
export { exactToNumber, exactString, exactSquaredString, exactJson, type ExactSqrt } from './exact';
export { couplingTable, MAX_J_COUPLING_TABLE } from './basis';
export { couplingBridge, jjSpinOrbitWeight } from './bridge';
export { termSheet, type TermSheet } from './report';
export { intermediateLevels, MODEL_ENERGY_CAUTION, type IcLevel, type IcResult } from './levels-ic';
export { couplingSweep, SWEEP_POINTS, type SweepResult } from './sweep';
export { fitParameters, MAX_FIT_LEVELS, type FitInput, type FitResult, type ObservedLevel } from './fit';
export {
	radialParameters,
	racahFromSlater,
	slaterFromRacah,
	condonShortleyDenominator,
	type EnergyParameterInput
} from './slater-parameters';
export { checkDeterminantBudget, determinantCounts, MAX_BLOCK_DETERMINANTS, MAX_TOTAL_DETERMINANTS } from './determinants';
export { symmetricEigen } from './symmetric-eigen';
export {
	airRefractiveIndex,
	vacuumToAir,
	airToVacuum,
	toVacuumAngstrom,
	fromVacuumAngstrom,
	wavenumberOf,
	vacuumWavelengthOf,
	listedWavelength,
	uncertaintyToWavenumber,
	AIR_WAVELENGTH_LIMIT_A,
	type SpectralUnit,
	type Medium
} from './airvac';
export { ritzLine, ritzUncertainty, type RitzLine } from './ritz';
export {
	jParityAllows,
	lsVerdict,
	lsLineStrength,
	multipletLines,
	multipletLabel,
	termSymbol,
	transitionsBetween,
	TRANSITION_TYPES,
	type TransitionType,
	type SpectralLevel,
	type Transition
} from './transitions';
export {
	matchLines,
	matchLinesBruteForce,
	transitionTable,
	MAX_MATCH_LEVELS,
	MAX_MATCH_LINES,
	MAX_MATCH_TRANSITIONS,
	type MatchResult
} from './matcher';
