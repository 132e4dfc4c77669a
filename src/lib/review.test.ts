/**
 * The review rule of level notes (src/lib/review.ts): an editor proposes; confirming needs someone
 * other than the proposer; no note is created confirmed; new values are a new proposal. These are
 * the product's rules as issue #13 states them (common practice for shared records, no source).
 */
import { describe, expect, it } from 'vitest';
import { reviewOutcome, statusChoices, type ReviewedNote } from './review';

const proposedByAnn: ReviewedNote = { status: 'proposed', proposedBy: 'ann' };
const confirmedOfAnn: ReviewedNote = { status: 'confirmed', proposedBy: 'ann' };
const disputedOfAnn: ReviewedNote = { status: 'disputed', proposedBy: 'ann' };

describe('statusChoices: what the note form offers', () => {
	it('a new note: proposed or disputed, never confirmed', () => {
		expect(statusChoices(null, 'ann')).toEqual(['proposed', 'disputed']);
	});

	it('the proposer of a proposed or disputed note is not offered confirmed; anyone else is', () => {
		expect(statusChoices(proposedByAnn, 'ann')).toEqual(['proposed', 'disputed']);
		expect(statusChoices(disputedOfAnn, 'ann')).toEqual(['proposed', 'disputed']);
		expect(statusChoices(proposedByAnn, 'bob')).toEqual(['proposed', 'confirmed', 'disputed']);
	});

	it('a confirmed note keeps "confirmed" on offer to its proposer (a comment edit keeps the confirmation)', () => {
		expect(statusChoices(confirmedOfAnn, 'ann')).toContain('confirmed');
	});

	it('a note whose proposer is unknown (account gone, or older than the rule) may be confirmed by anyone', () => {
		expect(statusChoices({ status: 'proposed', proposedBy: null }, 'ann')).toContain('confirmed');
	});

	it('every status it offers is one reviewOutcome accepts for a save without new values', () => {
		for (const note of [proposedByAnn, confirmedOfAnn, disputedOfAnn])
			for (const who of ['ann', 'bob'])
				for (const s of statusChoices(note, who)) expect(reviewOutcome(note, s, false, who).ok, `${who} ${note.status}→${s}`).toBe(true);
	});
});

describe('reviewOutcome: what one save does', () => {
	it('no note is created confirmed (400), whoever saves it', () => {
		const r = reviewOutcome(null, 'confirmed', true, 'ann');
		expect(r).toMatchObject({ ok: false, status: 400 });
		expect(r.ok || r.message).toMatch(/new note cannot be saved as confirmed/);
	});

	it('a new note is proposed (or disputed) by the person who saves it', () => {
		expect(reviewOutcome(null, 'proposed', true, 'ann')).toEqual({
			ok: true,
			status: 'proposed',
			proposedBy: 'ann',
			change: 'created',
			reopened: false
		});
		expect(reviewOutcome(null, 'disputed', true, 'ann')).toMatchObject({
			ok: true,
			status: 'disputed',
			proposedBy: 'ann',
			change: 'created'
		});
	});

	it('the proposer cannot confirm their own proposal (403) and the message says who can', () => {
		const r = reviewOutcome(proposedByAnn, 'confirmed', false, 'ann');
		expect(r).toMatchObject({ ok: false, status: 403 });
		expect(r.ok || r.message).toMatch(/You proposed this note, so you cannot confirm it yourself: an owner or another editor/);
		expect(reviewOutcome(disputedOfAnn, 'confirmed', false, 'ann')).toMatchObject({ ok: false, status: 403 });
	});

	it('another editor or owner confirms it; the proposer stays on the note', () => {
		expect(reviewOutcome(proposedByAnn, 'confirmed', false, 'bob')).toEqual({
			ok: true,
			status: 'confirmed',
			proposedBy: 'ann',
			change: 'confirmed',
			reopened: false
		});
	});

	it('new values on a confirmed note make it proposed again, by the person who typed them', () => {
		expect(reviewOutcome(confirmedOfAnn, 'confirmed', true, 'bob')).toEqual({
			ok: true,
			status: 'proposed',
			proposedBy: 'bob',
			change: 'reopened',
			reopened: true
		});
		// The same for its own proposer: the values are confirmed no more.
		expect(reviewOutcome(confirmedOfAnn, 'proposed', true, 'ann')).toMatchObject({ status: 'proposed', proposedBy: 'ann', reopened: true });
	});

	it('new values cannot be confirmed in the same save, not even by someone else (400)', () => {
		expect(reviewOutcome(proposedByAnn, 'confirmed', true, 'bob')).toMatchObject({ ok: false, status: 400 });
	});

	it('new values on a proposed note: the saver becomes the proposer', () => {
		expect(reviewOutcome(proposedByAnn, 'proposed', true, 'bob')).toMatchObject({
			ok: true,
			status: 'proposed',
			proposedBy: 'bob',
			change: 'changed'
		});
	});

	it('new values saved as disputed: a dispute, by the saver', () => {
		expect(reviewOutcome(proposedByAnn, 'disputed', true, 'bob')).toMatchObject({
			status: 'disputed',
			proposedBy: 'bob',
			change: 'disputed'
		});
	});

	it('a comment edit keeps the status and the proposer', () => {
		expect(reviewOutcome(confirmedOfAnn, 'confirmed', false, 'ann')).toMatchObject({
			ok: true,
			status: 'confirmed',
			proposedBy: 'ann',
			change: 'changed'
		});
	});

	it('disputing, and withdrawing a confirmation, keep the proposer', () => {
		expect(reviewOutcome(confirmedOfAnn, 'disputed', false, 'bob')).toMatchObject({
			status: 'disputed',
			proposedBy: 'ann',
			change: 'disputed'
		});
		expect(reviewOutcome(confirmedOfAnn, 'proposed', false, 'bob')).toMatchObject({
			status: 'proposed',
			proposedBy: 'ann',
			change: 'reopened',
			reopened: false
		});
	});
});
