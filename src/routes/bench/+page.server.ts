import type { PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { benchList } from '$lib/server/learning/bench';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'learner', 'instructor', 'author');
	return { circuits: await benchList(getDb()) };
};
