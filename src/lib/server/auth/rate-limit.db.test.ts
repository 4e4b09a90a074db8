import { afterAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { closeDb } from '../db/client';
import { uniqueEmail } from '../../../../tests/helpers/db';
import { THROTTLE, checkSignIn, clearAccountFailures, recordSignInFailure, retryMessage } from './rate-limit';

afterAll(closeDb);

const MINUTE = 60_000;
const address = () => `10.${randomBytes(3).join('.')}`;

// Throttling failed sign-ins per account and per client address is common practice
// (OWASP Authentication Cheat Sheet, "Account lockout"); the limits are ours.
describe('sign-in throttling (MariaDB)', () => {
	it('locks an account after its limit of failures, for the lock period', async () => {
		const email = uniqueEmail('locked');
		const now = new Date('2026-03-02T14:00:00Z');
		for (let i = 0; i < THROTTLE.account.maxFailures - 1; i++) {
			await recordSignInFailure(email, address(), now);
			expect((await checkSignIn(email, address(), now)).allowed).toBe(true);
		}
		await recordSignInFailure(email, address(), now);
		const check = await checkSignIn(email.toUpperCase(), address(), now);
		expect(check).toEqual({ allowed: false, retryAt: new Date(now.getTime() + THROTTLE.account.lockMinutes * MINUTE) });
		const later = new Date(now.getTime() + THROTTLE.account.lockMinutes * MINUTE + 1000);
		expect((await checkSignIn(email, address(), later)).allowed).toBe(true);
	});

	it('locks a client address that fails across many accounts', async () => {
		const client = address();
		const now = new Date('2026-03-02T15:00:00Z');
		for (let i = 0; i < THROTTLE.client.maxFailures; i++) await recordSignInFailure(uniqueEmail('spray'), client, now);
		const check = await checkSignIn(uniqueEmail('fresh'), client, now);
		expect(check.allowed).toBe(false);
		expect((await checkSignIn(uniqueEmail('fresh'), address(), now)).allowed).toBe(true);
	});

	it('starts counting again once the window has passed', async () => {
		const email = uniqueEmail('slow');
		const start = new Date('2026-03-02T16:00:00Z');
		for (let i = 0; i < THROTTLE.account.maxFailures - 1; i++) await recordSignInFailure(email, address(), start);
		const after = new Date(start.getTime() + (THROTTLE.account.windowMinutes + 1) * MINUTE);
		await recordSignInFailure(email, address(), after);
		expect((await checkSignIn(email, address(), after)).allowed).toBe(true);
	});

	it('forgets an account’s failures after a successful sign-in', async () => {
		const email = uniqueEmail('cleared');
		const now = new Date('2026-03-02T17:00:00Z');
		for (let i = 0; i < THROTTLE.account.maxFailures - 1; i++) await recordSignInFailure(email, address(), now);
		await clearAccountFailures(email);
		await recordSignInFailure(email, address(), now);
		expect((await checkSignIn(email, address(), now)).allowed).toBe(true);
	});

	it('says when to try again', () => {
		const now = new Date('2026-03-02T14:00:00Z');
		expect(retryMessage(new Date('2026-03-02T14:15:00Z'), now)).toBe(
			'Too many failed sign-ins. Try again after 14:15 UTC (in 15 minutes).'
		);
		expect(retryMessage(new Date('2026-03-02T14:00:20Z'), now)).toMatch(/in 1 minute\)/);
	});
});
