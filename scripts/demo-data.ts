/**
 * The invented demo scenario: a small group at the fictional Kestrel Ridge Observatory
 * working through the fictional planetary nebula "Lantern Nebula" (KRO-PN 7) and the
 * fictional chemically peculiar star "Vireo's Star" (KRO-CP 12). Every name, number and
 * note here is made up for the demo; none is catalogue data.
 */
export const DEMO_PASSWORD = 'spectra-demo-2026';

export const demoUsers = [
	{ name: 'Imre Valdšteinová', email: 'imre@kestrel.example', role: 'owner' as const },
	{ name: 'Tomasz Achterberg', email: 'tomasz@kestrel.example', role: 'editor' as const },
	{ name: 'Nalini Osei-Brandt', email: 'nalini@kestrel.example', role: 'viewer' as const }
];

export const demoProject = {
	name: 'Lantern Nebula & Vireo’s Star',
	description:
		'Line identifications for the fictional planetary nebula KRO-PN 7 and the chemically peculiar star KRO-CP 12 (demo data, invented).'
};

export const demoShelf = [
	{
		title: 'Nebular doubly ionized oxygen — ground configuration',
		species: 'O III',
		notation: '1s2 2s2 2p2',
		tags: ['nebula', 'forbidden lines'],
		notes:
			'Forbidden lines inside the ground configuration dominate the nebula’s spectrum. Level energies entered here are invented for the demo.'
	},
	{
		title: 'Singly ionized nitrogen, auroral and nebular lines',
		species: 'N II',
		notation: '[He] 2s2 2p2',
		tags: ['nebula', 'forbidden lines'],
		notes: 'Same term structure as the O III entry; compare the splittings once energies are in.'
	},
	{
		title: 'Iron II ground configuration for the peculiar star',
		species: 'Fe II',
		notation: '[Ar] 3d6 4s',
		tags: ['peculiar star', 'iron group'],
		notes: 'Many levels; the team is checking which sextet and quartet levels explain the strongest absorption features.'
	},
	{
		title: 'Doubly ionized neodymium',
		species: 'Nd III',
		notation: '[Xe] 4f4',
		tags: ['peculiar star', 'lanthanide'],
		notes: 'Disputed: is the ground level really the Hund’s-rule level here? Tomasz thinks so, Imre wants observed levels first.'
	},
	{
		title: 'Excited neutral neon, two open subshells',
		species: 'Ne I',
		notation: '1s2 2s2 2p5 3p',
		tags: ['coupling', 'teaching set'],
		notes: 'Good test case for the Coupling bridge: close to neither pure LS nor pure jj.'
	}
];

/**
 * Invented level notes, by Shelf entry index. The energies are made up for the fictional
 * objects and deliberately do not reproduce any catalogue.
 */
export const demoNotes: {
	entry: number;
	by: number;
	levelKey: string;
	observedEnergy: number | null;
	uncertainty: number | null;
	status: 'proposed' | 'confirmed' | 'disputed';
	comment: string;
}[] = [
	{ entry: 0, by: 0, levelKey: '3P#1|0', observedEnergy: 0, uncertainty: 0, status: 'confirmed', comment: 'Ground level by definition.' },
	{
		entry: 0,
		by: 1,
		levelKey: '3P#1|1',
		observedEnergy: 117.42,
		uncertainty: 0.05,
		status: 'confirmed',
		comment: 'From the far-infrared pair in the KRO-PN 7 spectrum.'
	},
	{ entry: 0, by: 1, levelKey: '3P#1|2', observedEnergy: 305.9, uncertainty: 0.08, status: 'confirmed', comment: '' },
	{
		entry: 0,
		by: 1,
		levelKey: '1D#1|2',
		observedEnergy: 20190.3,
		uncertainty: 0.4,
		status: 'proposed',
		comment: 'Nebular doublet; second member blended with a sky line.'
	},
	{
		entry: 0,
		by: 0,
		levelKey: '1S#1|0',
		observedEnergy: 43150.8,
		uncertainty: 1.5,
		status: 'disputed',
		comment: 'Auroral line is weak; Imre is not convinced by the identification.'
	},
	{
		entry: 2,
		by: 1,
		levelKey: '6D#1|9/2',
		observedEnergy: 0,
		uncertainty: 0,
		status: 'confirmed',
		comment: 'Hund ground level; adopted as zero.'
	},
	{ entry: 2, by: 1, levelKey: '6D#1|7/2', observedEnergy: 391.2, uncertainty: 0.3, status: 'proposed', comment: '' },
	{
		entry: 3,
		by: 1,
		levelKey: '5I#1|4',
		observedEnergy: 0,
		uncertainty: null,
		status: 'disputed',
		comment: 'Assumed ground level; needs observed levels.'
	}
];

/**
 * A second invented project, so an entry can be copied or moved between projects in the demo:
 * a small student group's library of hot-star species. Tomasz owns it, Imre edits it, and Nalini
 * (a viewer of the first project) edits here, so she can copy an entry out of the first one.
 * Roles by index in demoUsers. Every name, number and note is made up.
 */
export const demoGroupProject = {
	name: 'Kestrel student group — hot stars',
	description: 'A small group’s library for the fictional hot star KRO-B 3 (demo data, invented).',
	owner: 1,
	members: [
		{ user: 0, role: 'editor' as const },
		{ user: 2, role: 'editor' as const }
	]
};

export const demoGroupShelf = [
	{
		title: 'Neutral helium, first excited configuration',
		species: 'He I',
		notation: '1s 2p',
		tags: ['hot star', 'singlet-triplet'],
		notes: 'Singlet and triplet series; the energies entered are invented for the demo.'
	},
	{
		title: 'Singly ionized carbon ground doublet',
		species: 'C II',
		notation: '[He] 2s2 2p',
		tags: ['hot star'],
		notes: 'A fine-structure pair only.'
	},
	{
		title: 'Doubly ionized silicon, 3s3p',
		species: 'Si III',
		notation: '[Ne] 3s 3p',
		tags: ['hot star', 'to check'],
		notes: ''
	}
];

/** Invented notes of the group project, by entry index (same rules as demoNotes). */
export const demoGroupNotes: typeof demoNotes = [
	{ entry: 1, by: 1, levelKey: '2P#1|1/2', observedEnergy: 0, uncertainty: 0, status: 'confirmed', comment: 'Ground level by definition.' },
	{
		entry: 1,
		by: 1,
		levelKey: '2P#1|3/2',
		observedEnergy: 63.7,
		uncertainty: 0.2,
		status: 'proposed',
		comment: 'From the far-infrared line of KRO-B 3 (invented).'
	}
];
