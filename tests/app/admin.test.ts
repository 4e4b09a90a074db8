import { describe, expect, it } from 'vitest';
import { request, signIn } from '../helpers/app';

describe('people and roles, over HTTP', () => {
	it('does not let a site admin remove their own site admin role', async () => {
		const cookie = await signIn('siteadmin@harrowcreek.example');
		const me = JSON.parse((await request('/api/me', { cookie })).body) as { id: string; roles: string[] };
		const reply = await request('/admin/users?/revoke', { cookie, form: { userId: me.id, role: 'site_admin' } });
		expect(reply.status).toBe(400);
		expect(reply.body).toContain('You cannot remove your own site admin role');
		const after = JSON.parse((await request('/api/me', { cookie })).body) as { roles: string[] };
		expect(after.roles).toContain('site_admin');
	});

	it('names the problem when a form is malformed', async () => {
		const cookie = await signIn('siteadmin@harrowcreek.example');
		const reply = await request('/admin/users?/grant', { cookie, form: { userId: 'x', role: 'wizard' } });
		expect(reply.status).toBe(400);
		expect(reply.body).toContain('Choose one of the roles: learner, instructor, author, reviewer, school_admin, site_admin.');
	});

	it('pages and searches the list', async () => {
		const cookie = await signIn('siteadmin@harrowcreek.example');
		const found = await request('/admin/users?q=harrowcreek.example&page=1', { cookie });
		expect(found.status).toBe(200);
		expect(found.body).toContain('learner@harrowcreek.example');
		const none = await request('/admin/users?q=no-such-person-anywhere', { cookie });
		expect(none.body).toContain('Nobody matches that search.');
		const silly = await request('/admin/users?page=-4', { cookie });
		expect(silly.status).toBe(200);
	});
});
