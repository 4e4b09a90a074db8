import { describe, expect, it } from 'vitest';
import { actionNames, discoverRoutes, exportedMethods } from '../helpers/routes';

// The route discovery that tests/app/authz.test.ts relies on, checked against SvelteKit's documented file
// conventions (kit.svelte.dev docs, "Routing" and "Form actions").
describe('route discovery', () => {
	it.each([
		['export const actions = { default: async (event) => {} };', ['default']],
		['export const actions: Actions = {\n\tgrant: (e) => change(e, "grant"),\n\trevoke: (e) => change(e, { a: 1 })\n};', ['grant', 'revoke']],
		['export const actions = { async login(event) { const x = { nested: 1 }; }, register };', ['login', 'register']],
		["export const actions = {\n\t// a comment: not an action\n\t'sign-out': async () => {}\n};", ['sign-out']],
		['export const load = () => ({ actions: { fake: 1 } });', []]
	])('finds the named actions in %j', (source, expected) => {
		expect(actionNames(source)).toEqual(expected);
	});

	it('finds exported request handlers', () => {
		const source = 'export const GET = () => {};\nexport async function POST() {}\nconst PUT = 1;\nexport { PUT as DELETE };\nexport const helper = 1;';
		expect(exportedMethods(source).sort()).toEqual(['DELETE', 'GET', 'POST']);
	});

	it('finds the routes of this app, including the landing page', () => {
		const found = discoverRoutes().map((r) => `${r.kind} ${r.route}`);
		expect(found).toContain('page /');
		expect(found).toContain('action /admin/users');
		expect(found).toContain('endpoint /api/health');
	});
});
