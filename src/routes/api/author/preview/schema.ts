import { z } from 'zod';

export const previewSchema = z.object({
	source: z.string({ error: 'Send the item markdown as "source".' }).max(200_000, 'The item is too long: keep it under 200,000 characters.'),
	id: z.string().max(160).optional()
});
