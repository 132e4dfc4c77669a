/**
 * `npm run load [-- --duration 60 --port 4323]`: load test of the built app (run `npm run build`
 * first; this script builds nothing). It starts `node build` on a scratch database seeded with
 * the invented demo (scripts/seed.ts), signs in, and drives a mixed workload with autocannon —
 * Shelf pages and API reads, /api/v1/terms on varied configurations, sign-ins and a few writes —
 * with 50 connections in all for `--duration` seconds (default 60). Then, for a quarter of that
 * time, heavy compute requests (Term sheets, jj, Energy solver levels and fits of 4f⁷) on 6 connections
 * while one connection times `GET /`.
 *
 * Prints requests/s, p50/p95/p99 per kind of request and errors (status ≥ 400, timeouts,
 * connection errors). Targets on a 2-core machine: 0 errors, p95 < 100 ms for reads and term
 * requests, `GET /` under 200 ms while heavy requests run. Not a test: figures depend on the
 * machine and on whatever else runs on it (autocannon itself shares the CPU with the server).
 */
import autocannon from 'autocannon';
import { spawn, execFileSync, type ChildProcess } from 'node:child_process';
import { existsSync, rmSync, mkdirSync } from 'node:fs';

const arg = (name: string, fallback: number) => {
	const i = process.argv.indexOf(`--${name}`);
	return i >= 0 ? Number(process.argv[i + 1]) : fallback;
};
const DURATION = arg('duration', 60);
const PORT = arg('port', 4323);
const BASE = `http://localhost:${PORT}`;
const DB = `data/load-${PORT}.db`;
const DEMO = { email: 'imre@kestrel.example', password: 'spectra-demo-2026' }; // scripts/demo-data.ts

/** Configurations for /api/v1/terms: the ordinary ones of a working day, light and medium. */
const CONFIGS = [
	'1s2 2s2 2p2',
	'[Ar] 3d6 4s',
	'3d5 4s',
	'[Xe] 4f7',
	'2p5 3p',
	'4f3',
	'3d3',
	'[Ne] 3s 3p',
	'4f7 5d 6s2',
	'2p3',
	'3d8 4s2',
	'4f2 6s',
	'5d4 6s2',
	'3d10 4s 4p',
	'4f13',
	'2s 2p3'
];
/** Heavy requests (each tens of ms to a second of CPU, within the budgets): the worker pool's work. */
const HEAVY = [
	'/api/v1/terms?config=10m19',
	'/api/v1/bridge?config=' + encodeURIComponent('4f7 5d 6p'),
	'/api/v1/jj?config=' + encodeURIComponent('4f7 5d 6p'),
	'/api/v1/basis?j1=10&j2=10',
	'/api/v1/terms?config=' + encodeURIComponent('4f7 5g5 6h5 7i3 6d3 7p'),
	'/api/v1/wigner?symbol=9j&args=' + Array(9).fill('50').join(',')
];
/**
 * Heavy Energy solver requests (POST): all levels of 4f⁷ (3 432 determinants, about a second) and
 * a fit of it; invented but typical parameters (cm⁻¹), as in scripts/bench-energy.ts.
 */
const F7_PARAMETERS = {
	F: [
		{ k: 2, a: '4f', b: '4f', value: 84000 },
		{ k: 4, a: '4f', b: '4f', value: 60000 },
		{ k: 6, a: '4f', b: '4f', value: 43000 }
	],
	zeta: [{ shell: '4f', value: 1500 }]
};
const HEAVY_POSTS = [
	{ path: '/api/v1/energies', body: { config: '4f7', parameters: F7_PARAMETERS } },
	{
		path: '/api/v1/fit',
		body: {
			config: '4f7',
			parameters: F7_PARAMETERS,
			vary: ['Eav', 'zeta(4f)'],
			observed: [
				{ J: '7/2', energy: 0 },
				{ J: '5/2', energy: 30000 },
				{ J: '7/2', energy: 30500 }
			]
		}
	}
].map(({ path, body }) => ({ method: 'POST' as const, path, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) }));

function startServer(): ChildProcess {
	if (!existsSync('build/index.js')) {
		console.error('No build/: run `npm run build` first (this script does not build).');
		process.exit(1);
	}
	mkdirSync('data', { recursive: true });
	for (const suffix of ['', '-wal', '-shm']) rmSync(DB + suffix, { force: true });
	const env = { ...process.env, DATABASE_PATH: DB, PORT: String(PORT), COOKIE_SECURE: 'false', ORIGIN: BASE };
	execFileSync('npx', ['tsx', '--tsconfig', 'scripts/tsconfig.json', 'scripts/migrate.ts'], { env, stdio: 'ignore' });
	execFileSync('npx', ['tsx', '--tsconfig', 'scripts/tsconfig.json', 'scripts/seed.ts'], { env, stdio: 'ignore' });
	return spawn('node', ['scripts/start.js'], { env, stdio: ['ignore', 'ignore', 'inherit'] });
}

async function waitForServer() {
	for (let i = 0; i < 100; i++) {
		try {
			if ((await fetch(`${BASE}/api/v1`)).ok) return;
		} catch {
			/* not up yet */
		}
		await new Promise((r) => setTimeout(r, 200));
	}
	throw new Error('the server did not start');
}

async function signIn(): Promise<string> {
	const res = await fetch(`${BASE}/signin`, {
		method: 'POST',
		redirect: 'manual',
		headers: { 'content-type': 'application/x-www-form-urlencoded', origin: BASE },
		body: new URLSearchParams(DEMO).toString()
	});
	const cookie = res.headers.getSetCookie().map((c) => c.split(';')[0]);
	if (res.status >= 400 || !cookie.some((c) => c.startsWith('tw_session='))) throw new Error(`sign-in failed: ${res.status}`);
	return cookie.join('; ');
}

interface Tally {
	times: number[];
	errors: number;
	statuses: Map<number, number>;
}

function percentile(sorted: number[], p: number): number {
	if (sorted.length === 0) return NaN;
	return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

/** One autocannon run; every response time and status is kept (autocannon's own summary has no p95). */
function drive(
	kind: string,
	options: {
		connections: number;
		duration: number;
		requests: autocannon.Request[];
		headers?: Record<string, string>;
		overallRate?: number;
	},
	tallies: Map<string, Tally>
): Promise<autocannon.Result> {
	const tally: Tally = { times: [], errors: 0, statuses: new Map() };
	tallies.set(kind, tally);
	const instance = autocannon({ url: BASE, timeout: 10, ...options });
	instance.on('response', (_client: unknown, status: number, _bytes: number, ms: number) => {
		tally.times.push(ms);
		tally.statuses.set(status, (tally.statuses.get(status) ?? 0) + 1);
		if (status >= 400) tally.errors++;
	});
	return instance.then((r: autocannon.Result) => {
		tally.errors += r.errors + r.timeouts;
		return r;
	});
}

function report(title: string, tallies: Map<string, Tally>, seconds: number) {
	console.log(`\n${title}`);
	console.log(
		`${'kind'.padEnd(22)} ${'requests'.padStart(9)} ${'req/s'.padStart(7)} ${'p50 ms'.padStart(7)} ${'p95 ms'.padStart(7)} ${'p99 ms'.padStart(7)} ${'max ms'.padStart(7)} ${'errors'.padStart(7)}  statuses`
	);
	let total = 0;
	let errors = 0;
	for (const [kind, t] of tallies) {
		const s = t.times.slice().sort((a, b) => a - b);
		total += s.length;
		errors += t.errors;
		const statuses = [...t.statuses].map(([k, v]) => `${k}×${v}`).join(' ');
		console.log(
			`${kind.padEnd(22)} ${String(s.length).padStart(9)} ${(s.length / seconds).toFixed(0).padStart(7)} ${percentile(s, 50).toFixed(0).padStart(7)} ${percentile(s, 95).toFixed(0).padStart(7)} ${percentile(s, 99).toFixed(0).padStart(7)} ${(s[s.length - 1] ?? NaN).toFixed(0).padStart(7)} ${String(t.errors).padStart(7)}  ${statuses}`
		);
	}
	console.log(
		`${'all'.padEnd(22)} ${String(total).padStart(9)} ${(total / seconds).toFixed(0).padStart(7)}${' '.repeat(40)}${String(errors).padStart(7)}`
	);
	return { total, errors };
}

const server = startServer();
try {
	await waitForServer();
	const cookie = await signIn();
	const headers = { cookie };
	const projects = (await (await fetch(`${BASE}/api/v1/projects`, { headers })).json()) as { projects: { id: string }[] };
	const projectId = projects.projects[0].id;
	const shelf = (await (await fetch(`${BASE}/api/v1/projects/${projectId}/shelf`, { headers })).json()) as { entries: { id: string }[] };
	const entryIds = shelf.entries.map((e) => e.id);
	console.log(`Termwright load test: ${BASE}, ${DURATION} s, database ${DB} (demo seed: ${entryIds.length} Shelf entries)`);

	// Warm-up: the first requests pay for compilation and caches.
	for (const c of CONFIGS) await fetch(`${BASE}/api/v1/terms?config=${encodeURIComponent(c)}`);

	const tallies = new Map<string, Tally>();
	const reads: autocannon.Request[] = [
		{ method: 'GET', path: `/projects/${projectId}` },
		{ method: 'GET', path: `/api/v1/projects/${projectId}/shelf` },
		...entryIds.slice(0, 3).map((id) => ({ method: 'GET' as const, path: `/projects/${projectId}/shelf/${id}` })),
		{ method: 'GET', path: '/projects' }
	];
	const terms: autocannon.Request[] = CONFIGS.map((c, i) => ({
		method: 'GET',
		path: `/api/v1/terms?config=${encodeURIComponent(c)}${i % 3 === 0 ? '&gs=free' : ''}`
	}));
	const writes: autocannon.Request[] = [
		{
			method: 'POST',
			path: `/api/v1/projects/${projectId}/shelf`,
			headers: { 'content-type': 'application/json', cookie },
			body: JSON.stringify({ title: 'Load test entry (invented)', species: 'Fe II', notation: '[Ar] 3d6 4s' })
		}
	];
	const signIns: autocannon.Request[] = [
		{
			method: 'POST',
			path: '/signin',
			headers: { 'content-type': 'application/x-www-form-urlencoded', origin: BASE },
			body: new URLSearchParams(DEMO).toString()
		}
	];
	await Promise.all([
		drive('reads (Shelf pages)', { connections: 24, duration: DURATION, requests: reads, headers }, tallies),
		drive('terms (varied)', { connections: 22, duration: DURATION, requests: terms }, tallies),
		drive('writes (Shelf)', { connections: 2, duration: DURATION, requests: writes, headers, overallRate: 5 }, tallies),
		drive('sign-in', { connections: 2, duration: DURATION, requests: signIns, overallRate: 2 }, tallies)
	]);
	const mixed = report(`Mixed workload, 50 connections, ${DURATION} s`, tallies, DURATION);

	const heavySeconds = Math.max(5, Math.round(DURATION / 4));
	const heavyTallies = new Map<string, Tally>();
	await Promise.all([
		drive(
			'heavy compute',
			{ connections: 6, duration: heavySeconds, requests: [...HEAVY.map((path) => ({ method: 'GET' as const, path })), ...HEAVY_POSTS] },
			heavyTallies
		),
		drive('GET / during heavy', { connections: 1, duration: heavySeconds, requests: [{ method: 'GET', path: '/' }] }, heavyTallies)
	]);
	const heavy = report(`Heavy compute on 6 connections with GET / on one more, ${heavySeconds} s`, heavyTallies, heavySeconds);

	const p95 = (kind: string, from: Map<string, Tally>) =>
		percentile(
			from
				.get(kind)!
				.times.slice()
				.sort((a, b) => a - b),
			95
		);
	const home = heavyTallies.get('GET / during heavy')!.times;
	console.log('\nTargets (2-core machine): 0 errors; p95 < 100 ms for reads and terms; GET / < 200 ms during heavy requests');
	console.log(`  errors: ${mixed.errors} in the mixed workload, ${heavy.errors} in the heavy phase`);
	console.log(`  p95 reads ${p95('reads (Shelf pages)', tallies).toFixed(0)} ms, terms ${p95('terms (varied)', tallies).toFixed(0)} ms`);
	console.log(`  GET / during heavy: p95 ${p95('GET / during heavy', heavyTallies).toFixed(0)} ms, max ${Math.max(...home).toFixed(0)} ms`);
} finally {
	server.kill('SIGTERM');
}
