import type { PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { loadCircuits } from '$lib/server/content/circuits';

// Authors, reviewers and instructors check how each circuit file draws, in every state.
export const load: PageServerLoad = async (event) => {
	requireRole(event, 'author', 'reviewer', 'instructor', 'site_admin');
	return { circuits: await loadCircuits() };
};
