import { z } from 'zod';
import { emailField, nameField, newPasswordField, timeZoneField } from '$lib/server/auth/fields';
import { passwordProblem } from '$lib/server/auth/password';

export const signupSchema = z.object({
	name: nameField,
	email: emailField,
	password: newPasswordField,
	// Filled in by the browser (Intl); without JavaScript the account starts on UTC and can be changed on the profile page.
	timeZone: z.preprocess((v) => (typeof v === 'string' && v.trim() !== '' ? v : 'UTC'), timeZoneField)
}).superRefine(({ email, password }, ctx) => {
	// Runs once every field is valid: the one password rule that needs the e-mail.
	const problem = passwordProblem(password, email);
	if (problem) ctx.addIssue({ code: 'custom', path: ['password'], message: problem });
});
