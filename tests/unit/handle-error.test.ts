import { describe, expect, it, vi } from 'vitest';
import { handleError } from '../../src/hooks.server';

type Input = Parameters<typeof handleError>[0];

const input = (status: number, message: string, error: unknown): Input =>
	({
		error,
		status,
		message,
		event: { request: new Request('http://127.0.0.1/home'), url: new URL('http://127.0.0.1/home') }
	}) as unknown as Input;

// Common practice (OWASP Error Handling Cheat Sheet): log the details server-side, show the person a plain
// message and a reference, never the stack trace.
describe('handleError', () => {
	it('logs the error under an id and returns a plain message with that id', async () => {
		const log = vi.spyOn(console, 'error').mockImplementation(() => {});
		const boom = new Error('column "x" unknown at Query.run (mysql2/lib/query.js:12:3)');
		const result = await handleError(input(500, 'Internal Error', boom));
		expect(result).toMatchObject({ message: 'Something went wrong on our side. Please try again in a moment.' });
		const id = (result as { id: string }).id;
		expect(id).toMatch(/^[0-9a-f]{8}$/);
		expect(JSON.stringify(result)).not.toContain('mysql2');
		expect(log).toHaveBeenCalledWith(expect.stringContaining(id), boom);
		log.mockRestore();
	});

	it('says plainly that a page does not exist', async () => {
		expect(await handleError(input(404, 'Not Found', new Error('Not found: /nope')))).toEqual({
			message: 'There is no page at this address.'
		});
	});
});
