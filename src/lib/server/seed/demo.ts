import { eq } from 'drizzle-orm';
import { getDb } from '../db/client';
import { user } from '../db/schema';
import type { Role } from '../auth/roles';
import { createAccount, findAccountByEmail } from '../users/accounts';
import { grantRole } from '../users/roles';
import { passwordProblem } from '../auth/password';
import { ensureSchool } from '../schools/schools';

// A fictional school and invented people, for trying the app; `npm start` prints these sign-ins.
export const DEMO_SCHOOL = 'Harrow Creek Technical College';
export const DEMO_PASSWORD = 'splice-demo-2026';
export const DEMO_TIME_ZONE = 'America/Chicago';

export const DEMO_ACCOUNTS: { email: string; name: string; role: Role }[] = [
	{ email: 'learner@harrowcreek.example', name: 'Tobin Vasquez-Harlow', role: 'learner' },
	{ email: 'instructor@harrowcreek.example', name: 'Marguerite Okonjo', role: 'instructor' },
	{ email: 'author@harrowcreek.example', name: 'Dev Ashworth', role: 'author' },
	{ email: 'reviewer@harrowcreek.example', name: 'Linnea Farrowby', role: 'reviewer' },
	{ email: 'schooladmin@harrowcreek.example', name: 'Casimir Delacourt', role: 'school_admin' },
	{ email: 'siteadmin@harrowcreek.example', name: 'Noor Halvorsen', role: 'site_admin' }
];

/**
 * Upserts the demo school and one account per role, keyed by e-mail. Running it again adds nothing:
 * existing accounts keep their password and gain back their demo role if it was removed.
 */
export async function seedDemo(): Promise<{ created: string[]; existing: string[] }> {
	const problem = passwordProblem(DEMO_PASSWORD);
	if (problem) throw new Error(`the demo password breaks the password rule: ${problem}`);
	const schoolId = await ensureSchool(DEMO_SCHOOL);
	const created: string[] = [];
	const existing: string[] = [];
	for (const account of DEMO_ACCOUNTS) {
		const found = await findAccountByEmail(account.email);
		if (found) {
			await getDb().update(user).set({ schoolId }).where(eq(user.id, found.id));
			await grantRole(found.id, account.role);
			existing.push(account.email);
		} else {
			await createAccount({ ...account, password: DEMO_PASSWORD, timeZone: DEMO_TIME_ZONE, schoolId, roles: [account.role] });
			created.push(account.email);
		}
	}
	return { created, existing };
}
