import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { invalid, parseForm, typedValues } from './forms';
import { emailField } from './auth/fields';

function form(entries: Record<string, string>) {
	const f = new FormData();
	for (const [k, v] of Object.entries(entries)) f.set(k, v);
	return f;
}

describe('forms', () => {
	it('never sends a password back to the page', () => {
		expect(typedValues(form({ email: 'a@harrowcreek.example', password: 'secret words here', newPassword: 'x' }))).toEqual({
			email: 'a@harrowcreek.example'
		});
		const failure = invalid(form({ email: 'x', password: 'y' }), { email: 'bad' });
		expect(failure.status).toBe(400);
		expect(failure.data.fields).toEqual({ email: 'x' });
	});

	it('gives one message per field, naming what to do', () => {
		const schema = z.object({ email: emailField, name: z.string({ error: 'Enter your name.' }) });
		const result = parseForm(schema, form({ email: 'not an address' }));
		expect(result.ok).toBe(false);
		if (!result.ok) {
			expect(result.errors.email).toMatch(/name@example\.org/);
			expect(result.errors.name).toBe('Enter your name.');
		}
	});

	it('normalises e-mail addresses to lower case (RFC 5321 §2.4: domains are case-insensitive)', () => {
		const result = parseForm(z.object({ email: emailField }), form({ email: '  Learner@HarrowCreek.example ' }));
		expect(result.ok && result.data.email).toBe('learner@harrowcreek.example');
	});
});
