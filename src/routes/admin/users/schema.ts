import { z } from 'zod';
import { ROLES } from '$lib/server/auth/roles';

export const roleChangeSchema = z.object({
	userId: z.string({ error: 'The form did not say whose role to change.' }).min(1).max(32),
	role: z.enum(ROLES, { error: `Choose one of the roles: ${ROLES.join(', ')}.` }),
	q: z.string().max(200).optional(),
	page: z.string().regex(/^\d{1,6}$/).optional()
});

export const listQuerySchema = z.object({
	q: z.string().max(200).catch(''),
	page: z.coerce.number().int().min(1).max(100000).catch(1)
});
