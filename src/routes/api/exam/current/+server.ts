import type { RequestHandler } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { examState } from '$lib/server/learning/exam';
import { jsonReply } from '$lib/server/learning/http';

/** The running mock exam's current item and time left (or that none is running). */
export const GET: RequestHandler = async (event) => {
	const user = requireRole(event, 'learner');
	return jsonReply(() => examState(getDb(), user));
};
