import { json } from '@sveltejs/kit';
import { sql } from 'drizzle-orm';
import type { RequestHandler } from './$types';
import { getDb } from '$lib/server/db/client';

export const GET: RequestHandler = async () => {
	try {
		await getDb().execute(sql`SELECT 1`);
		return json({ ok: true });
	} catch (err) {
		console.error('[health] database check failed:', err);
		return json({ error: { code: 'database-unavailable', message: 'The database is not answering.' } }, { status: 503 });
	}
};
