import type { RequestHandler } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { jsonReply } from '$lib/server/learning/http';
import { nextItem, practiceItem } from '$lib/server/learning/sets';

/** The next item of the learner's placement or daily set (the set is composed on the first call of the day), or with ?skill=ID a practice item of that skill. */
export const GET: RequestHandler = async (event) => {
	const user = requireRole(event, 'learner');
	const skill = event.url.searchParams.get('skill');
	return jsonReply(() => (skill ? practiceItem(getDb(), user, skill) : nextItem(getDb(), user)));
};
