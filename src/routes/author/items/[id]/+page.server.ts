import { error, fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { loadMyItem, previewPayload, saveDraft, submitForReview } from '$lib/server/content/authoring';
import { authoringFailure } from '../item-form';
import { sourceSchema } from '../new/schema';

export const load: PageServerLoad = async (event) => {
	const me = requireRole(event, 'author');
	const mine = await loadMyItem(me, event.params.id);
	if (!mine) error(404, 'There is no such item of yours. Go back to your items.');
	return { item: mine, preview: previewPayload(mine.source, mine.id) };
};

export const actions: Actions = {
	save: async (event) => {
		const me = requireRole(event, 'author');
		const form = await event.request.formData();
		const parsed = sourceSchema.safeParse({ source: form.get('source') ?? undefined });
		if (!parsed.success) return fail(400, { message: parsed.error.issues[0].message, fields: { source: String(form.get('source') ?? '') }, errors: [] });
		try {
			await saveDraft(me, parsed.data.source, event.params.id);
		} catch (e) {
			return authoringFailure(e, parsed.data.source);
		}
		redirect(303, `/author/items/${event.params.id}?saved=1`);
	},
	submit: async (event) => {
		const me = requireRole(event, 'author');
		try {
			await submitForReview(me, event.params.id);
		} catch (e) {
			return authoringFailure(e, '');
		}
		redirect(303, `/author/items/${event.params.id}?submitted=1`);
	}
};
