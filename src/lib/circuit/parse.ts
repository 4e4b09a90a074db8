/**
 * YAML reading with line numbers: turns circuit file text into plain values that remember the
 * 1-based line of every map key and list item. YAML 1.2 core schema, so `on`/`off`/`yes`/`no` are strings.
 */
import { LineCounter, isMap, isScalar, isSeq, parseDocument, type Node as YamlNode } from 'yaml';
import type { Problem } from './errors';
import { readSimpleYaml } from './fast-yaml';

/** A YAML value with the line it starts on. */
export type Located =
	| { kind: 'map'; line: number; entries: { key: string; keyLine: number; value: Located }[] }
	| { kind: 'list'; line: number; items: Located[] }
	| { kind: 'scalar'; line: number; value: string | number | boolean | null };

/**
 * Reads YAML text: the plain subset that circuit files use through a fast reader, anything else
 * through the full `yaml` reader (both give the same values and lines). Returns the root value (null for an empty or unreadable document) and every YAML
 * error as a problem with key `yaml`. Never throws.
 */
export function readYaml(text: string): { root: Located | null; problems: Problem[] } {
	const simple = readSimpleYaml(text);
	if (simple) return { root: simple, problems: [] };
	return readFullYaml(text);
}

/** Reads YAML text with the full `yaml` reader (any YAML, every error reported). Never throws. */
export function readFullYaml(text: string): { root: Located | null; problems: Problem[] } {
	const lc = new LineCounter();
	const doc = parseDocument(text, { lineCounter: lc, version: '1.2', schema: 'core', prettyErrors: false });
	const problems: Problem[] = [];
	for (const e of doc.errors) {
		const line = e.linePos?.[0]?.line ?? lc.linePos(e.pos[0]).line;
		const first = e.message.split('\n')[0].replace(/ at line \d+, column \d+:?$/, '');
		problems.push({ line, key: 'yaml', message: `${first}; fix the YAML syntax on this line` });
	}
	const lineOf = (n: YamlNode | null | undefined, fallback: number): number =>
		n && n.range ? lc.linePos(n.range[0]).line : fallback;
	const convert = (n: unknown, fallback: number): Located => {
		if (isMap(n)) {
			const line = lineOf(n, fallback);
			const entries: { key: string; keyLine: number; value: Located }[] = [];
			for (const pair of n.items) {
				const k = pair.key as YamlNode | null;
				const keyLine = lineOf(k, line);
				const key = isScalar(k) ? String(k.value) : String(k);
				entries.push({ key, keyLine, value: convert(pair.value, keyLine) });
			}
			return { kind: 'map', line, entries };
		}
		if (isSeq(n)) {
			const line = lineOf(n, fallback);
			return { kind: 'list', line, items: n.items.map((it) => convert(it, line)) };
		}
		if (isScalar(n)) {
			const v = n.value;
			const value = typeof v === 'string' || typeof v === 'number' || typeof v === 'boolean' ? v : null;
			return { kind: 'scalar', line: lineOf(n, fallback), value };
		}
		return { kind: 'scalar', line: fallback, value: null };
	};
	if (doc.errors.length > 0 && !doc.contents) return { root: null, problems };
	const root = doc.contents ? convert(doc.contents, 1) : null;
	return { root, problems };
}

/** The entry of a map value by key, or undefined. */
export function entryOf(m: Located, key: string): { key: string; keyLine: number; value: Located } | undefined {
	return m.kind === 'map' ? m.entries.find((e) => e.key === key) : undefined;
}
