/**
 * The review rule of level notes (assignments), shared by the server (which enforces it in
 * saveAnnotation) and the note form (which offers only the statuses the person may choose).
 * Imports nothing, so pages and the server read the same words.
 *
 * The rule: an editor proposes; confirming needs someone other than the proposer (an owner or
 * another editor); a note is never created as confirmed; anyone who may edit may mark a note
 * disputed or proposed again. Changing a note's values (observed energy, uncertainty) or the
 * level it is on makes it a new proposal by the person who changed it, so a confirmed note
 * becomes proposed again.
 */

export type NoteStatus = 'proposed' | 'confirmed' | 'disputed';

/** The kinds of change a note's history records, with the words its History shows. */
export const NOTE_CHANGES = {
	created: 'created',
	changed: 'changed',
	confirmed: 'confirmed',
	disputed: 'disputed',
	reopened: 'proposed again',
	reattached: 'reattached',
	detached: 'detached',
	deleted: 'deleted',
	// library: the note came with a copy of its entry (history copied before this row), or moved with it
	copied: 'copied with its entry',
	moved: 'moved with its entry to another project',
	recorded: 'recorded before history was kept'
} as const;

export type NoteChange = keyof typeof NOTE_CHANGES;
export const NOTE_CHANGE_NAMES = Object.keys(NOTE_CHANGES) as NoteChange[];

/** A note as the rule sees it: its status now and who proposed its present values. */
export interface ReviewedNote {
	status: NoteStatus;
	proposedBy: string | null;
}

/** The statuses a person (`userId`) may pick for a note (`null`: a new note) in one save. */
export function statusChoices(note: ReviewedNote | null, userId: string): NoteStatus[] {
	if (!note) return ['proposed', 'disputed'];
	// A confirmed note stays confirmed when its proposer only edits the comment.
	if (note.proposedBy === userId && note.status !== 'confirmed') return ['proposed', 'disputed'];
	return ['proposed', 'confirmed', 'disputed'];
}

/** The kinds of change one save of a note can be. */
export type SaveChange = Extract<NoteChange, 'created' | 'changed' | 'confirmed' | 'disputed' | 'reopened'>;

export type ReviewOutcome =
	/** `reopened`: new values turned a confirmed note back to proposed (the page says so). */
	| { ok: true; status: NoteStatus; proposedBy: string | null; change: SaveChange; reopened: boolean }
	| { ok: false; status: 400 | 403; message: string };

/**
 * What one save does to a note under the review rule.
 * @param current the note before the save, or null for a new note
 * @param requested the status the save asks for
 * @param valuesChanged whether the observed energy or its uncertainty change
 * @param userId who saves
 * @example reviewOutcome(null, 'confirmed', true, 'u1') // { ok: false, status: 400, … }
 * @example reviewOutcome({ status: 'proposed', proposedBy: 'u1' }, 'confirmed', false, 'u2') // confirmed by u2
 */
export function reviewOutcome(current: ReviewedNote | null, requested: NoteStatus, valuesChanged: boolean, userId: string): ReviewOutcome {
	if (!current) {
		if (requested === 'confirmed')
			return {
				ok: false,
				status: 400,
				message: 'A new note cannot be saved as confirmed: save it as proposed (or disputed), then an owner or another editor confirms it'
			};
		return { ok: true, status: requested, proposedBy: userId, change: 'created', reopened: false };
	}
	if (valuesChanged) {
		// New values are a new proposal, by the person who typed them.
		if (requested === 'confirmed' && current.status !== 'confirmed')
			return {
				ok: false,
				status: 400,
				message:
					'You cannot change the observed energy or uncertainty and confirm them in one save: the new values are your proposal, so save them as proposed, then an owner or another editor confirms them'
			};
		const status = requested === 'disputed' ? 'disputed' : 'proposed';
		const reopened = current.status === 'confirmed' && status === 'proposed';
		const change: SaveChange = reopened ? 'reopened' : status === 'disputed' && current.status !== 'disputed' ? 'disputed' : 'changed';
		return { ok: true, status, proposedBy: userId, change, reopened };
	}
	if (requested === 'confirmed' && current.status !== 'confirmed') {
		if (current.proposedBy === userId)
			return {
				ok: false,
				status: 403,
				message:
					'You proposed this note, so you cannot confirm it yourself: an owner or another editor confirms it. You may change it, or mark it disputed'
			};
		return { ok: true, status: 'confirmed', proposedBy: current.proposedBy, change: 'confirmed', reopened: false };
	}
	// Only the comment changes, or the status by hand: disputed, or proposed again (a confirmation withdrawn).
	const change: SaveChange = requested === current.status ? 'changed' : requested === 'disputed' ? 'disputed' : 'reopened';
	return { ok: true, status: requested, proposedBy: current.proposedBy, change, reopened: false };
}
