import { z } from 'zod';
import { emailField } from '$lib/server/auth/fields';

export const signinSchema = z.object({
	email: emailField,
	password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(1024, 'That password is too long.'),
	next: z.string().optional()
});
