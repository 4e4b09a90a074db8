import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { challengeView } from '$lib/server/learning/bench';

// The hidden fault never leaves the server: the page gets the circuit, the complaint and the list to choose from.
export const load: PageServerLoad = async (event) => {
	requireRole(event, 'learner', 'instructor', 'author');
	const view = await challengeView(getDb(), event.params.id);
	if (!view) redirect(303, '/bench');
	return { view };
};
