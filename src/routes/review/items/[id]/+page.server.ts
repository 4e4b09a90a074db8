import { error, fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad, RequestEvent } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { parseForm } from '$lib/server/forms';
import { keySummary } from '$lib/server/content/authoring';
import { approveItem, loadItemReview, requestChanges, retireItem, ReviewError } from '$lib/server/content/review';
import type { BuiltItem } from '$lib/items/types';
import { changesSchema, decisionSchema } from './schema';

export const load: PageServerLoad = async (event) => {
	requireRole(event, 'reviewer');
	const r = await loadItemReview(event.params.id);
	if (!r) error(404, 'There is no such item. Go back to the review queue.');
	const v = r.version;
	const summary = (key: unknown) => {
		try {
			return keySummary(key as BuiltItem['key'], v.question as BuiltItem['question']);
		} catch {
			return JSON.stringify(key);
		}
	};
	return {
		item: { id: r.item.id, area: r.item.area, skill: r.item.skill, kind: r.item.kind, status: r.item.status, familyId: r.item.familyId },
		version: {
			id: v.id,
			status: v.status,
			stemHtml: v.stemHtml,
			explanationHtml: v.explanationHtml,
			circuitText: v.circuitText,
			state: (v.feedback as BuiltItem['feedback']).state,
			key: summary(v.key),
			distractors: (v.distractors as BuiltItem['distractors']).map((d) => ({ tag: d.tag, label: d.label })),
			cautions: (v.cautions as BuiltItem['cautions']).map((c) => c.text)
		},
		keyCheck: { ok: r.key.ok, recomputed: r.key.recomputed, message: r.key.message, stored: summary(r.key.stored), computed: r.key.computed ? summary(r.key.computed) : null },
		diff: r.diff,
		stats: r.stats,
		history: r.history
	};
};

async function decide(event: RequestEvent, run: (me: { id: string; roles: string[] }, form: FormData) => Promise<unknown>) {
	const me = requireRole(event, 'reviewer');
	const form = await event.request.formData();
	try {
		const failed = await run(me, form);
		if (failed) return failed;
	} catch (e) {
		if (!(e instanceof ReviewError)) throw e;
		if (e.code === 'not_found') error(404, e.message);
		if (e.code === 'forbidden') error(403, e.message);
		return fail(400, { message: e.message, fields: { comment: String(form.get('comment') ?? '') } });
	}
	redirect(303, '/review');
}

export const actions: Actions = {
	approve: (event) =>
		decide(event, async (me, form) => {
			const p = parseForm(decisionSchema, form);
			if (!p.ok) return fail(400, { message: Object.values(p.errors).join(' '), fields: {} });
			await approveItem(me, event.params.id, p.data.comment || null);
		}),
	requestChanges: (event) =>
		decide(event, async (me, form) => {
			const p = parseForm(changesSchema, form);
			if (!p.ok) return fail(400, { message: Object.values(p.errors).join(' '), fields: { comment: String(form.get('comment') ?? '') } });
			await requestChanges(me, event.params.id, p.data.comment);
		}),
	retire: (event) =>
		decide(event, async (me, form) => {
			const p = parseForm(decisionSchema, form);
			if (!p.ok) return fail(400, { message: Object.values(p.errors).join(' '), fields: {} });
			await retireItem(me, event.params.id, p.data.comment || null);
		})
};
