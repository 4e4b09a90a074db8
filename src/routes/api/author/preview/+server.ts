import { json } from '@sveltejs/kit';
import type { RequestHandler } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { previewPayload } from '$lib/server/content/authoring';
import { previewSchema } from './schema';

/** Markdown in; the rendered stem, the diagram, the engine's key and distractors, and errors with their lines out. */
export const POST: RequestHandler = async (event) => {
	requireRole(event, 'author');
	const text = await event.request.text();
	let body: unknown = { source: '' };
	if (text.trim()) {
		try {
			body = JSON.parse(text);
		} catch {
			return json({ error: { code: 'bad_json', message: 'The request body is not JSON. Send {"source": "...markdown..."}.', fields: {} } }, { status: 400 });
		}
	}
	const parsed = previewSchema.safeParse(body);
	if (!parsed.success) {
		const fields: Record<string, string> = {};
		for (const i of parsed.error.issues) fields[String(i.path[0] ?? 'body')] ??= i.message;
		return json({ error: { code: 'invalid', message: Object.values(fields).join(' '), fields } }, { status: 400 });
	}
	return json(previewPayload(parsed.data.source, parsed.data.id || undefined));
};
