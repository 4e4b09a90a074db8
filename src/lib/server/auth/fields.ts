import { z } from 'zod';
import { passwordProblem } from './password';
import { isTimeZone } from './time-zone';

// Field schemas shared by the sign-up, sign-in and profile forms.

export const emailField = z
	.string({ error: 'Enter your e-mail address.' })
	.trim()
	.toLowerCase()
	.min(1, 'Enter your e-mail address.')
	.max(254, 'That e-mail address is too long (254 characters at most).')
	.pipe(z.email({ error: 'Enter an e-mail address in the form name@example.org.' }));

export const nameField = z
	.string({ error: 'Enter your name.' })
	.trim()
	.min(1, 'Enter your name as your instructor would know it.')
	.max(120, 'Keep your name to 120 characters or fewer.');

export const newPasswordField = z
	.string({ error: 'Choose a password.' })
	.superRefine((password, ctx) => {
		const problem = passwordProblem(password);
		if (problem) ctx.addIssue({ code: 'custom', message: problem });
	});

export const timeZoneField = z
	.string({ error: 'Choose your time zone.' })
	.trim()
	.refine(isTimeZone, 'That is not a time zone we know. Pick yours from the list, e.g. America/Chicago.');
