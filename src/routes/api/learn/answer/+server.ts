import type { RequestHandler } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { jsonReply, readBody } from '$lib/server/learning/http';
import { answerInSet, answerPractice } from '$lib/server/learning/sets';
import { answerSchema } from './schema';

/** Grades an answer on the server and records it once per idempotency key. */
export const POST: RequestHandler = async (event) => {
	const user = requireRole(event, 'learner');
	return jsonReply(async () => {
		const { setId, ...rest } = await readBody(event, answerSchema);
		return setId === undefined ? answerPractice(getDb(), user, rest) : answerInSet(getDb(), user, { setId, ...rest });
	});
};
