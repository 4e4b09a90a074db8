import type { RequestHandler } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { judgeGuess } from '$lib/server/learning/bench';
import { jsonReply, readBody } from '$lib/server/learning/http';
import { guessSchema } from './schema';

/**
 * Names the fault of a challenge: right or wrong, the hidden fault revealed, and the readings the server
 * recorded for the caller against the engine's. The first fault named is final.
 */
export const POST: RequestHandler = async (event) => {
	const user = requireRole(event, 'learner', 'instructor', 'author');
	return jsonReply(async () => {
		const { challengeId, fault } = await readBody(event, guessSchema);
		return judgeGuess(getDb(), user.id, { challengeId, fault });
	});
};
