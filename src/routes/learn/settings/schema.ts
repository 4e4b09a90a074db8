import { z } from 'zod';

export const settingsSchema = z.object({
	examDate: z
		.string()
		.trim()
		.refine((v) => v === '' || (/^\d{4}-\d{2}-\d{2}$/.test(v) && !Number.isNaN(Date.parse(`${v}T00:00:00Z`))), 'Give the date as YYYY-MM-DD, or leave it empty')
		.transform((v) => (v === '' ? null : v)),
	dailyItems: z.coerce.number('Give a whole number of questions').int('Give a whole number of questions').min(3, 'At least 3 questions a day').max(60, 'At most 60 questions a day'),
	dailyMinutes: z.coerce.number('Give a whole number of minutes').int('Give a whole number of minutes').min(3, 'At least 3 minutes a day').max(120, 'At most 120 minutes a day')
});
