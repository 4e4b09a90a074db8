import { eq } from 'drizzle-orm';
import type { PageServerLoad } from './$types';
import { requireUser } from '$lib/server/auth/guards';
import { ROLE_LABELS } from '$lib/server/auth/roles';
import { getDb } from '$lib/server/db/client';
import { school } from '$lib/server/db/schema';

export const load: PageServerLoad = async (event) => {
	const user = requireUser(event);
	const [row] = user.schoolId
		? await getDb().select({ name: school.name }).from(school).where(eq(school.id, user.schoolId))
		: [];
	return {
		name: user.name,
		timeZone: user.timeZone,
		school: row?.name ?? null,
		roles: user.roles.map((r) => ({ role: r, label: ROLE_LABELS[r] })),
		isSiteAdmin: user.roles.includes('site_admin')
	};
};
