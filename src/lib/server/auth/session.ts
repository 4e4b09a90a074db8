import { DrizzleMySQLAdapter } from '@lucia-auth/adapter-drizzle';
import type { Cookies } from '@sveltejs/kit';
import { Lucia, TimeSpan, generateIdFromEntropySize, type Cookie, type Session, type User } from 'lucia';
import { getDb } from '../db/client';
import { session as sessionTable, user as userTable } from '../db/schema';

// lucia stays behind this file and guards.ts: the rest of the app sees plain functions.

/** Sessions last 30 days and are extended by lucia when used in their second half. */
export const SESSION_DAYS = 30;
export const SESSION_COOKIE = 'splicepoint_session';

function createLucia() {
	return new Lucia(new DrizzleMySQLAdapter(getDb(), sessionTable, userTable), {
		sessionExpiresIn: new TimeSpan(SESSION_DAYS, 'd'),
		sessionCookie: { name: SESSION_COOKIE, expires: true, attributes: { sameSite: 'lax' } },
		getUserAttributes: (row) => ({
			email: row.email,
			name: row.name,
			timeZone: row.timeZone,
			schoolId: row.schoolId,
			emailVerifiedAt: row.emailVerifiedAt
		})
	});
}

declare module 'lucia' {
	interface Register {
		Lucia: ReturnType<typeof createLucia>;
		DatabaseUserAttributes: {
			email: string;
			name: string;
			timeZone: string;
			schoolId: number | null;
			emailVerifiedAt: Date | null;
		};
	}
}

let lucia: ReturnType<typeof createLucia> | undefined;
function getLucia() {
	lucia ??= createLucia();
	return lucia;
}

export type { Session, User };

export function newUserId(): string {
	return generateIdFromEntropySize(10);
}

export function createSession(userId: string): Promise<Session> {
	return getLucia().createSession(userId, {});
}

/** The session and its user, or nulls when the id is unknown or expired. `session.fresh` = cookie must be re-sent. */
export function validateSession(sessionId: string) {
	return getLucia().validateSession(sessionId);
}

export function invalidateSession(sessionId: string): Promise<void> {
	return getLucia().invalidateSession(sessionId);
}

export function invalidateUserSessions(userId: string): Promise<void> {
	return getLucia().invalidateUserSessions(userId);
}

type CookieTarget = { cookies: Cookies; url: URL };

// Secure only when the request came over https (adapter-node derives the protocol from ORIGIN or PROTOCOL_HEADER),
// so that plain-http local serving keeps working while every https deployment gets Secure cookies.
function write(event: CookieTarget, cookie: Cookie) {
	event.cookies.set(cookie.name, cookie.value, {
		...cookie.attributes,
		path: '/',
		httpOnly: true,
		sameSite: 'lax',
		secure: event.url.protocol === 'https:'
	});
}

export function setSessionCookie(event: CookieTarget, sessionId: string): void {
	write(event, getLucia().createSessionCookie(sessionId));
}

export function clearSessionCookie(event: CookieTarget): void {
	write(event, getLucia().createBlankSessionCookie());
}
