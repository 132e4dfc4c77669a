/**
 * Many observed energies at once: a pasted column (format in $lib/energyPaste) becomes one note per
 * level, all in one transaction or none. Editors only. A line that cannot be placed saves nothing;
 * a note changed since the preview was shown (its version differs) refuses the whole paste (409).
 * Pasted notes follow the review rule (src/lib/review.ts): a new note is proposed by the person who
 * pastes; a new value (energy or uncertainty) over an old note is their proposal, so a confirmed
 * note becomes proposed again; a line that repeats a note's values keeps its status and proposer.
 * Each note writes its history row and its activity line in the transaction of the paste.
 */
import { and, eq } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../db';
import { levelAnnotations } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest, conflict, ServiceError } from '../errors';
import { parseInput } from '../validation';
import { newId } from '../ids';
import { annotatedLevels, noteValues, noteValuesChanged, recordChange } from './annotations';
import { resolvePaste, type PastePreview } from '../../energyPaste';
import { levelText } from '../../levels';
import { reviewOutcome } from '../../review';

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
 * Saves every line of a paste as a note on its level (proposed, unless it repeats the values of a
 * note that is there: that one keeps its status). Input: { text, seen } where `seen`
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
			// The old uncertainty belonged to the old value: a line without ± clears it.
			const values = noteValues(row.energy, row.uncertainty, row.comment ?? current?.comment ?? '', actor.id);
			const changed = noteValuesChanged(current, values);
			// A paste proposes its values; repeating a note's values is not a new proposal.
			const review = reviewOutcome(current ?? null, changed || !current ? 'proposed' : current.status, changed, actor.id);
			// Never refused (a paste does not ask to confirm), but the rule has the last word.
			if (!review.ok) throw new ServiceError(review.status, review.message, { level: row.levelKey });
			const reviewed = { status: review.status, proposedBy: review.proposedBy };
			const id = current?.id ?? newId();
			if (current) {
				replaced++;
				tx.update(levelAnnotations)
					.set({ ...values, ...reviewed, version: current.version + 1 })
					.where(eq(levelAnnotations.id, current.id))
					.run();
			} else {
				tx.insert(levelAnnotations)
					.values({ id, entryId, levelKey: row.levelKey, ...values, ...reviewed })
					.run();
			}
			const saved = tx.select().from(levelAnnotations).where(eq(levelAnnotations.id, id)).get()!;
			recordChange(tx, actor, projectId, entry, saved, review.change, current ? 'pasted over' : 'pasted');
		}
		return { saved: preview.rows.length, replaced };
	});
}
