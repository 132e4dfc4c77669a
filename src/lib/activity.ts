/**
 * The kinds of change a project's activity log records, with the words the log page shows.
 * Shared by the server (which writes the log) and the pages (which filter it), so it imports nothing.
 *
 * THE PLACE WHERE NEW RECORDS JOIN THE LOG: a feature that changes project data (parameter sets,
 * fits, uploaded level and line lists, identifications, invitations, …) adds its kinds here and
 * calls `logActivity(tx, …)` from $lib/server/services/activity inside the transaction of its write.
 * The kinds marked "(planned)" are reserved for features other parts of the app are building.
 */
export const ACTIVITY_KINDS = {
	'project.created': 'created the project',
	'project.updated': 'changed the project',
	'project.restored': 'restored the project from a backup',
	'member.added': 'added a member',
	'member.role_changed': 'changed a role',
	'member.removed': 'removed a member',
	'member.left': 'left the project',
	'entry.created': 'added a Shelf entry',
	'entry.updated': 'changed a Shelf entry',
	'entry.deleted': 'deleted a Shelf entry',
	// library: a duplicate or a copy (in each project concerned), a move (in both projects)
	'entry.copied': 'copied a Shelf entry',
	'entry.moved': 'moved a Shelf entry',
	'note.saved': 'changed a level note',
	'note.confirmed': 'confirmed an assignment',
	'note.disputed': 'disputed an assignment',
	'note.reattached': 'reattached a level note',
	'note.deleted': 'deleted a level note',
	'invitation.sent': 'sent an invitation',
	'invitation.revoked': 'revoked an invitation',
	'invitation.accepted': 'joined by invitation',
	// (planned) Energy solver, Line matcher and uploads join here.
	'parameters.saved': 'saved parameters',
	'fit.saved': 'saved a fit',
	'parameters.deleted': 'deleted parameters',
	'list.uploaded': 'uploaded a list',
	'list.deleted': 'deleted a list',
	'identification.accepted': 'accepted an identification',
	'identification.rejected': 'rejected an identification'
} as const;

export type ActivityKind = keyof typeof ACTIVITY_KINDS;

export const ACTIVITY_KIND_NAMES = Object.keys(ACTIVITY_KINDS) as ActivityKind[];

export const isActivityKind = (text: string): text is ActivityKind => Object.hasOwn(ACTIVITY_KINDS, text);
