import { fail } from '@sveltejs/kit';
import { z } from 'zod';

export type FieldErrors = Record<string, string>;

/** The form's text values, for putting back into the form; never includes fields named like a password. */
export function typedValues(form: FormData): Record<string, string> {
	const values: Record<string, string> = {};
	for (const [key, value] of form) {
		if (typeof value === 'string' && !/password/i.test(key)) values[key] = value;
	}
	return values;
}

/** Validates a submitted form; the first message per field on failure. */
export function parseForm<T extends z.ZodType>(schema: T, form: FormData) {
	const raw: Record<string, string> = {};
	for (const [key, value] of form) if (typeof value === 'string') raw[key] = value;
	const result = schema.safeParse(raw);
	if (result.success) return { ok: true as const, data: result.data as z.output<T> };
	const errors: FieldErrors = {};
	for (const issue of result.error.issues) {
		const key = String(issue.path[0] ?? 'form');
		errors[key] ??= issue.message;
	}
	return { ok: false as const, errors };
}

/** A 400 (or `status`) with a summary, the field messages, and what the person typed (minus passwords). */
export function invalid(
	form: FormData,
	errors: FieldErrors,
	message = 'Please fix the fields marked below.',
	status = 400
) {
	return fail(status, { message, fields: typedValues(form), errors });
}
