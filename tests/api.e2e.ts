/**
 * The public compute API, as scripts use it. Check values name their sources.
 */
import { expect, test } from './helpers';

test.describe('GET /api/v1/terms', () => {
	test('d3 gives 2P 2D(2) 2F 2G 2H 4P 4F with Hund ground ⁴F₃/₂ (rigorous)', async ({ request }) => {
		// d³ terms: Condon & Shortley (1935) ch. VII table of equivalent-electron terms; ⁴F₃/₂ is the
		// ground level of V³⁺-like / Ti-group d³ ions (Hund's rules; e.g. V I 3d³4s² ⁴F₃/₂ in the NIST/CRC table).
		const res = await request.get('/api/v1/terms?config=' + encodeURIComponent('[Ar] 3d3'));
		expect(res.status()).toBe(200);
		const body = await res.json();
		expect(body.configuration).toMatchObject({ electrons: 21, parity: 'even' });
		expect(body.microstates).toBe('120'); // C(10,3) = 120; every count is an exact decimal string
		const summary = body.terms.map((t: { label: string; count: string }) => t.label + (t.count !== '1' ? `(${t.count})` : '')).sort();
		expect(summary).toEqual(['2D(2)', '2F', '2G', '2H', '2P', '4F', '4P']);
		const f4 = body.terms.find((t: { label: string }) => t.label === '4F');
		expect(f4).toMatchObject({ S: '3/2', L: 3, count: '1', seniority: 3, seniorities: [{ seniority: 3, count: '1' }], weight: 28 });
		// g(⁴F₃/₂) = 2/5 (Landé formula with g_s = 2).
		expect(f4.levels[0]).toEqual({ J: '3/2', g: '2/5', gDecimal: 0.4, weight: 4 });
		expect(body.hund).toMatchObject({ term: '4F', J: '3/2', rigorous: true });
	});

	test('bad notation is a 400 naming the token and the rule', async ({ request }) => {
		const res = await request.get('/api/v1/terms?config=1s2%202p7');
		expect(res.status()).toBe(400);
		const body = await res.json();
		expect(body.error.token).toBe('2p7');
		expect(body.error.message).toMatch(/at most 6/);
	});

	test('12o23 and 10m19-sized requests are answered at once: over the budget is a 400 stating the limit', async ({ request }) => {
		// Regression: 12o23 once grew the server's heap past 4 GB.
		const res = await request.get('/api/v1/terms?config=12o23');
		expect(res.status()).toBe(400);
		expect((await res.json()).error.message).toMatch(/over the limit of 15000/);
		const ok = await request.get('/api/v1/terms?config=10m19');
		expect(ok.status()).toBe(200);
		// C(38,19) = 35 345 263 800 microstates (combinatorics).
		expect((await ok.json()).microstates).toBe('35345263800');
	});

	test('over-long input is refused with the limit', async ({ request }) => {
		const res = await request.get('/api/v1/terms?config=' + '1s '.repeat(80));
		expect(res.status()).toBe(400);
		expect((await res.json()).error.message).toMatch(/200/);
	});
});

test('GET /api/v1/jj: p² gives J = 0, 1, 2, 0, 2 as in LS', async ({ request }) => {
	// jj coupling of p²: (1/2)² J=0; (1/2,3/2) J=1,2; (3/2)² J=0,2 (Condon & Shortley ch. XI; Cowan ch. 4).
	const body = await (await request.get('/api/v1/jj?config=2p2')).json();
	expect(body.levels.map((l: { J: string }) => l.J).sort()).toEqual(['0', '0', '1', '2', '2']);
	expect(body.countsByJ).toEqual({ '0': 2, '1': 1, '2': 2 });
	expect(body.countsAgreeWithLS).toBe(true);
});

test('GET /api/v1/wigner: (1 1 0; 1 −1 0) = 1/√3 exactly', async ({ request }) => {
	// (j j 0; m −m 0) = (−1)^{j−m}/√(2j+1) (Edmonds 1957, Table 2); j = 1, m = 1 → +1/√3.
	const body = await (await request.get('/api/v1/wigner?symbol=3j&args=1,1,0,1,-1,0')).json();
	expect(body.exact).toEqual({ sign: 1, squared: '1/3' });
	expect(body.value).toBeCloseTo(1 / Math.sqrt(3), 14);
	const bad = await request.get('/api/v1/wigner?symbol=3j&args=1,1');
	expect(bad.status()).toBe(400);
	expect((await bad.json()).error.message).toMatch(/6/);
});

test('GET /api/v1/basis: |3/2 1/2⟩ of 1 ⊗ 1/2 has √(2/3) on |0, 1/2⟩', async ({ request }) => {
	// Clebsch–Gordan table for j2 = 1/2 (Condon & Shortley 1935 ch. III; PDG table): ⟨1 0; ½ ½|3/2 ½⟩ = √(2/3).
	const body = await (await request.get('/api/v1/basis?j1=1&j2=1/2')).json();
	const row = body.coupled.find((r: { J: string; M: string }) => r.J === '3/2' && r.M === '1/2');
	const c = row.components.find((x: { m1: string; m2: string }) => x.m1 === '0' && x.m2 === '1/2');
	expect(c.coefficient).toMatchObject({ sign: 1, squared: '2/3' });
});

test('GET /api/v1/species: Fe II → [Ar] 3d6 4s with a caution for ions', async ({ request }) => {
	// Fe II (Fe⁺) ground configuration 3d⁶4s (NIST ASD / CRC ground levels of ions).
	const body = await (await request.get('/api/v1/species?name=Fe%20II')).json();
	expect(body.notation).toMatch(/3d6 4s$/);
	expect(body.species).toMatchObject({ symbol: 'Fe', charge: 1 });
	const bad = await request.get('/api/v1/species?name=Xx%20II');
	expect(bad.status()).toBe(400);
});

test('GET /api/v1/microstates pages through the 15 microstates of p²', async ({ request }) => {
	// C(6,2) = 15 microstates of p² (combinatorics).
	const body = await (await request.get('/api/v1/microstates?config=2p2&offset=10&limit=10')).json();
	expect(body.total).toBe('15');
	expect(body.items).toHaveLength(5);
	const big = await request.get('/api/v1/microstates?config=2p2&limit=501');
	expect(big.status()).toBe(400);
	expect((await big.json()).error.message).toMatch(/500/);
});

test('project routes: 401 without sign-in, 400 for a body that is not JSON, token access works', async ({ browser, request }) => {
	const anonymous = await request.get('/api/v1/projects');
	expect(anonymous.status()).toBe(401);
	expect((await anonymous.json()).error.message).toMatch(/Sign in/);

	const { newUser } = await import('./helpers');
	const { context, page } = await newUser(browser, 'Api User', 'api');
	const notJson = await page.request.post('/api/v1/projects', {
		headers: { 'content-type': 'application/json' },
		data: Buffer.from('{name:')
	});
	expect(notJson.status()).toBe(400);
	expect((await notJson.json()).error.message).toBe('Request body must be JSON');
	const notObject = await page.request.post('/api/v1/projects', { data: '"a string"' });
	expect((await notObject.json()).error.message).toBe('Request body must be a JSON object');
	const empty = await page.request.post('/api/v1/projects', { data: { name: '' } });
	expect(await empty.json()).toEqual({ error: { message: 'Project name must not be empty', field: 'name' } });

	// A personal API token acts as its owner.
	await page.goto('/account');
	await page.getByLabel('Name').fill('script');
	await page.getByRole('button', { name: 'Create token' }).click();
	const token = (await page.getByTestId('new-token').textContent())!.trim();
	const viaToken = await request.post('/api/v1/projects', {
		headers: { authorization: `Bearer ${token}` },
		data: { name: 'Made by a script' }
	});
	expect(viaToken.status()).toBe(201);
	const bad = await request.get('/api/v1/projects', { headers: { authorization: 'Bearer tw_wrong' } });
	expect(bad.status()).toBe(401);

	await page.goto('/projects/no-such-project');
	await expect(page.getByRole('heading', { name: 'No such project' })).toBeVisible();
	await context.close();
});

test('GET /api/v1/jj refuses to list over 20000 levels and counts them by J instead', async ({ request }) => {
	const many = await request.get('/api/v1/jj?config=' + encodeURIComponent('4f7 5d2 6p'));
	expect(many.status()).toBe(400);
	expect((await many.json()).error.message).toMatch(/counts=only/);
	const counts = await (await request.get('/api/v1/jj?counts=only&config=' + encodeURIComponent('4f7 5d2 6p'))).json();
	// Σ over J of the level counts = number of LS levels; Σ (2J+1)·n_J = 926,640 microstates = C(14,7)·C(10,2)·C(6,1).
	const states = Object.entries(counts.countsByJ as Record<string, number>).reduce((sum, [J, n]) => {
		const twoJ = J.endsWith('/2') ? Number(J.slice(0, -2)) : 2 * Number(J);
		return sum + (twoJ + 1) * n;
	}, 0);
	expect(states).toBe(926640);
});

test.describe('labels: parentage and jK', () => {
	test('GET /api/v1/terms?config=3d6 4s gives each term its parentage and a display label', async ({ request }) => {
		// Fe II a⁶D 3d⁶(⁵D)4s (NIST ASD, from memory); 24 term occurrences (d⁶ terms × s, Condon & Shortley 1935).
		const body = await (await request.get('/api/v1/terms?config=' + encodeURIComponent('3d6 4s'))).json();
		const sextet = body.terms.find((t: { label: string }) => t.label === '6D');
		expect(sextet.display).toBe('⁶D');
		expect(sextet.parentage[0]).toEqual({
			parents: [
				{ subshell: '3d6', S: '2', L: 2, seniority: 4 },
				{ subshell: '4s', S: '1/2', L: 0, seniority: 1 }
			],
			intermediates: [
				{ S: '2', L: 2 },
				{ S: '5/2', L: 2 }
			],
			label: '3d⁶(⁵D)4s ⁶D',
			parent: '3d⁶(⁵D)4s'
		});
		expect(body.parentageStatus).toMatchObject({ listed: true, occurrences: 24 });
		expect(body.hund.phrase).toBe("lowest level by Hund's rules (heuristic)");
	});

	test('GET /api/v1/jk?config=2p5 3p lists ten levels starting on the ²P°₃/₂ core', async ({ request }) => {
		// Cowan (1981) sec. 4.12, 2p⁵3p in pair coupling (from memory).
		const res = await request.get('/api/v1/jk?config=' + encodeURIComponent('2p5 3p'));
		expect(res.status()).toBe(200);
		const body = await res.json();
		expect(body.levels).toHaveLength(10);
		expect(body.levels).toContainEqual({
			core: { S: '1/2', L: 1, J: '3/2', occurrence: 1, parentage: '2p⁵ ²P°' },
			K: '5/2',
			J: '3',
			label: '2p⁵(²P°₃/₂)3p ²[5/2]₃'
		});
	});

	test('GET /api/v1/jk answers 400 with the reason where jK does not apply', async ({ request }) => {
		const res = await request.get('/api/v1/jk?config=2p2');
		expect(res.status()).toBe(400);
		expect((await res.json()).error.message).toMatch(/jK coupling needs one outer electron/);
	});
});

test('in the built app, large computations run in a worker thread and small ones inline', async ({ request }) => {
	// The bridge of 4f7 5d 6p lists every level on each side (tens of thousands; a second of work): worker pool.
	const heavy = await request.get('/api/v1/bridge?config=' + encodeURIComponent('4f7 5d 6p'));
	expect(heavy.status()).toBe(200);
	expect(heavy.headers()['x-termwright-compute']).toBe('worker');
	const body = await heavy.json();
	expect(body.links.length).toBeGreaterThan(10000);
	expect(body.links.length).toBe(body.ls.length); // every LS level is joined to one jj level of its J
	expect(body.jj.length).toBe(body.ls.length);
	const light = await request.get('/api/v1/terms?config=2p2');
	expect(light.headers()['x-termwright-compute']).toBe('inline');
});
