import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { invalid, parseForm } from '$lib/server/forms';
import { LearnError } from '$lib/server/learning/errors';
import { activeExamId, finishExam, MOCK_DEFAULTS, pastExams, READINESS_METHOD, startExam } from '$lib/server/learning/exam';
import { startSchema } from './schema';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'learner');
	const db = getDb();
	const finished = Number(event.url.searchParams.get('finished')) || null;
	return { running: (await activeExamId(db, user.id)) !== null, finished, past: await pastExams(db, user.id), defaults: MOCK_DEFAULTS, method: READINESS_METHOD };
};

export const actions: Actions = {
	start: async (event) => {
		const user = requireRole(event, 'learner');
		const form = await event.request.formData();
		const parsed = parseForm(startSchema, form);
		if (!parsed.ok) return invalid(form, parsed.errors, 'The mock exam was not started. Please fix the fields marked below.');
		try {
			await startExam(getDb(), user, parsed.data);
		} catch (e) {
			if (e instanceof LearnError) return fail(e.status === 409 ? 409 : 400, { message: e.message, fields: {}, errors: {} });
			throw e;
		}
		redirect(303, '/exam');
	},
	finish: async (event) => {
		const user = requireRole(event, 'learner');
		const id = await activeExamId(getDb(), user.id);
		if (id !== null) await finishExam(getDb(), user.id, id);
		redirect(303, id !== null ? `/exam?finished=${id}` : '/exam');
	}
};
