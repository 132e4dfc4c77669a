/**
 * The engine stays pure TypeScript: no Svelte, no SvelteKit ($app, $env), no server code,
 * no database. This scans every engine source file's imports (house rule, no source).
 */
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

const dir = join(process.cwd(), 'src/lib/physics');
const FORBIDDEN = [/^svelte/, /^\$app/, /^\$env/, /^\$lib\/server/, /server\//, /better-sqlite3/, /drizzle/, /lucia/];

describe('engine purity', () => {
	const files = readdirSync(dir).filter((f) => f.endsWith('.ts'));
	it('has source files to check', () => expect(files.length).toBeGreaterThan(10));
	for (const f of files) {
		it(`${f} imports only the engine and plain packages`, () => {
			const text = readFileSync(join(dir, f), 'utf8');
			const specifiers = [...text.matchAll(/from\s+['"]([^'"]+)['"]/g)].map((m) => m[1]);
			for (const s of specifiers) for (const rule of FORBIDDEN) expect(s, `${f} imports ${s}`).not.toMatch(rule);
		});
	}
});
