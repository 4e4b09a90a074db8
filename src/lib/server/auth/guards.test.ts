import { describe, expect, it } from 'vitest';
import { isHttpError, isRedirect } from '@sveltejs/kit';
import { requireRole, requireUser, safeNext } from './guards';
import type { Role } from './roles';

function eventFor(roles: Role[] | null, href = 'http://127.0.0.1/admin/users?q=ada') {
	const user = roles
		? { id: 'u1', email: 'a@harrowcreek.example', name: 'A', timeZone: 'UTC', schoolId: null, emailVerifiedAt: null, roles }
		: null;
	return { locals: { user, sessionId: roles ? 's1' : null }, url: new URL(href) };
}

function thrown(fn: () => unknown): unknown {
	try {
		fn();
	} catch (e) {
		return e;
	}
	throw new Error('expected a throw');
}

// Rules of the trade (common practice): anonymous visitors are sent to sign in and brought back;
// signed-in people without the role get 403 Forbidden (RFC 9110 §15.5.4), not a redirect.
describe('guards', () => {
	it('sends an anonymous visitor to sign in, coming back to the page', () => {
		const e = thrown(() => requireUser(eventFor(null)));
		expect(isRedirect(e) && e.status).toBe(303);
		expect(isRedirect(e) && e.location).toBe('/signin?next=%2Fadmin%2Fusers%3Fq%3Dada');
	});

	it('drops the form action from the return address', () => {
		const e = thrown(() => requireUser(eventFor(null, 'http://127.0.0.1/admin/users?/grant')));
		expect(isRedirect(e) && e.location).toBe('/signin?next=%2Fadmin%2Fusers');
	});

	it('refuses a signed-in person without the role with 403', () => {
		const e = thrown(() => requireRole(eventFor(['learner', 'author']), 'site_admin'));
		expect(isHttpError(e) && e.status).toBe(403);
		expect(isHttpError(e) && e.body.message).toMatch(/Site admin/);
	});

	it('lets in anyone holding one of the roles', () => {
		expect(requireRole(eventFor(['learner', 'reviewer']), 'author', 'reviewer').id).toBe('u1');
		expect(requireUser(eventFor(['learner'])).roles).toEqual(['learner']);
	});

	it.each([
		['/home', '/home'],
		['/admin/users?q=x', '/admin/users?q=x'],
		['//evil.example/home', '/home'],
		['https://evil.example/', '/home'],
		['/\\evil.example', '/home'],
		[undefined, '/home']
	])('safeNext(%j) is %j (open-redirect rule, OWASP Unvalidated Redirects cheat sheet)', (next, expected) => {
		expect(safeNext(next)).toBe(expected);
	});
});
