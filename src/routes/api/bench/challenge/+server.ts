import type { RequestHandler } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { createChallenge } from '$lib/server/learning/bench';
import { jsonReply, readBody } from '$lib/server/learning/http';
import { challengeSchema } from './schema';

/** Hides a fault on a bench circuit: a chosen one (authors, instructors) or a random one; returns the challenge id. */
export const POST: RequestHandler = async (event) => {
	const user = requireRole(event, 'learner', 'instructor', 'author');
	return jsonReply(async () => {
		const body = await readBody(event, challengeSchema);
		return { id: await createChallenge(getDb(), user, body.circuit, body.fault ?? null) };
	});
};
