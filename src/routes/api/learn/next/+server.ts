import type { RequestHandler } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { jsonReply } from '$lib/server/learning/http';
import { nextItem } from '$lib/server/learning/sets';

/** The next item of the learner's placement or daily set (the set is composed on the first call of the day). */
export const GET: RequestHandler = async (event) => {
	const user = requireRole(event, 'learner');
	return jsonReply(() => nextItem(getDb(), user));
};
