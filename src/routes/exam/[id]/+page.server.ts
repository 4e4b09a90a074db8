import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { examReport } from '$lib/server/learning/exam';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'learner');
	const id = Number(event.params.id);
	const found = Number.isSafeInteger(id) && id > 0 ? await examReport(getDb(), user.id, id) : null;
	// An unknown, unfinished or someone else's exam: back to the exam page, which shows what is there.
	if (!found) redirect(303, '/exam');
	return { id, ...found, startedAt: found.startedAt.toISOString(), timeZone: user.timeZone };
};
