import type { RequestHandler } from './$types';
import { airRefractiveIndex, airToVacuum, vacuumToAir, wavenumberOf } from '$lib/physics/airvac';
import { api, reply } from '$lib/server/http';
import { badRequest } from '$lib/server/errors';

function angstrom(name: string, text: string): number {
	const v = Number(text.trim());
	if (text.trim() === '' || !Number.isFinite(v) || v <= 0)
		throw badRequest(`${name} must be a positive number of ångström (e.g. ${name}=6562.8), got "${text.slice(0, 40)}"`);
	return v;
}

/** Standard-air ↔ vacuum wavelength (Morton 2000): `?vacuum=6564.61` → { air, … } or `?air=6562.80` → { vacuum, … }, in Å. */
export const GET: RequestHandler = api((event) => {
	const vac = event.url.searchParams.get('vacuum');
	const air = event.url.searchParams.get('air');
	if ((vac === null) === (air === null)) throw badRequest('give exactly one of vacuum=<Å> or air=<Å>');
	const vacuum = vac !== null ? angstrom('vacuum', vac) : airToVacuum(angstrom('air', air as string));
	const airValue = vac !== null ? vacuumToAir(vacuum) : angstrom('air', air as string);
	return reply('GET /api/v1/airvac', {
		vacuum,
		air: airValue,
		wavenumber: wavenumberOf(vacuum),
		refractiveIndex: airRefractiveIndex(vacuum),
		formula: 'Morton (2000, ApJS 130, 403): standard air, 15 °C, 1 atm; wavelengths below 2000 Å are given in vacuum'
	});
});
