import type { PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { reviewQueue } from '$lib/server/content/review';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'reviewer');
	return reviewQueue();
};
