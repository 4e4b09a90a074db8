import { z } from 'zod';

export const MAX_SOURCE = 200_000;

export const sourceSchema = z.object({
	source: z
		.string({ error: 'The form carried no item markdown.' })
		.trim()
		.min(1, 'Write the item first: the markdown is empty.')
		.max(MAX_SOURCE, 'The item is too long: keep it under 200,000 characters.')
});
