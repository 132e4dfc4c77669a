/**
 * Many observed energies at once: a pasted column (format in $lib/energyPaste) becomes one note per
 * level, all in one transaction or none. Editors only. A line that cannot be placed saves nothing;
 * a note changed since the preview was shown (its version differs) refuses the whole paste (409).
 * Pasted notes are 'proposed': a new value needs review, whatever the old note's status was.
 */
import { and, eq } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../db';
import { levelAnnotations } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest, conflict } from '../errors';
import { parseInput } from '../validation';
import { newId } from '../ids';
import { annotatedLevels } from './annotations';
import { logActivity, noteSummary } from './activity';
import { resolvePaste, type PastePreview } from '../../energyPaste';
import { levelText } from '../../levels';

const pasteSchema = z.object({
	text: z.string({ error: 'Paste the lines of energies as text' }).max(100_000, 'The paste is too long: at most 100 000 characters'),
	/**
	 * The version of each level's note when the preview was shown (0: no note then). A level the
	 * preview did not show is not checked against anything and is refused.
	 */
	seen: z.record(z.string(), z.number().int().min(0), { error: 'seen must map level keys to the note versions of the preview' })
});

/** The preview of a paste against the entry as it is now: the same reading the save does. */
export function previewPaste(actor: Actor, projectId: string, entryId: string, text: string): PastePreview {
	projectAccess(actor, projectId, 'editor');
	return readPaste(actor, projectId, entryId, text).preview;
}

function readPaste(actor: Actor, projectId: string, entryId: string, text: string) {
	const { entry, sheet, levels } = annotatedLevels(actor, projectId, entryId);
	return { entry, preview: resolvePaste(text, levels, { notation: entry.notation, odd: sheet.configuration.parity === 'odd' }) };
}

/**
 * Saves every line of a paste as a 'proposed' note on its level. Input: { text, seen } where `seen`
 * maps each level key to the note version the preview showed (0 for none). Throws 400 (with
 * `details.lines`) when a line is refused or nothing is pasted, 409 when a note changed since.
 * @example pasteNotes(editor, projectId, entryId, { text: '0 3P0\n16.4 3P1 ±0.2', seen: { '3P#1|0': 0, '3P#1|1': 0 } })
 */
export function pasteNotes(actor: Actor, projectId: string, entryId: string, input: unknown) {
	projectAccess(actor, projectId, 'editor');
	const data = parseInput(pasteSchema, input);
	const { entry, preview } = readPaste(actor, projectId, entryId, data.text);
	const refused = preview.rows.filter((r) => !r.ok);
	if (preview.rows.length === 0)
		throw badRequest('Nothing to save: paste one line per level, the energy first, e.g. "16.4 3P1 ±0.2"', { field: 'text' });
	if (refused.length > 0) {
		const first = refused[0];
		throw badRequest(
			`Nothing was saved: ${refused.length} of ${preview.rows.length} line${preview.rows.length === 1 ? '' : 's'} cannot be placed (line ${first.line}: ${first.ok ? '' : first.message}). Fix or remove ${refused.length === 1 ? 'it' : 'them'} and save again.`,
			{ field: 'text', lines: refused }
		);
	}
	return db.transaction((tx) => {
		let replaced = 0;
		for (const row of preview.rows) {
			if (!row.ok) continue;
			const current = tx
				.select()
				.from(levelAnnotations)
				.where(
					and(eq(levelAnnotations.entryId, entryId), eq(levelAnnotations.levelKey, row.levelKey), eq(levelAnnotations.detached, false))
				)
				.get();
			const seen = data.seen[row.levelKey];
			const now = current?.version ?? 0;
			if (seen !== now) {
				const what =
					seen === undefined
						? 'was not in the preview'
						: now === 0
							? 'was deleted since the preview'
							: seen === 0
								? 'was written by someone since the preview'
								: 'was changed by someone else since the preview';
				throw conflict(`Nothing was saved: the note on ${levelText(row.levelKey)} ${what}; look at the preview again and save`, {
					// Not `levelKey`: the entry page reads that as a failure of one level's note form.
					level: row.levelKey,
					currentVersion: now
				});
			}
			const values = {
				observedEnergy: row.energy.value,
				observedEnergyText: row.energy.text,
				// The old uncertainty belonged to the old value: a line without ± clears it.
				uncertainty: row.uncertainty?.value ?? null,
				uncertaintyText: row.uncertainty?.text ?? null,
				status: 'proposed' as const,
				comment: row.comment ?? current?.comment ?? '',
				updatedBy: actor.id,
				updatedAt: new Date()
			};
			if (current) {
				replaced++;
				tx.update(levelAnnotations)
					.set({ ...values, version: current.version + 1 })
					.where(eq(levelAnnotations.id, current.id))
					.run();
			} else {
				tx.insert(levelAnnotations)
					.values({ id: newId(), entryId, levelKey: row.levelKey, ...values })
					.run();
			}
			logActivity(tx, {
				projectId,
				actor,
				kind: 'note.saved',
				summary: noteSummary(current ? 'pasted over' : 'pasted', levelText(row.levelKey), entry.title, {
					observedEnergy: row.energy,
					uncertainty: row.uncertainty,
					status: 'proposed'
				}),
				subject: `entry:${entryId}`
			});
		}
		return { saved: preview.rows.length, replaced };
	});
}
