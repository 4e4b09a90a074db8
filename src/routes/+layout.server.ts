import type { LayoutServerLoad } from './$types';
import { menuFor } from '$lib/server/nav/menu';

export const load: LayoutServerLoad = ({ locals }) => {
	const user = locals.user;
	return {
		user: user ? { name: user.name, email: user.email, roles: user.roles } : null,
		menu: menuFor(user?.roles ?? null)
	};
};
