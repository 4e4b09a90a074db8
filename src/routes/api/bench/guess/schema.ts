import { z } from 'zod';

export const guessSchema = z.strictObject({
	challengeId: z.string().min(1).max(24),
	fault: z.string().min(3).max(120),
	/**
	 * Accepted from clients of the earlier contract and ignored: the server counts the readings it
	 * recorded on the attempt.
	 */
	readings: z.number().int().min(0).max(500).optional()
});
