/**
 * Exports of the Line matcher's saved work: the identified lines (accepted identifications, one row per
 * identification, blends marked) of a line list, and the strong predicted lines of a level list that no observed
 * line of a line list explains. CSV, JSON or LaTeX through src/lib/export/table.ts. Viewers read.
 */
import type { Actor } from '../access';
import { projectAccess } from '../access';
import { getLevelList, getLineList } from './lists';
import { acceptedPerLine, identificationsOfLineList } from './identifications';
import { levelName, matchSavedLists } from './saved-match';
import { MIME, render, type Column, type ExportFormat } from '../../export/table';
import { AIR_WAVELENGTH_LIMIT_A, vacuumToAir } from '../../physics/airvac';

const CAUTION =
	'Identifications are the project team’s verdicts on Ritz candidates; LS labels are approximations. Residual = σ observed − σ Ritz (cm⁻¹).';

interface IdentifiedRow {
	line: number;
	wavelength: string;
	unit: string;
	medium: string;
	uncertainty: number | null;
	intensity: number | null;
	lower: string;
	lowerEnergy: string;
	upper: string;
	upperEnergy: string;
	type: string;
	residual: number | null;
	blend: number;
	note: string;
	by: string | null;
	at: string;
}

const identifiedColumns: Column<IdentifiedRow>[] = [
	{ key: 'line', value: (r) => r.line, align: 'r' },
	{ key: 'wavelength', value: (r) => r.wavelength, jsonValue: (r) => Number(r.wavelength), align: 'r' },
	{ key: 'unit', value: (r) => r.unit },
	{ key: 'medium', value: (r) => r.medium },
	{ key: 'uncertainty', value: (r) => r.uncertainty, align: 'r' },
	{ key: 'intensity', value: (r) => r.intensity, align: 'r' },
	{ key: 'lower', value: (r) => r.lower },
	{ key: 'lower_energy_cm-1', value: (r) => r.lowerEnergy, jsonValue: (r) => Number(r.lowerEnergy), align: 'r' },
	{ key: 'upper', value: (r) => r.upper },
	{ key: 'upper_energy_cm-1', value: (r) => r.upperEnergy, jsonValue: (r) => Number(r.upperEnergy), align: 'r' },
	{ key: 'type', value: (r) => r.type },
	{ key: 'residual_cm-1', value: (r) => (r.residual === null ? null : Number(r.residual.toFixed(4))), align: 'r' },
	{ key: 'blend_of', value: (r) => r.blend, align: 'r' },
	{ key: 'note', value: (r) => r.note },
	{ key: 'accepted_by', value: (r) => r.by, inLatex: false },
	{ key: 'accepted_at', value: (r) => r.at, inLatex: false }
];

/** The accepted identifications of a line list, in line order; `blend_of` > 1 marks a blend. */
export function exportIdentifiedLines(actor: Actor, projectId: string, lineListId: string, format: ExportFormat) {
	projectAccess(actor, projectId, 'viewer');
	const { list, rows: lines } = getLineList(actor, projectId, lineListId);
	const verdicts = identificationsOfLineList(projectId, lineListId).filter((v) => v.status === 'accepted');
	const blends = acceptedPerLine(verdicts);
	const lineById = new Map(lines.map((l) => [l.id, l]));
	const levelLists = new Map<string, Map<number, ReturnType<typeof getLevelList>['rows'][number]>>();
	const levelOf = (listId: string, id: number) => {
		if (!levelLists.has(listId)) levelLists.set(listId, new Map(getLevelList(actor, projectId, listId).rows.map((r) => [r.id, r])));
		return levelLists.get(listId)!.get(id)!;
	};
	const rows: IdentifiedRow[] = verdicts.map((v) => {
		const line = lineById.get(v.lineId)!;
		const lower = levelOf(v.levelListId, v.lowerLevelId);
		const upper = levelOf(v.levelListId, v.upperLevelId);
		return {
			line: line.position,
			wavelength: line.wavelengthText,
			unit: line.unit,
			medium: line.unit === 'cm-1' ? '' : line.medium,
			uncertainty: line.uncertainty,
			intensity: line.intensity,
			lower: levelName(lower),
			lowerEnergy: lower.energyText,
			upper: levelName(upper),
			upperEnergy: upper.energyText,
			type: v.type,
			residual: v.residual,
			blend: blends.get(v.lineId) ?? 1,
			note: v.note,
			by: v.updatedBy,
			at: v.updatedAt.toISOString()
		};
	});
	const caption = `Identified lines of “${list.name}”. ${CAUTION}`;
	const body = render(format, rows, identifiedColumns, caption, { line_list: list.name, caution: CAUTION });
	return { body, type: MIME[format], filename: `${slug(list.name)}-identified.${format}` };
}

interface PredictedRow {
	lower: string;
	upper: string;
	type: string;
	wavenumber: number;
	vacuum: number;
	air: number | null;
	ofStrongest: number;
}

const predictedColumns: Column<PredictedRow>[] = [
	{ key: 'lower', value: (r) => r.lower },
	{ key: 'upper', value: (r) => r.upper },
	{ key: 'type', value: (r) => r.type },
	{ key: 'ritz_wavenumber_cm-1', value: (r) => Number(r.wavenumber.toFixed(4)), align: 'r' },
	{ key: 'vacuum_wavelength_A', value: (r) => Number(r.vacuum.toFixed(4)), align: 'r' },
	{ key: 'air_wavelength_A', value: (r) => (r.air === null ? null : Number(r.air.toFixed(4))), align: 'r' },
	{ key: 'strength_of_strongest_in_multiplet', value: (r) => Number(r.ofStrongest.toFixed(3)), align: 'r' }
];

/**
 * The strong predicted lines (at least half the strongest of their LS multiplet) inside the observed range that no
 * line of the line list explains within the tolerance, with vacuum and (from 2000 Å) air wavelengths.
 */
export function exportUnobservedLines(actor: Actor, projectId: string, input: unknown, format: ExportFormat) {
	const m = matchSavedLists(actor, projectId, input);
	const rows: PredictedRow[] = m.result.unobserved.map((p) => ({
		lower: levelName(m.levels[p.lower]),
		upper: levelName(m.levels[p.upper]),
		type: p.type,
		wavenumber: p.wavenumber,
		vacuum: p.vacuumA,
		air: p.vacuumA >= AIR_WAVELENGTH_LIMIT_A ? vacuumToAir(p.vacuumA) : null,
		ofStrongest: p.strength.ofStrongest
	}));
	const note = 'Predicted from LS multiplet strengths (approximate); air wavelengths (Morton 2000) from 2000 Å, vacuum below.';
	const caption = `Strong predicted lines of “${m.levelList.name}” not observed in “${m.lineList.name}”. ${note}`;
	const body = render(format, rows, predictedColumns, caption, {
		level_list: m.levelList.name,
		line_list: m.lineList.name,
		predicted_total: m.result.unobservedCount,
		caution: note
	});
	return { body, type: MIME[format], filename: `${slug(m.levelList.name)}-unobserved.${format}` };
}

const slug = (name: string) => name.replace(/[^A-Za-z0-9]+/g, '_').replace(/^_|_$/g, '') || 'list';
