import type { PageServerLoad } from './$types';
import { requireUser } from '$lib/server/auth/guards';
import { ROLE_LABELS } from '$lib/server/auth/roles';
import { schoolName } from '$lib/server/schools/schools';

export const load: PageServerLoad = async (event) => {
	const user = requireUser(event);
	return {
		name: user.name,
		timeZone: user.timeZone,
		school: await schoolName(user.schoolId),
		roles: user.roles.map((r) => ({ role: r, label: ROLE_LABELS[r] })),
		isSiteAdmin: user.roles.includes('site_admin')
	};
};
