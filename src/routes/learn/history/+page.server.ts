import type { PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { answerHistory } from '$lib/server/learning/history';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'learner');
	return { rows: await answerHistory(getDb(), user.id), timeZone: user.timeZone };
};
