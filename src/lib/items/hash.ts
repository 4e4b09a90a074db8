/**
 * A small deterministic string hash (two 53-bit lanes, cyrb53 style) for ids and version hashes.
 * Not cryptographic: it only has to change when the text changes.
 */

function lane(text: string, seed: number): number {
	let h1 = 0xdeadbeef ^ seed;
	let h2 = 0x41c6ce57 ^ seed;
	for (let i = 0; i < text.length; i++) {
		const ch = text.charCodeAt(i);
		h1 = Math.imul(h1 ^ ch, 2654435761);
		h2 = Math.imul(h2 ^ ch, 1597334677);
	}
	h1 = Math.imul(h1 ^ (h1 >>> 16), 2246822507) ^ Math.imul(h2 ^ (h2 >>> 13), 3266489909);
	h2 = Math.imul(h2 ^ (h2 >>> 16), 2246822507) ^ Math.imul(h1 ^ (h1 >>> 13), 3266489909);
	return 4294967296 * (2097151 & h2) + (h1 >>> 0);
}

/** A 26-hex-digit hash of the text (two lanes of different seeds). */
export function hashText(text: string): string {
	return lane(text, 0).toString(16).padStart(14, '0') + lane(text, 0x9e3779b9).toString(16).padStart(14, '0').slice(2);
}

/** A short (10 hex digits) hash, for ids. */
export function shortHash(text: string): string {
	return lane(text, 7).toString(16).padStart(14, '0').slice(-10);
}

/** JSON with object keys sorted, so equal values hash equally. */
export function stableJson(v: unknown): string {
	if (v === null || typeof v !== 'object') return JSON.stringify(v) ?? 'null';
	if (Array.isArray(v)) return `[${v.map(stableJson).join(',')}]`;
	const o = v as Record<string, unknown>;
	return `{${Object.keys(o)
		.filter((k) => o[k] !== undefined)
		.sort()
		.map((k) => `${JSON.stringify(k)}:${stableJson(o[k])}`)
		.join(',')}}`;
}
