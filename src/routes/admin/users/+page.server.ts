import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad, RequestEvent } from './$types';
import { listQuerySchema, roleChangeSchema } from './schema';
import { requireRole } from '$lib/server/auth/guards';
import { ROLES, ROLE_LABELS } from '$lib/server/auth/roles';
import { parseForm, type FieldErrors } from '$lib/server/forms';
import { findAccountById } from '$lib/server/users/accounts';
import { searchPeople } from '$lib/server/users/directory';
import { grantRole, OwnSiteAdminError, revokeRole } from '$lib/server/users/roles';

export const load: PageServerLoad = async (event) => {
	const me = requireRole(event, 'site_admin');
	const { q, page } = listQuerySchema.parse({
		q: event.url.searchParams.get('q') ?? '',
		page: event.url.searchParams.get('page') ?? '1'
	});
	const result = await searchPeople(q, page);
	return {
		...result,
		q,
		myId: me.id,
		roles: ROLES.map((role) => ({ role, label: ROLE_LABELS[role] }))
	};
};

async function changeRole(event: RequestEvent, change: 'grant' | 'revoke') {
	const me = requireRole(event, 'site_admin');
	const form = await event.request.formData();
	const parsed = parseForm(roleChangeSchema, form);
	if (!parsed.ok) {
		return fail(400, { message: Object.values(parsed.errors).join(' '), errors: parsed.errors });
	}
	const { userId, role, q, page } = parsed.data;
	const person = await findAccountById(userId);
	if (!person) return fail(400, { message: 'That account no longer exists. Reload the list.', errors: {} as FieldErrors });
	try {
		if (change === 'grant') await grantRole(userId, role);
		else await revokeRole(me.id, userId, role);
	} catch (err) {
		if (err instanceof OwnSiteAdminError) return fail(400, { message: err.message, errors: { role: err.message } as FieldErrors });
		throw err;
	}
	const back = new URLSearchParams();
	if (q) back.set('q', q);
	if (page && page !== '1') back.set('page', page);
	const query = back.toString();
	redirect(303, `/admin/users${query ? `?${query}` : ''}`);
}

export const actions: Actions = {
	grant: (event) => changeRole(event, 'grant'),
	revoke: (event) => changeRole(event, 'revoke')
};
