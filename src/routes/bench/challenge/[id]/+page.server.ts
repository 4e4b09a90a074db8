import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { challengeView } from '$lib/server/learning/bench';

// The hidden fault never leaves the server: the page gets the circuit, the complaint, the list to choose from
// and the viewer's own attempt so far.
export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'learner', 'instructor', 'author');
	const view = await challengeView(getDb(), event.params.id, user.id);
	if (!view) redirect(303, '/bench');
	return { view };
};
