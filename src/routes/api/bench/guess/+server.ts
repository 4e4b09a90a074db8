import type { RequestHandler } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { judgeGuess } from '$lib/server/learning/bench';
import { jsonReply, readBody } from '$lib/server/learning/http';
import { guessSchema } from './schema';

/** Names the fault of a challenge: right or wrong, the hidden fault revealed, the readings against the engine's. */
export const POST: RequestHandler = async (event) => {
	requireRole(event, 'learner', 'instructor', 'author');
	return jsonReply(async () => judgeGuess(getDb(), await readBody(event, guessSchema)));
};
