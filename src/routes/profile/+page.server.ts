import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { profileSchema } from './schema';
import { requireUser } from '$lib/server/auth/guards';
import { timeZoneNames } from '$lib/server/auth/time-zone';
import { invalid, parseForm } from '$lib/server/forms';
import { updateProfile } from '$lib/server/users/accounts';

export const load: PageServerLoad = async (event) => {
	const user = requireUser(event);
	const zones = timeZoneNames();
	return {
		name: user.name,
		email: user.email,
		timeZone: user.timeZone,
		zones: zones.includes(user.timeZone) ? zones : [user.timeZone, ...zones],
		saved: event.url.searchParams.has('saved')
	};
};

export const actions: Actions = {
	default: async (event) => {
		const user = requireUser(event);
		const form = await event.request.formData();
		const parsed = parseForm(profileSchema, form);
		if (!parsed.ok) return invalid(form, parsed.errors, 'Your profile was not saved. Please fix the fields marked below.');
		await updateProfile(user.id, parsed.data);
		redirect(303, '/profile?saved');
	}
};
