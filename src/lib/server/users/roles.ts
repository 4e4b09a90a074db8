import { and, eq, inArray } from 'drizzle-orm';
import { getDb } from '../db/client';
import { userRole } from '../db/schema';
import { ROLES, type Role } from '../auth/roles';

export class OwnSiteAdminError extends Error {
	constructor() {
		super('You cannot remove your own site admin role. Ask another site admin to do it.');
	}
}

const byRoleOrder = (a: Role, b: Role) => ROLES.indexOf(a) - ROLES.indexOf(b);

export async function rolesOf(userId: string): Promise<Role[]> {
	const rows = await getDb().select({ role: userRole.role }).from(userRole).where(eq(userRole.userId, userId));
	return rows.map((r) => r.role).sort(byRoleOrder);
}

/** Roles of many people at once, for lists. */
export async function rolesOfMany(userIds: string[]): Promise<Map<string, Role[]>> {
	const result = new Map<string, Role[]>(userIds.map((id) => [id, []]));
	if (userIds.length === 0) return result;
	const rows = await getDb()
		.select({ userId: userRole.userId, role: userRole.role })
		.from(userRole)
		.where(inArray(userRole.userId, userIds));
	for (const row of rows) result.get(row.userId)?.push(row.role);
	for (const roles of result.values()) roles.sort(byRoleOrder);
	return result;
}

/** Idempotent: granting a role someone holds already changes nothing. */
export async function grantRole(userId: string, role: Role): Promise<void> {
	await getDb()
		.insert(userRole)
		.values({ userId, role })
		.onDuplicateKeyUpdate({ set: { userId } });
}

/** Removes a role; a site admin may not remove their own site_admin role (someone must be left to manage). */
export async function revokeRole(actingUserId: string, userId: string, role: Role): Promise<void> {
	if (actingUserId === userId && role === 'site_admin') throw new OwnSiteAdminError();
	await getDb()
		.delete(userRole)
		.where(and(eq(userRole.userId, userId), eq(userRole.role, role)));
}
