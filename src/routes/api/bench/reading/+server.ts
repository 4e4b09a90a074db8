import type { RequestHandler } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { challengeReading } from '$lib/server/learning/bench';
import { jsonReply, readBody } from '$lib/server/learning/http';
import { readingSchema } from './schema';

/** One meter reading on a challenge, solved on the server with the hidden fault and recorded on the caller's attempt. */
export const POST: RequestHandler = async (event) => {
	const user = requireRole(event, 'learner', 'instructor', 'author');
	return jsonReply(async () => challengeReading(getDb(), user.id, await readBody(event, readingSchema)));
};
