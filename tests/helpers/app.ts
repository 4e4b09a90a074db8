// HTTP helpers for the tests against the running built app (see app-global-setup.ts).
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../src/lib/server/seed/demo';
import type { Role } from '../../src/lib/server/auth/roles';

export const APP_URL = `http://127.0.0.1:${process.env.TEST_APP_PORT}`;

export type Reply = { status: number; location: string | null; cookie: string | null; body: string };

/** One request as a browser without JavaScript would send it: no redirects followed, HTML preferred. */
export async function request(
	path: string,
	options: { method?: string; cookie?: string | null; form?: Record<string, string> } = {}
): Promise<Reply> {
	const headers: Record<string, string> = { accept: 'text/html' };
	if (options.cookie) headers.cookie = options.cookie;
	let body: string | undefined;
	if (options.form) {
		headers['content-type'] = 'application/x-www-form-urlencoded';
		headers.origin = APP_URL;
		body = new URLSearchParams(options.form).toString();
	}
	const res = await fetch(APP_URL + path, {
		method: options.method ?? (options.form ? 'POST' : 'GET'),
		headers,
		body,
		redirect: 'manual'
	});
	const setCookie = res.headers.getSetCookie().find((c) => c.startsWith('splicepoint_session='));
	return {
		status: res.status,
		location: res.headers.get('location'),
		cookie: setCookie ? setCookie.split(';')[0]! : null,
		body: await res.text()
	};
}

export function demoAccount(role: Role) {
	const account = DEMO_ACCOUNTS.find((a) => a.role === role);
	if (!account) throw new Error(`no demo account for ${role}`);
	return account;
}

/** Signs in over HTTP and returns the session cookie ("splicepoint_session=..."). */
export async function signIn(email: string, password = DEMO_PASSWORD): Promise<string> {
	const reply = await request('/signin', { form: { email, password, next: '/home' } });
	if (reply.status !== 303 || !reply.cookie) {
		throw new Error(`sign-in of ${email} answered ${reply.status} ${reply.location ?? ''}`);
	}
	return reply.cookie;
}
