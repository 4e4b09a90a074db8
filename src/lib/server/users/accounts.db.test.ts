import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '../db/client';
import { uniqueEmail } from '../../../../tests/helpers/db';
import { verifyPassword } from '../auth/password';
import { createAccount, EmailTakenError, findAccountByEmail, findAccountById, updateProfile } from './accounts';
import { rolesOf } from './roles';

afterAll(closeDb);

describe('accounts (MariaDB)', () => {
	it('stores a new account with a lower-case e-mail, an argon2id hash and its roles', async () => {
		const email = uniqueEmail('Mixed.Case');
		const account = await createAccount({
			email: `  ${email.toUpperCase()} `,
			name: ' Ada Quarrington ',
			password: 'relay coil pin 86 feed',
			timeZone: 'America/Denver',
			roles: ['learner', 'author']
		});
		expect(account.email).toBe(email.toLowerCase());
		expect(account.name).toBe('Ada Quarrington');
		expect(account.passwordHash.startsWith('$argon2id$')).toBe(true);
		expect(await verifyPassword(account.passwordHash, 'relay coil pin 86 feed')).toBe(true);
		expect(account.emailVerifiedAt).toBeNull();
		expect(await rolesOf(account.id)).toEqual(['learner', 'author']);
		expect((await findAccountByEmail(email.toUpperCase()))?.id).toBe(account.id);
	});

	it('refuses a second account with the same e-mail, whatever its case', async () => {
		const email = uniqueEmail('twice');
		await createAccount({ email, name: 'First', password: 'first long password', timeZone: 'UTC', roles: ['learner'] });
		await expect(
			createAccount({ email: email.toUpperCase(), name: 'Second', password: 'second long password', timeZone: 'UTC', roles: [] })
		).rejects.toBeInstanceOf(EmailTakenError);
	});

	it('changes name and time zone', async () => {
		const account = await createAccount({
			email: uniqueEmail('moving'),
			name: 'Before',
			password: 'ground strap at the block',
			timeZone: 'UTC',
			roles: []
		});
		await updateProfile(account.id, { name: 'After', timeZone: 'Pacific/Auckland' });
		const after = await findAccountById(account.id);
		expect(after?.name).toBe('After');
		expect(after?.timeZone).toBe('Pacific/Auckland');
	});
});
