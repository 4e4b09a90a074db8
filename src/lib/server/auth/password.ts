import { hash, verify } from '@node-rs/argon2';

/**
 * argon2id with the OWASP Password Storage Cheat Sheet's first recommended setting:
 * m = 19 MiB (19456 KiB), t = 2, p = 1. `algorithm: 2` is Algorithm.Argon2id (a const enum we cannot import).
 */
export const ARGON2ID_OPTIONS = { algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 128;

export const PASSWORD_RULE = `Use ${PASSWORD_MIN_LENGTH} to ${PASSWORD_MAX_LENGTH} characters; a phrase of three or four unrelated words works well.`;

/** Why a new password is not acceptable, or null when it is. */
export function passwordProblem(password: string, email?: string): string | null {
	if (password.length < PASSWORD_MIN_LENGTH) {
		return `That password has ${password.length} characters; it needs at least ${PASSWORD_MIN_LENGTH}. A phrase of three or four unrelated words works well.`;
	}
	if (password.length > PASSWORD_MAX_LENGTH) {
		return `That password is longer than ${PASSWORD_MAX_LENGTH} characters; please use a shorter one.`;
	}
	if (new Set(password).size < 4) {
		return 'That password repeats the same few characters; use a phrase of unrelated words instead.';
	}
	if (email && password.toLowerCase().includes(email.toLowerCase().split('@')[0] ?? '\u0000')) {
		return 'Your password should not contain your e-mail address.';
	}
	return null;
}

export function hashPassword(password: string): Promise<string> {
	return hash(password, ARGON2ID_OPTIONS);
}

/** True when `password` matches the stored PHC string; false for a wrong password or a malformed hash. */
export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
	try {
		return await verify(passwordHash, password);
	} catch {
		return false;
	}
}

// Verifying against this keeps the time of a sign-in for an unknown e-mail close to that of a known one.
let dummyHash: Promise<string> | undefined;
export async function verifyAgainstDummy(password: string): Promise<void> {
	dummyHash ??= hashPassword('not a real account password');
	await verifyPassword(await dummyHash, password);
}
