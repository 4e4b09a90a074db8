import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { benchCircuit, noticeableFaults } from '$lib/server/learning/bench';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'learner', 'instructor', 'author');
	const c = await benchCircuit(getDb(), event.params.circuit);
	// An unknown circuit: back to the list, which shows what there is.
	if (!c) redirect(303, '/bench');
	const canChoose = user.roles.some((r) => r === 'author' || r === 'instructor');
	return { ref: c.ref, title: c.title, circuitText: c.text, cautions: c.cautions, canChoose, faults: canChoose ? noticeableFaults(c.engine) : [], hasStates: c.engine.states.length > 0 };
};
