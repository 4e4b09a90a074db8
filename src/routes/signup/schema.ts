import { z } from 'zod';
import { emailField, nameField, newPasswordField, timeZoneField } from '$lib/server/auth/fields';

export const signupSchema = z.object({
	name: nameField,
	email: emailField,
	password: newPasswordField,
	// Filled in by the browser (Intl); without JavaScript the account starts on UTC and can be changed on the profile page.
	timeZone: z.preprocess((v) => (typeof v === 'string' && v.trim() !== '' ? v : 'UTC'), timeZoneField)
});
