// House style: layout and rendering are pure (no svelte, no $app, no server code, no DOM).
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';

const DIR = path.resolve('src/lib/diagram');
const FORBIDDEN = [/^\$app\//, /^\$env\//, /^\$lib\/server/, /\/server\//, /^svelte($|\/)/, /^@sveltejs\//, /^node:/];

describe('src/lib/diagram', () => {
	it('imports nothing from the framework, the server, node or the DOM', () => {
		const bad: string[] = [];
		for (const f of readdirSync(DIR).filter((n) => n.endsWith('.ts') && !n.endsWith('.test.ts'))) {
			const src = readFileSync(path.join(DIR, f), 'utf8');
			for (const m of src.matchAll(/(?:import|export)\s[^'"]*?from\s*['"]([^'"]+)['"]/g)) if (FORBIDDEN.some((re) => re.test(m[1]))) bad.push(`${f}: ${m[1]}`);
			if (/\b(document|window)\.\w+/.test(src.replace(/\/\/.*$|\/\*[\s\S]*?\*\//gm, ''))) bad.push(`${f}: uses the DOM`);
		}
		expect(bad).toEqual([]);
	});
});
