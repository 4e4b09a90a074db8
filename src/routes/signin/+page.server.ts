import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { signinSchema } from './schema';
import { invalid, parseForm } from '$lib/server/forms';
import { safeNext } from '$lib/server/auth/guards';
import { verifyAgainstDummy, verifyPassword } from '$lib/server/auth/password';
import { checkSignIn, clearAccountFailures, recordSignInFailure, retryMessage } from '$lib/server/auth/rate-limit';
import { createSession, invalidateSession, setSessionCookie } from '$lib/server/auth/session';
import { findAccountByEmail } from '$lib/server/users/accounts';

export const load: PageServerLoad = ({ url, locals }) => ({
	next: safeNext(url.searchParams.get('next')),
	signedInAs: locals.user?.email ?? null
});

export const actions: Actions = {
	default: async (event) => {
		const form = await event.request.formData();
		const parsed = parseForm(signinSchema, form);
		if (!parsed.ok) return invalid(form, parsed.errors, 'Please fix the fields marked below.');
		const { email, password, next } = parsed.data;
		const client = event.getClientAddress();

		const before = await checkSignIn(email, client);
		if (!before.allowed) {
			return invalid(form, {}, retryMessage(before.retryAt), 429);
		}

		const account = await findAccountByEmail(email);
		const matches = account ? await verifyPassword(account.passwordHash, password) : (await verifyAgainstDummy(password), false);
		if (!account || !matches) {
			await recordSignInFailure(email, client);
			const after = await checkSignIn(email, client);
			const message = after.allowed
				? 'That e-mail and password do not match an account. Check both and try again.'
				: retryMessage(after.retryAt);
			return invalid(form, {}, message, after.allowed ? 400 : 429);
		}

		await clearAccountFailures(email);
		// Hook for e-mail verification (later): refuse or warn here while account.emailVerifiedAt is null.
		// A new session for every sign-in; the one this browser held before (if any) ends.
		if (event.locals.sessionId) await invalidateSession(event.locals.sessionId);
		const session = await createSession(account.id);
		setSessionCookie(event, session.id);
		redirect(303, safeNext(next));
	}
};
