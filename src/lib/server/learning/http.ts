/** JSON endpoints of the learner's day: bodies checked with zod, errors as `{ error: { code, message, fields } }`. */
import { json, type RequestEvent } from '@sveltejs/kit';
import type { z } from 'zod';
import { LearnError } from './errors';

export function jsonError(code: string, message: string, status = 400, fields: Record<string, string> = {}) {
	return json({ error: { code, message, fields } }, { status });
}

/** Parses the JSON body with `schema`; a LearnError (400) names every field that is wrong. */
export async function readBody<T extends z.ZodType>(event: RequestEvent, schema: T): Promise<z.output<T>> {
	let raw: unknown;
	try {
		raw = await event.request.json();
	} catch {
		throw new LearnError('bad_json', 'The request body must be JSON, e.g. { "itemId": "...", "answer": { ... } }.', 400);
	}
	const r = schema.safeParse(raw);
	if (r.success) return r.data;
	const fields: Record<string, string> = {};
	for (const issue of r.error.issues) fields[issue.path.join('.') || 'body'] ??= issue.message;
	throw new LearnError('invalid', `The request is not valid: ${Object.entries(fields).map(([k, v]) => `${k}: ${v}`).join('; ')}.`, 400, fields);
}

/** Runs an endpoint body; an expected LearnError becomes its JSON error, anything else goes to handleError. */
export async function jsonReply(run: () => Promise<unknown>): Promise<Response> {
	try {
		return json(await run());
	} catch (e) {
		if (e instanceof LearnError) return jsonError(e.code, e.message, e.status, e.fields);
		throw e;
	}
}
