import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import { eq } from 'drizzle-orm';
import { closeDb, getDb } from '../db/client';
import { session as sessionTable } from '../db/schema';
import { uniqueEmail } from '../../../../tests/helpers/db';
import { createAccount } from '../users/accounts';
import type { Cookies } from '@sveltejs/kit';
import { SESSION_COOKIE, SESSION_DAYS, createSession, invalidateSession, setSessionCookie, validateSession } from './session';

afterAll(closeDb);
afterEach(() => vi.useRealTimers());

const DAY = 86_400_000;

async function newSession() {
	const account = await createAccount({
		email: uniqueEmail('session'),
		name: 'Session Person',
		password: 'starter relay terminal 30',
		timeZone: 'UTC',
		roles: ['learner']
	});
	return { account, session: await createSession(account.id) };
}

// Session lifetime rules from the lucia 3 documentation ("Sessions"): a session expires after sessionExpiresIn,
// and one validated in the second half of its life is extended to a full period and marked fresh.
describe('sessions (MariaDB, lucia)', () => {
	it('finds the user of a valid session', async () => {
		const { account, session } = await newSession();
		const result = await validateSession(session.id);
		expect(result.user?.id).toBe(account.id);
		expect(result.user?.email).toBe(account.email);
		expect(result.session?.fresh).toBe(false);
	});

	it('extends a session used in the second half of its life', async () => {
		const { session } = await newSession();
		vi.useFakeTimers({ toFake: ['Date'] });
		vi.setSystemTime(Date.now() + (SESSION_DAYS / 2 + 1) * DAY);
		const result = await validateSession(session.id);
		expect(result.session?.fresh).toBe(true);
		const [row] = await getDb().select().from(sessionTable).where(eq(sessionTable.id, session.id));
		expect(row!.expiresAt.getTime()).toBeGreaterThan(session.expiresAt.getTime() + (SESSION_DAYS / 2) * DAY - 5_000);
	});

	it('ends an expired session and deletes it', async () => {
		const { session } = await newSession();
		vi.useFakeTimers({ toFake: ['Date'] });
		vi.setSystemTime(Date.now() + (SESSION_DAYS + 1) * DAY);
		const result = await validateSession(session.id);
		expect(result.session).toBeNull();
		expect(await getDb().select().from(sessionTable).where(eq(sessionTable.id, session.id))).toEqual([]);
	});

	it('ends a session on sign-out', async () => {
		const { session } = await newSession();
		await invalidateSession(session.id);
		expect((await validateSession(session.id)).user).toBeNull();
	});

	// OWASP Session Management Cheat Sheet, "Cookies": Secure, HttpOnly and SameSite on the session cookie.
	it('writes the cookie httpOnly and SameSite=Lax for the whole site, Secure only over https', async () => {
		const { session } = await newSession();
		const calls: { name: string; value: string; options: Record<string, unknown> }[] = [];
		const cookies = { set: (name: string, value: string, options: Record<string, unknown>) => calls.push({ name, value, options }) };
		setSessionCookie({ cookies: cookies as unknown as Cookies, url: new URL('https://splicepoint.example/signin') }, session.id);
		setSessionCookie({ cookies: cookies as unknown as Cookies, url: new URL('http://127.0.0.1:3000/signin') }, session.id);
		expect(calls[0]).toMatchObject({
			name: SESSION_COOKIE,
			value: session.id,
			options: { httpOnly: true, sameSite: 'lax', secure: true, path: '/', maxAge: SESSION_DAYS * 86_400 }
		});
		expect(calls[1]?.options.secure).toBe(false);
	});
});
