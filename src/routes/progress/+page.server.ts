import type { PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { progressOf } from '$lib/server/learning/progress';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'learner');
	return { progress: await progressOf(getDb(), user) };
};
