import type { RequestHandler } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { answerExam } from '$lib/server/learning/exam';
import { jsonReply, readBody } from '$lib/server/learning/http';
import { examAnswerSchema } from './schema';

/** Records a mock exam answer (graded on the server, no feedback until the end; refused after the end time). */
export const POST: RequestHandler = async (event) => {
	const user = requireRole(event, 'learner');
	return jsonReply(async () => answerExam(getDb(), user, await readBody(event, examAnswerSchema)));
};
