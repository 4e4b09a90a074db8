import type { PageServerLoad } from './$types';
import { requireUser } from '$lib/server/auth/guards';
import { ROLE_LABELS } from '$lib/server/auth/roles';
import { getDb } from '$lib/server/db/client';
import { todayOf } from '$lib/server/learning/today';
import { schoolName } from '$lib/server/schools/schools';

export const load: PageServerLoad = async (event) => {
	const user = requireUser(event);
	const isLearner = user.roles.includes('learner');
	return {
		name: user.name,
		timeZone: user.timeZone,
		school: await schoolName(user.schoolId),
		roles: user.roles.map((r) => ({ role: r, label: ROLE_LABELS[r] })),
		isSiteAdmin: user.roles.includes('site_admin'),
		canBench: user.roles.some((r) => r === 'learner' || r === 'instructor' || r === 'author'),
		today: isLearner ? await todayOf(getDb(), user) : null
	};
};
