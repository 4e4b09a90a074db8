/**
 * Purity (house style "The shape of the code"): the pure modules import no framework, server, database
 * or DOM code. Scans every .ts file of src/lib/circuit, src/lib/items and src/lib/learning that exists.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOTS = ['src/lib/circuit', 'src/lib/items', 'src/lib/learning'];
const FORBIDDEN_IMPORT = [/^svelte(\/|$)/, /^\$app(\/|$)/, /^\$env(\/|$)/, /^\$lib\/server(\/|$)/, /^drizzle-orm(\/|$)/, /^drizzle-kit(\/|$)/, /(^|\/)server(\/|$)/];
const DOM_GLOBALS = /\b(window|document|localStorage|sessionStorage|navigator|HTMLElement|customElements)\s*[.([]/;

function files(dir: string): string[] {
	if (!existsSync(dir)) return [];
	const out: string[] = [];
	for (const name of readdirSync(dir)) {
		const p = join(dir, name);
		if (statSync(p).isDirectory()) out.push(...files(p));
		else if (/\.(ts|js)$/.test(name) && !/\.test\.ts$/.test(name)) out.push(p);
	}
	return out;
}

/** Module specifiers of static imports, re-exports and dynamic imports. */
export function importsOf(src: string): string[] {
	const out: string[] = [];
	const re = /(?:^|\n)\s*(?:import|export)\s[^'"`;]*?from\s*['"]([^'"]+)['"]|(?:^|\n)\s*import\s*['"]([^'"]+)['"]|\bimport\(\s*['"]([^'"]+)['"]\s*\)/g;
	for (let m = re.exec(src); m; m = re.exec(src)) out.push(m[1] ?? m[2] ?? m[3]);
	return out;
}

describe('pure modules', () => {
	const all = ROOTS.flatMap(files);
	it('finds the engine sources', () => {
		expect(all.some((f) => f.endsWith('src/lib/circuit/index.ts'))).toBe(true);
	});
	it('the import scanner sees static, re-export and dynamic imports', () => {
		expect(importsOf("import { x } from 'svelte/store';\nexport { y } from './y';\nconst z = import('$app/paths');")).toEqual(['svelte/store', './y', '$app/paths']);
	});
	for (const f of all)
		it(`${f} imports nothing from the framework, server, database or DOM`, () => {
			const src = readFileSync(f, 'utf8');
			for (const spec of importsOf(src)) for (const bad of FORBIDDEN_IMPORT) expect(spec, `${f} imports ${spec}`).not.toMatch(bad);
			const code = src.replace(/\/\*[\s\S]*?\*\//g, '').replace(/\/\/.*$/gm, '');
			expect(code, `${f} uses a DOM global`).not.toMatch(DOM_GLOBALS);
		});
	it('the engine depends only on yaml, zod and its own files', () => {
		for (const f of files('src/lib/circuit'))
			for (const spec of importsOf(readFileSync(f, 'utf8'))) expect(spec, `${f} imports ${spec}`).toMatch(/^(\.\/|\.\.\/|yaml$|zod$|zod\/)/);
	});
});
