import { z } from 'zod';

/** An answer to the current item of a set. Strict: a client's own `correct` or `score` is refused, never read. */
export const answerSchema = z.strictObject({
	/** The set the item belongs to; absent for extra practice of one skill. */
	setId: z.number().int().positive().optional(),
	itemId: z.string().min(1).max(160),
	idempotencyKey: z.uuid('idempotencyKey must be a UUID made by the client for this answer'),
	answer: z.record(z.string(), z.unknown(), 'answer must be an object such as { "value": 12.6 }'),
	ms: z.number().int().min(0).max(6 * 3_600_000)
});
