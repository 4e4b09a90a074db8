import { z } from 'zod';

export const decisionSchema = z.object({
	comment: z.string().trim().max(4000, 'Keep the comment under 4,000 characters.').optional()
});

export const changesSchema = z.object({
	comment: z
		.string({ error: 'Say what should change.' })
		.trim()
		.min(3, 'Say what should change: write a comment for the author.')
		.max(4000, 'Keep the comment under 4,000 characters.')
});
