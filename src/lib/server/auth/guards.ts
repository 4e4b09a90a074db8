import { error, redirect, type RequestEvent } from '@sveltejs/kit';
import { ROLE_LABELS, type Role } from './roles';

export type SignedInUser = NonNullable<App.Locals['user']>;

/** Where to come back to after signing in: the page itself, never the `?/action` of a form post. */
function returnPath(url: URL): string {
	const params = new URLSearchParams(url.search);
	for (const key of [...params.keys()]) if (key.startsWith('/')) params.delete(key);
	const query = params.toString();
	return url.pathname + (query ? `?${query}` : '');
}

/** The signed-in person, or a 303 to the sign-in page that comes back here afterwards. */
export function requireUser(event: Pick<RequestEvent, 'locals' | 'url'>): SignedInUser {
	const user = event.locals.user;
	if (!user) redirect(303, `/signin?next=${encodeURIComponent(returnPath(event.url))}`);
	return user;
}

/** The signed-in person holding at least one of `roles`; anonymous → 303 to sign-in, anyone else → 403. */
export function requireRole(event: Pick<RequestEvent, 'locals' | 'url'>, ...roles: Role[]): SignedInUser {
	const user = requireUser(event);
	if (!roles.some((role) => user.roles.includes(role))) {
		const names = roles.map((r) => ROLE_LABELS[r]).join(' or ');
		error(403, `This page is for the ${names} role. If you need it, ask a site admin.`);
	}
	return user;
}

/** A `next` value from a form or query that is safe to redirect to: a path on this site. */
export function safeNext(next: unknown, fallback = '/home'): string {
	if (typeof next !== 'string' || !next.startsWith('/') || next.startsWith('//') || next.includes('\\')) {
		return fallback;
	}
	return next;
}
