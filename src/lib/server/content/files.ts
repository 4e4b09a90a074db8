/**
 * The bank's source files as the build reads them: every .md under content/items and every .yaml under
 * content/circuits, by project path. No database here, so command-line builds can use it without one.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import type { BuildOptions } from '../../items/bank';

function walk(dir: string, ext: string): string[] {
	let out: string[] = [];
	let names: string[];
	try {
		names = readdirSync(dir);
	} catch {
		return out;
	}
	for (const n of names.sort()) {
		const p = path.join(dir, n);
		if (statSync(p).isDirectory()) out = out.concat(walk(p, ext));
		else if (n.endsWith(ext)) out.push(p);
	}
	return out;
}

/** The bank's source files: markdown items and circuits by project path. */
export function readContent(root = process.cwd()): Pick<BuildOptions, 'files' | 'circuits'> {
	const files: Record<string, string> = {};
	for (const p of walk(path.join(root, 'content/items'), '.md')) files[path.relative(root, p)] = readFileSync(p, 'utf8');
	const circuits: Record<string, string> = {};
	for (const p of walk(path.join(root, 'content/circuits'), '.yaml')) circuits[path.relative(root, p)] = readFileSync(p, 'utf8');
	return { files, circuits };
}
