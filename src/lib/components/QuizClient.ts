// Browser side of the learner's JSON API: idempotency keys and retries of a dropped request.

/** A random UUID (v4), also where crypto.randomUUID is missing (pages served over plain http on a LAN). */
export function newIdempotencyKey(): string {
	if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
	const b = crypto.getRandomValues(new Uint8Array(16));
	b[6] = (b[6] & 0x0f) | 0x40;
	b[8] = (b[8] & 0x3f) | 0x80;
	const h = [...b].map((x) => x.toString(16).padStart(2, '0')).join('');
	return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

export type ApiError = { code: string; message: string; fields?: Record<string, string> };

/**
 * Sends a JSON request; a network failure is retried (the same body, so the same idempotency key) up
 * to three times. Returns the data, or the server's `{ error }` as an ApiError.
 */
export async function callApi<T>(url: string, body?: unknown): Promise<{ ok: true; data: T } | { ok: false; error: ApiError }> {
	for (let attempt = 0; ; attempt++) {
		try {
			const res = await fetch(url, body === undefined ? { headers: { accept: 'application/json' } } : { method: 'POST', headers: { 'content-type': 'application/json', accept: 'application/json' }, body: JSON.stringify(body) });
			if (res.redirected && res.url.includes('/signin')) return { ok: false, error: { code: 'signed_out', message: 'You are signed out. Sign in again to carry on; your answers so far are saved.' } };
			const data = await res.json().catch(() => null);
			if (res.ok && data) return { ok: true, data: data as T };
			const err = (data as { error?: ApiError; message?: string } | null)?.error;
			return { ok: false, error: err ?? { code: `http_${res.status}`, message: (data as { message?: string } | null)?.message ?? `The server answered ${res.status}. Please try again.` } };
		} catch {
			if (attempt >= 2) return { ok: false, error: { code: 'offline', message: 'The connection dropped. Nothing was lost: check your connection and press the button again.' } };
			await new Promise((r) => setTimeout(r, 800 * (attempt + 1)));
		}
	}
}
