import type { PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';

// The quiz itself fetches its items from /api/learn/next and posts answers to /api/learn/answer.
export const load: PageServerLoad = async (event) => {
	requireRole(event, 'learner');
	return {};
};
