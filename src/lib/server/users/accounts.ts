import { eq } from 'drizzle-orm';
import { getDb } from '../db/client';
import { user, userRole, type User } from '../db/schema';
import { hashPassword } from '../auth/password';
import { newUserId } from '../auth/session';
import type { Role } from '../auth/roles';

export class EmailTakenError extends Error {
	constructor(public email: string) {
		super(`An account with the e-mail ${email} already exists.`);
	}
}

export type NewAccount = {
	email: string;
	name: string;
	password: string;
	timeZone: string;
	schoolId?: number | null;
	roles: Role[];
};

function isDuplicateKey(err: unknown): boolean {
	for (let e: unknown = err; e && typeof e === 'object'; e = (e as { cause?: unknown }).cause) {
		if ((e as { code?: unknown }).code === 'ER_DUP_ENTRY') return true;
	}
	return false;
}

/**
 * Creates an account with its roles in one transaction. E-mails are stored lower-case.
 * Hook for e-mail verification (later): send the verification message after this returns;
 * `emailVerifiedAt` stays null until the link is followed.
 */
export async function createAccount(input: NewAccount): Promise<User> {
	const email = input.email.trim().toLowerCase();
	const passwordHash = await hashPassword(input.password);
	const id = newUserId();
	try {
		await getDb().transaction(async (tx) => {
			await tx.insert(user).values({
				id,
				email,
				name: input.name.trim(),
				passwordHash,
				timeZone: input.timeZone,
				schoolId: input.schoolId ?? null
			});
			if (input.roles.length > 0) {
				await tx.insert(userRole).values(input.roles.map((role) => ({ userId: id, role })));
			}
		});
	} catch (err) {
		if (isDuplicateKey(err)) throw new EmailTakenError(email);
		throw err;
	}
	const created = await findAccountById(id);
	if (!created) throw new Error(`account ${id} vanished right after it was created`);
	return created;
}

export async function findAccountByEmail(email: string): Promise<User | undefined> {
	const [row] = await getDb()
		.select()
		.from(user)
		.where(eq(user.email, email.trim().toLowerCase()));
	return row;
}

export async function findAccountById(id: string): Promise<User | undefined> {
	const [row] = await getDb().select().from(user).where(eq(user.id, id));
	return row;
}

export async function updateProfile(id: string, changes: { name: string; timeZone: string }): Promise<void> {
	await getDb()
		.update(user)
		.set({ name: changes.name.trim(), timeZone: changes.timeZone })
		.where(eq(user.id, id));
}
