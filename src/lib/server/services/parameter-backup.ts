/**
 * The backup section of the Energy solver's records: every parameter set and fit report of the
 * project's Shelf entries (services/backup.ts reads and writes it under `sections.energyParameters`).
 * Entries and sets travel by their ids on the writing server (`entry`, `ref`), people by e-mail.
 */
import { asc, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../db';
import { fitReports, parameterSets, shelfEntries } from '../db/schema';
import { newId } from '../ids';
import { energyParametersSchema } from '../energy-validation';
import type { BackupSection } from './backup';

const isoDate = z.iso.datetime({ offset: true, error: 'must be a date and time in ISO 8601 form' }).transform((s) => new Date(s));
const email = z.string().max(254).nullable();
const text = (max: number) => z.string().max(max, `must be at most ${max} characters`);
const id = text(64);
const num = z.number().finite();

const setSchema = z.strictObject({
	ref: id,
	entry: id,
	name: text(120),
	notation: text(200),
	parameters: energyParametersSchema,
	comment: text(2000),
	version: z.number().int().positive(),
	createdBy: email,
	createdAt: isoDate,
	updatedBy: email,
	updatedAt: isoDate
});

const requestSchema = z.strictObject({
	parameters: energyParametersSchema,
	vary: z.array(text(40)).max(100),
	links: z.array(z.strictObject({ id: text(40), to: text(40), ratio: num.optional() })).optional(),
	bounds: z.array(z.strictObject({ id: text(40), min: num.optional(), max: num.optional() })).optional(),
	observed: z
		.array(
			z.strictObject({
				J: text(10),
				energy: num,
				uncertainty: num.positive().optional(),
				assign: z.union([text(20), z.number().int()]).optional(),
				levelKey: text(80).optional()
			})
		)
		.max(2000),
	observedFrom: z.enum(['notes', 'typed'])
});

const resultSchema = z.strictObject({
	config: text(200),
	parameters: z.array(
		z.strictObject({
			id: text(40),
			value: num,
			sigma: num.nullable(),
			status: z.enum(['varied', 'fixed', 'linked']),
			linkedTo: text(40).optional(),
			ratio: num.optional(),
			atBound: z.boolean().optional()
		})
	),
	residuals: z.array(
		z.strictObject({ J: text(10), rank: z.number().int(), label: text(40), observed: num, calculated: num, residual: num })
	),
	rms: num,
	standardDeviation: num.nullable(),
	degreesOfFreedom: z.number().int().nonnegative(),
	chiSquare: num,
	iterations: z.number().int().nonnegative(),
	converged: z.boolean(),
	method: text(2000),
	caution: text(2000)
});

const fitSchema = z.strictObject({
	entry: id,
	parameterSet: id.nullable(),
	notation: text(200),
	request: requestSchema,
	result: resultSchema,
	createdBy: email,
	createdAt: isoDate
});

const sectionSchema = z.strictObject({ parameterSets: z.array(setSchema), fits: z.array(fitSchema) });

type SectionData = z.output<typeof sectionSchema>;

/** The rows of `table` that belong to entries of the project, oldest first. */
const ofProject = <T extends typeof parameterSets | typeof fitReports>(table: T, projectId: string) =>
	db
		.select({ r: table })
		.from(table)
		.innerJoin(shelfEntries, eq(shelfEntries.id, table.entryId))
		.where(eq(shelfEntries.projectId, projectId))
		.orderBy(asc(table.createdAt), sql`${table}.rowid`)
		.all()
		.map(({ r }) => r);

export const parameterBackupSection: BackupSection<SectionData> = {
	key: 'energyParameters',
	label: 'parameter sets and fit reports',
	schema: sectionSchema,
	dump(ctx) {
		// Dates stay Date objects here: JSON.stringify writes them in ISO 8601, as the schema reads them.
		const sets = ofProject(parameterSets, ctx.projectId) as (typeof parameterSets.$inferSelect)[];
		const fits = ofProject(fitReports, ctx.projectId) as (typeof fitReports.$inferSelect)[];
		return {
			parameterSets: sets.map(({ id, entryId, createdBy, updatedBy, ...s }) => ({
				ref: id,
				entry: entryId,
				...s,
				createdBy: ctx.emailOf(createdBy),
				updatedBy: ctx.emailOf(updatedBy)
			})) as unknown as SectionData['parameterSets'],
			fits: fits.map((f) => ({
				entry: f.entryId,
				parameterSet: f.parameterSetId,
				notation: f.notation,
				request: f.request,
				result: f.result,
				createdBy: ctx.emailOf(f.createdBy),
				createdAt: f.createdAt
			})) as unknown as SectionData['fits']
		};
	},
	restore(tx, data, ctx) {
		const setIds = new Map<string, string>();
		const entryOf = (ref: string) => {
			const entryId = ctx.entryIds.get(ref);
			if (!entryId) throw new Error(`a parameter set or fit of an entry (${ref}) that is not in the file`);
			return entryId;
		};
		for (const { ref, entry, createdBy, updatedBy, ...s } of data.parameterSets) {
			const setId = newId();
			setIds.set(ref, setId);
			tx.insert(parameterSets)
				.values({ ...s, id: setId, entryId: entryOf(entry), createdBy: ctx.userIdOf(createdBy), updatedBy: ctx.userIdOf(updatedBy) })
				.run();
		}
		for (const f of data.fits) {
			tx.insert(fitReports)
				.values({
					id: newId(),
					entryId: entryOf(f.entry),
					parameterSetId: f.parameterSet ? (setIds.get(f.parameterSet) ?? null) : null,
					notation: f.notation,
					request: f.request,
					result: f.result,
					rms: f.result.rms,
					degreesOfFreedom: f.result.degreesOfFreedom,
					createdBy: ctx.userIdOf(f.createdBy),
					createdAt: f.createdAt
				})
				.run();
		}
	}
};
