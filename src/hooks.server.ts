import type { Handle, HandleServerError } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { building } from '$app/environment';
import { closeDb } from '$lib/server/db/client';
import { SESSION_COOKIE, clearSessionCookie, setSessionCookie, validateSession } from '$lib/server/auth/session';
import { rolesOf } from '$lib/server/users/roles';

if (!building) {
	process.on('sveltekit:shutdown', () => {
		void closeDb();
	});
}

const handleSession: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.sessionId = null;
	const sessionId = event.cookies.get(SESSION_COOKIE);
	if (!sessionId) return resolve(event);

	const { session, user } = await validateSession(sessionId);
	if (!session || !user) {
		clearSessionCookie(event);
		return resolve(event);
	}
	// lucia extends a session used in the second half of its life; the browser then needs the new expiry.
	if (session.fresh) setSessionCookie(event, session.id);
	event.locals.sessionId = session.id;
	event.locals.user = { ...user, roles: await rolesOf(user.id) };
	return resolve(event);
};

const handleSecurityHeaders: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	response.headers.set('x-content-type-options', 'nosniff');
	response.headers.set('referrer-policy', 'same-origin');
	response.headers.set('x-frame-options', 'DENY');
	return response;
};

export const handle = sequence(handleSession, handleSecurityHeaders);

export const handleError: HandleServerError = ({ error, event, status, message }) => {
	if (status === 404) return { message: 'There is no page at this address.' };
	const id = crypto.randomUUID().slice(0, 8);
	console.error(`[error ${id}] ${event.request.method} ${event.url.pathname}:`, error);
	return {
		message: status >= 500 ? 'Something went wrong on our side. Please try again in a moment.' : message,
		id
	};
};
