import { json } from '@sveltejs/kit';
import type { RequestHandler } from './$types';
import { requireUser } from '$lib/server/auth/guards';

export const GET: RequestHandler = (event) => {
	const user = requireUser(event);
	return json({ id: user.id, email: user.email, name: user.name, timeZone: user.timeZone, roles: user.roles });
};
