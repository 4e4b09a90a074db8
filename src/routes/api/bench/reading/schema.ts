import { z } from 'zod';

export const readingSchema = z.strictObject({
	challengeId: z.string().min(1).max(24),
	state: z.string().min(1).max(64),
	red: z.string().min(1).max(64),
	black: z.string().min(1).max(64)
});
