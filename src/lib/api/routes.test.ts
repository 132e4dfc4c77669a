import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { describe, expect, it } from 'vitest';
import { API_ROUTES, routeKey } from './routes';

const ROOT = 'src/routes/api/v1';

/** Every `+server.ts` below ROOT with the HTTP methods it exports, as "METHOD /api/v1/…" keys. */
function routesInTree(dir = ROOT): string[] {
	const out: string[] = [];
	for (const name of readdirSync(dir)) {
		const path = join(dir, name);
		if (statSync(path).isDirectory()) out.push(...routesInTree(path));
		else if (name === '+server.ts') {
			const rel = relative(ROOT, dir).split(sep).filter(Boolean);
			// SvelteKit's [param] folders become :param in the listed path.
			const urlPath = ['/api/v1', ...rel.map((p) => p.replace(/^\[(.+)\]$/, ':$1'))].join('/').replace(/\/$/, '');
			const source = readFileSync(path, 'utf8');
			for (const m of source.matchAll(/export const (GET|POST|PUT|PATCH|DELETE)\b/g)) out.push(`${m[1]} ${urlPath}`);
		}
	}
	return out;
}

describe('the /api/v1 route list', () => {
	const inTree = routesInTree().sort();
	const listed = API_ROUTES.map(routeKey).sort();

	it('lists every method that a +server.ts exports (add new routes to src/lib/api/routes.json and types.ts)', () => {
		expect(inTree.filter((k) => !listed.includes(k))).toEqual([]);
	});

	it('lists nothing that no +server.ts exports', () => {
		expect(listed.filter((k) => !inTree.includes(k))).toEqual([]);
	});

	it('found the routes at all (the scan is not empty)', () => {
		expect(inTree.length).toBeGreaterThanOrEqual(20);
	});
});
