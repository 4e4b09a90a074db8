import { and, eq, sql } from 'drizzle-orm';
import { getDb } from '../db/client';
import { signInThrottle } from '../db/schema';

// Failed sign-ins are counted per account and per client address in a fixed window (common practice).
// An account locks after fewer failures than an address, because one address may be a whole classroom.
export const THROTTLE = {
	account: { maxFailures: 5, windowMinutes: 15, lockMinutes: 15 },
	client: { maxFailures: 30, windowMinutes: 15, lockMinutes: 15 }
} as const;

type Scope = keyof typeof THROTTLE;

export type ThrottleCheck = { allowed: true } | { allowed: false; retryAt: Date };

const MINUTE = 60_000;

function subjects(email: string, clientAddress: string): [Scope, string][] {
	return [
		['account', email.trim().toLowerCase()],
		['client', clientAddress]
	];
}

/** Whether a sign-in may be attempted now; when not, the moment it may be tried again (the later of both locks). */
export async function checkSignIn(email: string, clientAddress: string, now = new Date()): Promise<ThrottleCheck> {
	let retryAt: Date | null = null;
	for (const [scope, subject] of subjects(email, clientAddress)) {
		const [row] = await getDb()
			.select({ lockedUntil: signInThrottle.lockedUntil })
			.from(signInThrottle)
			.where(and(eq(signInThrottle.scope, scope), eq(signInThrottle.subject, subject)));
		if (row?.lockedUntil && row.lockedUntil > now && (!retryAt || row.lockedUntil > retryAt)) {
			retryAt = row.lockedUntil;
		}
	}
	return retryAt ? { allowed: false, retryAt } : { allowed: true };
}

/** Counts one failed sign-in against the account and the address; locks either that reaches its limit. */
export async function recordSignInFailure(email: string, clientAddress: string, now = new Date()): Promise<void> {
	await getDb().transaction(async (tx) => {
		for (const [scope, subject] of subjects(email, clientAddress)) {
			const limits = THROTTLE[scope];
			const [row] = await tx
				.select()
				.from(signInThrottle)
				.where(and(eq(signInThrottle.scope, scope), eq(signInThrottle.subject, subject)))
				.for('update');
			const windowOpen = row && now.getTime() - row.windowStartedAt.getTime() < limits.windowMinutes * MINUTE;
			const failures = windowOpen ? row.failures + 1 : 1;
			const windowStartedAt = windowOpen ? row.windowStartedAt : now;
			const lockedUntil =
				failures >= limits.maxFailures ? new Date(now.getTime() + limits.lockMinutes * MINUTE) : null;
			await tx
				.insert(signInThrottle)
				.values({ scope, subject, failures, windowStartedAt, lockedUntil })
				.onDuplicateKeyUpdate({
					set: { failures, windowStartedAt, lockedUntil: lockedUntil ?? sql`NULL` }
				});
		}
	});
}

/** A successful sign-in clears the account's count; the address's count stays until its window ends. */
export async function clearAccountFailures(email: string): Promise<void> {
	await getDb()
		.delete(signInThrottle)
		.where(and(eq(signInThrottle.scope, 'account'), eq(signInThrottle.subject, email.trim().toLowerCase())));
}

/** "Try again after 14:05 UTC (in 12 minutes)." */
export function retryMessage(retryAt: Date, now = new Date()): string {
	const minutes = Math.max(1, Math.ceil((retryAt.getTime() - now.getTime()) / MINUTE));
	const clock = retryAt.toISOString().slice(11, 16);
	return `Too many failed sign-ins. Try again after ${clock} UTC (in ${minutes} minute${minutes === 1 ? '' : 's'}).`;
}
