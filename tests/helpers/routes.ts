// Discovers pages, named form actions and API methods from src/routes, the way SvelteKit lays them out.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';

export type DiscoveredRoute =
	| { kind: 'page'; route: string }
	| { kind: 'action'; route: string; action: string }
	| { kind: 'endpoint'; route: string; method: string };

const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'OPTIONS', 'HEAD', 'fallback'];

function routeId(dir: string, root: string): string {
	const segments = path
		.relative(root, dir)
		.split(path.sep)
		.filter((s) => s && !/^\(.*\)$/.test(s));
	return `/${segments.join('/')}`;
}

/** The top-level keys of the object literal assigned to `export const actions`. */
export function actionNames(source: string): string[] {
	const start = source.search(/export\s+const\s+actions\b/);
	if (start < 0) return [];
	const open = source.indexOf('{', source.indexOf('=', start));
	const names: string[] = [];
	let depth = 0;
	let expectKey = false;
	for (let i = open; i < source.length; i++) {
		const c = source[i]!;
		if (c === '"' || c === "'" || c === '`') {
			const end = source.indexOf(c, i + 1);
			if (depth === 1 && expectKey) {
				names.push(source.slice(i + 1, end));
				expectKey = false;
			}
			i = end;
			continue;
		}
		if (c === '/' && source[i + 1] === '/') {
			i = source.indexOf('\n', i);
			continue;
		}
		if (c === '/' && source[i + 1] === '*') {
			i = source.indexOf('*/', i) + 1;
			continue;
		}
		if ('{([' .includes(c)) {
			depth++;
			if (depth === 1) expectKey = true;
			continue;
		}
		if ('})]'.includes(c)) {
			depth--;
			if (depth === 0) break;
			continue;
		}
		if (depth === 1 && c === ',') {
			expectKey = true;
			continue;
		}
		if (depth === 1 && expectKey && /[A-Za-z_$]/.test(c)) {
			const match = /^(?:async\s+)?([A-Za-z_$][\w$]*)/.exec(source.slice(i));
			if (match) {
				names.push(match[1]!);
				i += match[0].length - 1;
			}
			expectKey = false;
		}
	}
	return names;
}

export function exportedMethods(source: string): string[] {
	const found = new Set<string>();
	const re = /export\s+(?:const|let|async\s+function|function)\s+([A-Za-z]+)\b/g;
	for (let m = re.exec(source); m; m = re.exec(source)) if (METHODS.includes(m[1]!)) found.add(m[1]!);
	for (const m of source.matchAll(/export\s*\{([^}]*)\}/g)) {
		for (const part of m[1]!.split(',')) {
			const name = part.trim().split(/\s+as\s+/).pop()?.trim();
			if (name && METHODS.includes(name)) found.add(name);
		}
	}
	return [...found];
}

export function discoverRoutes(root = path.resolve('src/routes')): DiscoveredRoute[] {
	const found: DiscoveredRoute[] = [];
	const walk = (dir: string) => {
		const entries = readdirSync(dir, { withFileTypes: true });
		const files = new Set(entries.filter((e) => e.isFile()).map((e) => e.name));
		const route = routeId(dir, root);
		const pageFiles = [...files].filter((f) => /^\+page(@.*)?\.(svelte|server\.ts|server\.js|ts|js)$/.test(f));
		if (pageFiles.length > 0) found.push({ kind: 'page', route });
		for (const f of [...files].filter((f) => /^\+page(@.*)?\.server\.(ts|js)$/.test(f))) {
			for (const action of actionNames(readFileSync(path.join(dir, f), 'utf8'))) found.push({ kind: 'action', route, action });
		}
		for (const f of [...files].filter((f) => /^\+server\.(ts|js)$/.test(f))) {
			for (const method of exportedMethods(readFileSync(path.join(dir, f), 'utf8'))) found.push({ kind: 'endpoint', route, method });
		}
		for (const e of entries) if (e.isDirectory()) walk(path.join(dir, e.name));
	};
	walk(root);
	return found;
}
