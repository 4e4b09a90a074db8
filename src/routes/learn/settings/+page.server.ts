import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { getDb } from '$lib/server/db/client';
import { invalid, parseForm } from '$lib/server/forms';
import { ensureProfile, saveSettings } from '$lib/server/learning/profile';
import { settingsSchema } from './schema';

export const load: PageServerLoad = async (event) => {
	const user = requireRole(event, 'learner');
	const p = await ensureProfile(getDb(), user.id);
	return { examDate: p.examDate ?? '', dailyItems: p.dailyItems, dailyMinutes: p.dailyMinutes, timeZone: user.timeZone, saved: event.url.searchParams.has('saved') };
};

export const actions: Actions = {
	default: async (event) => {
		const user = requireRole(event, 'learner');
		const form = await event.request.formData();
		const parsed = parseForm(settingsSchema, form);
		if (!parsed.ok) return invalid(form, parsed.errors, 'Your settings were not saved. Please fix the fields marked below.');
		await saveSettings(getDb(), user.id, parsed.data);
		redirect(303, '/learn/settings?saved');
	}
};
