import { z } from 'zod';

export const readingSchema = z.strictObject({
	challengeId: z.string().min(1).max(24),
	state: z.string().min(1).max(64),
	red: z.string().min(1).max(64),
	black: z.string().min(1).max(64),
	/** Made by the client for this reading: a retried request with the same key is counted once. */
	idempotencyKey: z.uuid('idempotencyKey must be a UUID made by the client for this reading').optional()
});
