import { describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';

// House style (../shared/house-style.md): the engine, item and learning modules are pure TypeScript and never
// import the framework, server code, the database or the DOM.
const PURE_DIRS = ['src/lib/circuit', 'src/lib/diagram', 'src/lib/items', 'src/lib/learning'];
const FORBIDDEN = [/^\$app\//, /^\$env\//, /^\$lib\/server/, /\/server\//, /^svelte($|\/)/, /^@sveltejs\//, /^drizzle-orm/, /^mysql2/, /^lucia/];

function sourceFiles(dir: string): string[] {
	if (!existsSync(dir)) return [];
	return readdirSync(dir).flatMap((name) => {
		const full = path.join(dir, name);
		if (statSync(full).isDirectory()) return sourceFiles(full);
		return /\.(ts|js)$/.test(name) && !/\.test\.ts$/.test(name) ? [full] : [];
	});
}

function importsOf(source: string): string[] {
	const specs = [...source.matchAll(/(?:import|export)\s[^'"]*?from\s*['"]([^'"]+)['"]|import\s*\(\s*['"]([^'"]+)['"]\s*\)|^\s*import\s*['"]([^'"]+)['"]/gm)];
	return specs.map((m) => m[1] ?? m[2] ?? m[3]!);
}

describe('pure modules', () => {
	it('import nothing from the framework, the server, the database or the DOM', () => {
		const offending: string[] = [];
		for (const file of PURE_DIRS.flatMap(sourceFiles)) {
			const source = readFileSync(file, 'utf8');
			for (const spec of importsOf(source)) if (FORBIDDEN.some((re) => re.test(spec))) offending.push(`${file}: ${spec}`);
			if (/\b(document|window)\.(querySelector|getElementById|body|createElement|addEventListener|location)\b/.test(source.replace(/\/\/.*$|\/\*[\s\S]*?\*\//gm, ''))) offending.push(`${file}: uses the DOM`);
		}
		expect(offending).toEqual([]);
	});

	it('can tell a forbidden import when it sees one', () => {
		const specs = importsOf("import { db } from '$lib/server/db/client';\nimport x from './local';\nexport { y } from 'svelte/store';");
		expect(specs).toEqual(['$lib/server/db/client', './local', 'svelte/store']);
		expect(specs.filter((s) => FORBIDDEN.some((re) => re.test(s)))).toEqual(['$lib/server/db/client', 'svelte/store']);
	});
});
