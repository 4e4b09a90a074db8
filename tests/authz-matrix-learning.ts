// Authorization matrix entries for the learner's day: placement, daily set, mock exam, progress, bench. Part of tests/authz-matrix.ts; same rules.
import type { MatrixEntry, Outcome } from './authz-matrix';

// A JSON POST without a body gets past the guard and is refused by the zod schema: 400 with
// { error: { code, message, fields } }. Outcome only names 200 so far, hence the cast (the test compares the number).
const BAD_BODY: Outcome = { status: 400 };

export const LEARNING_ROUTES: MatrixEntry[] = [
	{ kind: 'page', route: '/learn', allow: ['learner'] },
	{ kind: 'page', route: '/learn/settings', allow: ['learner'] },
	{
		kind: 'action',
		route: '/learn/settings',
		action: 'default',
		allow: ['learner'],
		form: () => ({ examDate: '', dailyItems: '15', dailyMinutes: '10' }),
		outcome: { redirect: '/learn/settings' }
	},
	{ kind: 'page', route: '/learn/history', allow: ['learner'] },
	{ kind: 'page', route: '/progress', allow: ['learner'] },
	{ kind: 'page', route: '/exam', allow: ['learner'] },
	{ kind: 'action', route: '/exam', action: 'start', allow: ['learner'], form: () => ({ count: '3', minutes: '3' }), outcome: { redirect: '/exam' } },
	{ kind: 'action', route: '/exam', action: 'finish', allow: ['learner'], form: () => ({}), outcome: { redirect: '/exam' } },
	// An exam that does not exist (or is someone else's) sends the learner back to the exam page.
	{ kind: 'page', route: '/exam/[id]', path: '/exam/0', allow: ['learner'], outcome: { redirect: '/exam' } },
	{ kind: 'endpoint', route: '/api/learn/next', method: 'GET', allow: ['learner'] },
	{ kind: 'endpoint', route: '/api/learn/answer', method: 'POST', allow: ['learner'], outcome: BAD_BODY },
	{ kind: 'endpoint', route: '/api/exam/current', method: 'GET', allow: ['learner'] },
	{ kind: 'endpoint', route: '/api/exam/answer', method: 'POST', allow: ['learner'], outcome: BAD_BODY },
	{ kind: 'page', route: '/bench', allow: ['learner', 'instructor', 'author'] },
	{ kind: 'page', route: '/bench/[circuit]', path: '/bench/horn-relay', allow: ['learner', 'instructor', 'author'] },
	// A challenge that does not exist sends the visitor back to the bench list.
	{ kind: 'page', route: '/bench/challenge/[id]', path: '/bench/challenge/none', allow: ['learner', 'instructor', 'author'], outcome: { redirect: '/bench' } },
	{ kind: 'endpoint', route: '/api/bench/challenge', method: 'POST', allow: ['learner', 'instructor', 'author'], outcome: BAD_BODY },
	{ kind: 'endpoint', route: '/api/bench/reading', method: 'POST', allow: ['learner', 'instructor', 'author'], outcome: BAD_BODY },
	{ kind: 'endpoint', route: '/api/bench/guess', method: 'POST', allow: ['learner', 'instructor', 'author'], outcome: BAD_BODY }
];
