import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { previewPayload, saveDraft } from '$lib/server/content/authoring';
import { authoringFailure, NEW_ITEM_TEMPLATE } from '../item-form';
import { MAX_SOURCE, sourceSchema } from './schema';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'author');
	return { source: NEW_ITEM_TEMPLATE, preview: previewPayload(NEW_ITEM_TEMPLATE) };
};

async function saveFrom(me: { id: string; roles: string[] }, source: string) {
	let id: string;
	try {
		id = await saveDraft(me, source);
	} catch (e) {
		return authoringFailure(e, source);
	}
	redirect(303, `/author/items/${id}?saved=1`);
}

export const actions: Actions = {
	save: async (event) => {
		const me = requireRole(event, 'author');
		const form = await event.request.formData();
		const parsed = sourceSchema.safeParse({ source: form.get('source') ?? undefined });
		if (!parsed.success) return fail(400, { message: parsed.error.issues[0].message, fields: { source: String(form.get('source') ?? '') }, errors: [] });
		return saveFrom(me, parsed.data.source);
	},
	upload: async (event) => {
		const me = requireRole(event, 'author');
		const form = await event.request.formData();
		const file = form.get('file');
		let text: string;
		if (file instanceof File) {
			if (!file.size) return fail(400, { message: 'Choose a .md file to upload.', fields: { source: '' }, errors: [] });
			if (!/\.(md|markdown)$/i.test(file.name)) return fail(400, { message: `“${file.name}” is not a markdown file: upload a .md file.`, fields: { source: '' }, errors: [] });
			if (file.size > MAX_SOURCE) return fail(400, { message: 'The file is too large: an item file stays under 200 KB.', fields: { source: '' }, errors: [] });
			text = await file.text();
		} else if (typeof file === 'string' && file.trim()) {
			// A form sent without multipart encoding carries the file's text itself.
			text = file;
		} else return fail(400, { message: 'Choose a .md file to upload.', fields: { source: '' }, errors: [] });
		return saveFrom(me, text);
	}
};
