/**
 * Input schemas (zod) for everything users type, with messages that say what is allowed.
 */
import { z } from 'zod';
import { ASSIGNMENT_STATUSES, PROJECT_ROLES, SITE_ROLES } from './db/schema';
import { badRequest } from './errors';
import { numberText, parseEnergyText } from '../energyText';

const trimmed = (label: string, max: number) =>
	z
		.string({ error: `${label} must be text` })
		.trim()
		.min(1, `${label} must not be empty`)
		.max(max, `${label} must be at most ${max} characters`);

export const emailSchema = z
	.string({ error: 'E-mail must be text' })
	.trim()
	.toLowerCase()
	.max(254, 'E-mail must be at most 254 characters')
	.pipe(z.email('E-mail must look like name@example.org'));

export const passwordSchema = z
	.string({ error: 'Password must be text' })
	.min(10, 'Password must be at least 10 characters')
	.max(200, 'Password must be at most 200 characters');

export const signUpSchema = z.object({
	name: trimmed('Name', 80),
	email: emailSchema,
	password: passwordSchema
});

export const signInSchema = z.object({
	email: emailSchema,
	password: z
		.string({ error: 'Password must be text' })
		.min(1, 'Password must not be empty')
		.max(200, 'Password must be at most 200 characters')
});

export const projectInputSchema = z.object({
	name: trimmed('Project name', 120),
	description: z.string({ error: 'Description must be text' }).trim().max(2000, 'Description must be at most 2000 characters').default('')
});

export const projectPatchSchema = projectInputSchema.partial();

export const memberInputSchema = z.object({
	email: emailSchema,
	role: z.enum(PROJECT_ROLES, { error: `Role must be one of ${PROJECT_ROLES.join(', ')}` })
});

export const roleSchema = z.enum(PROJECT_ROLES, { error: `Role must be one of ${PROJECT_ROLES.join(', ')}` });
export const siteRoleSchema = z.enum(SITE_ROLES, { error: `Site role must be one of ${SITE_ROLES.join(', ')}` });

const tagSchema = z
	.string()
	.trim()
	.min(1, 'A tag must not be empty')
	.max(40, 'A tag must be at most 40 characters')
	.regex(/^[\p{L}\p{N} ._+\-/]+$/u, 'A tag may hold letters, digits, spaces and . _ + - /');

const shelfFields = {
	title: trimmed('Title', 160),
	species: z.string({ error: 'Species must be text' }).trim().max(20, 'Species must be at most 20 characters'),
	notation: trimmed('Configuration', 200),
	notes: z.string({ error: 'Notes must be text' }).max(10000, 'Notes must be at most 10000 characters'),
	tags: z.array(tagSchema, { error: 'Tags must be a list of words' }).max(20, 'At most 20 tags')
};

export const shelfInputSchema = z.object({
	...shelfFields,
	species: shelfFields.species.default(''),
	notes: shelfFields.notes.default(''),
	tags: shelfFields.tags.default([])
});

/** A partial edit: only the fields sent are changed (no defaults here, or a missing field would be cleared). */
export const shelfPatchSchema = z
	.object(shelfFields)
	.partial()
	.extend({
		version: z
			.number({ error: 'version must be the number you last read' })
			.int('version must be a whole number')
			.positive('version must be the number you last read (1 or more)')
	});

/**
 * An energy in cm⁻¹ as a JSON number or as text read by `parseEnergyText` (so "19 000" and "−12400"
 * are read the same way as in the form); null or '' for none. Output: the value and the digits as typed.
 */
const energyField = (what: string, min: number, max: number, range: string) =>
	z
		.union([z.number(), z.string(), z.null()], { error: `${what} must be a number in cm⁻¹` })
		.transform((v, ctx): { value: number; text: string } | null => {
			if (v === null) return null;
			let read: { value: number; text: string };
			if (typeof v === 'number') {
				if (!Number.isFinite(v)) {
					ctx.addIssue({ code: 'custom', message: `${what} must be a number in cm⁻¹` });
					return z.NEVER;
				}
				read = { value: v, text: numberText(v) };
			} else {
				const r = parseEnergyText(v, what);
				if (r === null) return null;
				if (!r.ok) {
					ctx.addIssue({ code: 'custom', message: r.message });
					return z.NEVER;
				}
				read = r;
			}
			if (read.value < min || read.value > max) {
				ctx.addIssue({ code: 'custom', message: `${what} must be ${range}` });
				return z.NEVER;
			}
			return { value: read.value, text: read.text };
		});

export const annotationInputSchema = z
	.object({
		levelKey: z.string().trim().min(1, 'Level must not be empty').max(80, 'Level key must be at most 80 characters'),
		observedEnergy: energyField('Observed energy', -1e7, 1e7, 'between −10⁷ and 10⁷ cm⁻¹').default(null),
		uncertainty: energyField('Uncertainty', 0, 1e6, 'from 0 to 10⁶ cm⁻¹; it must not be negative').default(null),
		status: z.enum(ASSIGNMENT_STATUSES, { error: `Status must be one of ${ASSIGNMENT_STATUSES.join(', ')}` }).default('proposed'),
		comment: z.string().max(2000, 'Comment must be at most 2000 characters').default(''),
		version: z.number().int().positive().optional()
	})
	.superRefine((a, ctx) => {
		if (a.uncertainty !== null && a.observedEnergy === null)
			ctx.addIssue({
				code: 'custom',
				path: ['uncertainty'],
				message: 'An uncertainty needs an observed energy: give the energy as well, or clear the ± field'
			});
	});

/** Reattaching a detached note to a level of the entry's present configuration. */
export const reattachSchema = z.object({
	levelKey: z.string().trim().min(1, 'Level must not be empty').max(80, 'Level key must be at most 80 characters'),
	version: z.number({ error: 'version must be the number you last read' }).int().positive()
});

/** Splits "a, b ,c" into tags. */
export function splitTags(text: string): string[] {
	return text
		.split(',')
		.map((t) => t.trim())
		.filter((t) => t.length > 0);
}

/** Parses with a schema and turns the first problem into a 400 naming the field. */
export function parseInput<T extends z.ZodType>(schema: T, input: unknown): z.output<T> {
	const result = schema.safeParse(input);
	if (result.success) return result.data;
	const issue = result.error.issues[0];
	const field = issue.path.join('.');
	throw badRequest(issue.message, field ? { field } : {});
}
