import { z } from 'zod';

export const challengeSchema = z.strictObject({
	circuit: z.string().min(1).max(200),
	/** KIND:TARGET from the standard fault list; authors and instructors only. Absent = a random fault. */
	fault: z.string().min(3).max(120).optional()
});
