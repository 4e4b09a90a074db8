/**
 * A small deterministic string hash (two 53-bit lanes, cyrb53 style) for ids and version hashes.
 * Not cryptographic: it only has to change when the text changes.
 */

/** Two 53-bit lanes of one pass over the text (cyrb53 mixing), for the seeds 0 and 0x9e3779b9. */
function lanes(text: string): [number, number] {
	let a1 = 0xdeadbeef;
	let a2 = 0x41c6ce57;
	let b1 = 0xdeadbeef ^ 0x9e3779b9;
	let b2 = 0x41c6ce57 ^ 0x9e3779b9;
	for (let i = 0; i < text.length; i++) {
		const ch = text.charCodeAt(i);
		a1 = Math.imul(a1 ^ ch, 2654435761);
		a2 = Math.imul(a2 ^ ch, 1597334677);
		b1 = Math.imul(b1 ^ ch, 2654435761);
		b2 = Math.imul(b2 ^ ch, 1597334677);
	}
	return [finish(a1, a2), finish(b1, b2)];
}

function finish(h1: number, h2: number): number {
	h1 = Math.imul(h1 ^ (h1 >>> 16), 2246822507) ^ Math.imul(h2 ^ (h2 >>> 13), 3266489909);
	h2 = Math.imul(h2 ^ (h2 >>> 16), 2246822507) ^ Math.imul(h1 ^ (h1 >>> 13), 3266489909);
	return 4294967296 * (2097151 & h2) + (h1 >>> 0);
}

/** A 26-hex-digit hash of the text. */
export function hashText(text: string): string {
	const [a, b] = lanes(text);
	return a.toString(16).padStart(14, '0') + b.toString(16).padStart(14, '0').slice(2);
}

/** A short (10 hex digits) hash, for ids. */
export function shortHash(text: string): string {
	return lanes(text)[0].toString(16).padStart(14, '0').slice(-10);
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
