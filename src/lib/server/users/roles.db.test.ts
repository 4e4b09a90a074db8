import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '../db/client';
import { uniqueEmail } from '../../../../tests/helpers/db';
import { createAccount } from './accounts';
import { grantRole, OwnSiteAdminError, revokeRole, rolesOf, rolesOfMany } from './roles';

afterAll(closeDb);

const person = (label: string, roles: Parameters<typeof createAccount>[0]['roles']) =>
	createAccount({ email: uniqueEmail(label), name: label, password: 'fusible link check', timeZone: 'UTC', roles });

describe('roles (MariaDB)', () => {
	it('lets one person hold several roles, and granting twice changes nothing', async () => {
		const p = await person('several', ['learner']);
		await grantRole(p.id, 'reviewer');
		await grantRole(p.id, 'reviewer');
		await grantRole(p.id, 'instructor');
		expect(await rolesOf(p.id)).toEqual(['learner', 'instructor', 'reviewer']);
	});

	it('removes a role', async () => {
		const p = await person('removed', ['learner', 'author']);
		await revokeRole('someone-else', p.id, 'author');
		expect(await rolesOf(p.id)).toEqual(['learner']);
	});

	it('does not let a site admin remove their own site admin role', async () => {
		const admin = await person('admin', ['site_admin']);
		await expect(revokeRole(admin.id, admin.id, 'site_admin')).rejects.toBeInstanceOf(OwnSiteAdminError);
		expect(await rolesOf(admin.id)).toEqual(['site_admin']);
		const other = await person('other-admin', ['site_admin']);
		await revokeRole(other.id, admin.id, 'site_admin');
		expect(await rolesOf(admin.id)).toEqual([]);
	});

	it('reads the roles of many people in one go', async () => {
		const a = await person('many-a', ['learner']);
		const b = await person('many-b', []);
		const map = await rolesOfMany([a.id, b.id]);
		expect(map.get(a.id)).toEqual(['learner']);
		expect(map.get(b.id)).toEqual([]);
	});
});
