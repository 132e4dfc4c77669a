import type { RequestHandler } from './$types';
import { formatConfiguration, parseConfiguration } from '$lib/physics/parse';
import { couplingBridge } from '$lib/physics/bridge';
import { halfString } from '$lib/physics/half';
import { api, queryParam, reply } from '$lib/server/http';

/** LS ↔ jj correlation by J (non-crossing rule), both sides in schematic order: `?config=2p 3p`. */
export const GET: RequestHandler = api((event) => {
	const cfg = parseConfiguration(queryParam(event, 'config'));
	const b = couplingBridge(cfg);
	return reply('GET /api/v1/bridge', {
		configuration: { notation: formatConfiguration(cfg), pretty: formatConfiguration(cfg, { superscripts: true }), parity: cfg.parity },
		schematic: true,
		ls: b.ls.map((x) => ({ label: x.label, J: halfString(x.twoJ) })),
		jj: b.jj.map((x) => ({
			label: x.label,
			J: halfString(x.twoJ),
			group: x.level.couplingLabel,
			subshells: x.level.subshellLabel,
			spinOrbitWeight: x.spinOrbitWeight
		})),
		links: b.links.map((l) => ({ J: halfString(l.twoJ), ls: l.ls, jj: l.jj }))
	});
});
