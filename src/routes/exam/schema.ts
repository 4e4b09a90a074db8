import { z } from 'zod';

export const startSchema = z.object({
	count: z.coerce.number('Give a whole number of questions').int('Give a whole number of questions').min(1, 'At least 1 question').max(100, 'At most 100 questions'),
	minutes: z.coerce.number('Give a whole number of minutes').int('Give a whole number of minutes').min(1, 'At least 1 minute').max(240, 'At most 240 minutes')
});
