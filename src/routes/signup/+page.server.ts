import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { signupSchema } from './schema';
import { invalid, parseForm } from '$lib/server/forms';
import { PASSWORD_RULE } from '$lib/server/auth/password';
import { createSession, invalidateSession, setSessionCookie } from '$lib/server/auth/session';
import { createAccount, EmailTakenError } from '$lib/server/users/accounts';

export const load: PageServerLoad = () => ({ passwordRule: PASSWORD_RULE });

export const actions: Actions = {
	default: async (event) => {
		const form = await event.request.formData();
		const parsed = parseForm(signupSchema, form);
		if (!parsed.ok) {
			return invalid(form, parsed.errors, 'Your account was not created yet. Please fix the fields marked below.');
		}
		const { name, email, password, timeZone } = parsed.data;

		let account;
		try {
			// New accounts are learners; other roles are granted by a site admin.
			account = await createAccount({ name, email, password, timeZone, roles: ['learner'] });
		} catch (err) {
			if (err instanceof EmailTakenError) {
				return invalid(form, {
					email: 'An account with this e-mail already exists. Sign in instead, or use another address.'
				});
			}
			throw err;
		}
		// A new session for every sign-in; the one this browser held before (if any) ends.
		if (event.locals.sessionId) await invalidateSession(event.locals.sessionId);
		const session = await createSession(account.id);
		setSessionCookie(event, session.id);
		redirect(303, '/home');
	}
};

