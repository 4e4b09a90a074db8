import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { clearSessionCookie, invalidateSession } from '$lib/server/auth/session';

export const load: PageServerLoad = ({ locals }) => ({ signedIn: Boolean(locals.user) });

export const actions: Actions = {
	default: async (event) => {
		if (event.locals.sessionId) await invalidateSession(event.locals.sessionId);
		clearSessionCookie(event);
		redirect(303, '/');
	}
};
