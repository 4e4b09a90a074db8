import { error, fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { keySummary } from '$lib/server/content/authoring';
import { approveFamily, loadFamilyReview, ReviewError } from '$lib/server/content/review';
import type { BuiltItem } from '$lib/items/types';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'reviewer');
	const r = await loadFamilyReview(event.params.id);
	if (!r) error(404, 'There is no such family. Go back to the review queue.');
	return {
		family: { id: r.family.id, title: r.family.title, status: r.family.status, approvedAt: r.family.approvedAt, changed: r.family.approvedHash !== null && r.family.approvedHash !== r.family.sourceHash },
		items: r.items,
		waiting: r.waiting,
		sample: r.sample.map((s) => ({ id: s.id, kind: s.kind, stemHtml: s.stemHtml, circuitText: s.circuitText, key: keySummary(s.key as BuiltItem['key'], s.question as BuiltItem['question']) }))
	};
};

export const actions: Actions = {
	approve: async (event) => {
		const me = requireRole(event, 'reviewer');
		try {
			await approveFamily(me, event.params.id);
		} catch (e) {
			if (!(e instanceof ReviewError)) throw e;
			if (e.code === 'not_found') error(404, e.message);
			return fail(400, { message: e.message });
		}
		redirect(303, '/review');
	}
};
