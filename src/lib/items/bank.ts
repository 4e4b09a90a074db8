/**
 * The build of the item bank: every markdown item and every family's variants, keyed by the engine.
 * Pure: file contents come in as maps; `scripts/content-build.ts` is the thin file-system wrapper.
 */
import { CircuitFileError, DeadShortError, FaultError, ObservationError, SolveOptionError } from '../circuit';
import { AREAS } from './blueprint';
import { compileItem } from './compile';
import { circuitCtx, ItemError, type CircuitCache } from './engine';
import { FAMILIES } from './families';
import type { Family } from './families/family';
import { FORMS, draftItems } from './families/forms';
import { hashText } from './hash';
import { readItemFile } from './markdown';
import { makeRng } from './rng';
import { KINDS, type BuildError, type BuiltItem, type ItemSource } from './types';

export type BuildOptions = {
	/** Markdown item files by project path (`content/items/x.md`). */
	files: Record<string, string>;
	/** Circuit files by project path (`content/circuits/x.yaml`). */
	circuits: Record<string, string>;
	/** The families to generate from (default: every registered family). */
	families?: readonly Family[];
	/** The seed of the generated variants (default `splicepoint`). */
	seed?: string;
	/** Variants per family, times each family's weight (default 12). */
	variantsPerFamily?: number;
	/** A diagram check run on circuit text: returns its problems (empty when the drawing is good). */
	checkDiagram?: (circuitText: string) => string[];
	/** How many variants of each family the diagram check sees (default 3). */
	diagramSamples?: number;
};

export type BankStats = {
	items: number;
	families: number;
	kinds: Record<string, number>;
	areas: Record<string, number>;
	errors: number;
	/** Generated forms with no candidate the engine could key (no distractor left, no next test, ...). */
	skipped: number;
	/** Generated items dropped because an earlier item had the same circuit, question and key. */
	duplicates: number;
	diagramChecks: number;
};

export type BuildResult = { items: BuiltItem[]; errors: BuildError[]; stats: BankStats };

const ENGINE_ERRORS = [FaultError, SolveOptionError, ObservationError, DeadShortError];

function isEngineError(e: unknown): e is Error {
	return ENGINE_ERRORS.some((E) => e instanceof E);
}

/** Signature of an item for distinctness: its circuit, question and key. `circuitHash` saves rehashing a known circuit. */
export function itemSignature(it: BuiltItem, circuitHash = hashText(it.circuitText)): string {
	// JSON.stringify is enough here: questions and keys are built in a fixed key order
	return hashText(circuitHash + '\u0000' + JSON.stringify(it.question) + JSON.stringify(it.feedback.state) + JSON.stringify(it.key) + it.stemHtml);
}

/**
 * Builds the bank: reads and keys every markdown item, generates and keys every family's variants,
 * renders markdown, and counts kinds and areas. Never throws on bad content: each problem is an
 * error with its file, line, what is wrong and what to do.
 */
export function buildBank(o: BuildOptions): BuildResult {
	const cache: CircuitCache = new Map();
	const errors: BuildError[] = [];
	const items: BuiltItem[] = [];
	const ids = new Set<string>();
	const sigs = new Set<string>();
	let skipped = 0;
	let duplicates = 0;
	let diagramChecks = 0;

	for (const file of Object.keys(o.files).sort()) {
		const { item, errors: readErrors } = readItemFile(file, o.files[file], o.circuits);
		errors.push(...readErrors);
		if (!item) continue;
		const src = item.source;
		const lineOf = (key: string) => src.lines?.[key] ?? 2;
		if (ids.has(src.id)) {
			errors.push({ file, line: lineOf('id'), message: `id "${src.id}" is used by another item`, fix: 'give this item an id of its own' });
			continue;
		}
		try {
			const ctx = circuitCtx(cache, src.circuitText);
			const built = compileItem(ctx, src);
			ids.add(built.id);
			sigs.add(itemSignature(built, ctx.hash));
			items.push(built);
		} catch (e) {
			if (e instanceof CircuitFileError) {
				for (const p of e.problems)
					errors.push({ file: item.circuitFile, line: item.circuitLine - 1 + p.line, message: `circuit: ${p.key}: ${p.message}`, fix: 'correct the circuit file (the circuit format and its optional keys: DEVELOPERS.md, "The circuit engine")' });
			} else if (e instanceof ItemError) errors.push({ file, line: lineOf(e.key), message: e.message, fix: e.fix });
			else if (isEngineError(e)) errors.push({ file, line: lineOf(src.kind === 'claim-check' ? 'claims' : 'ask'), message: e.message, fix: 'correct the ask: name a state, fault, part or point of this circuit' });
			else throw e;
		}
	}

	const families = o.families ?? FAMILIES;
	const seed = o.seed ?? 'splicepoint';
	const per = o.variantsPerFamily ?? 12;
	const samples = o.diagramSamples ?? 3;
	for (const fam of families) {
		const n = Math.max(1, Math.round(per * (fam.weight ?? 1)));
		const where = `src/lib/items/families/${fam.id}.ts`;
		for (let k = 0; k < n; k++) {
			const rng = makeRng(`${seed}|${fam.id}|${k}`);
			let variant;
			let ctx;
			try {
				variant = fam.variant(rng, k);
				ctx = circuitCtx(cache, variant.circuit);
			} catch (e) {
				const msg = e instanceof CircuitFileError ? e.message.replace(/\n/g, '; ') : (e as Error).message;
				errors.push({ file: where, line: 0, message: `variant ${k}: the circuit is refused: ${msg}`, fix: 'fix the family so every variant is a valid circuit' });
				continue;
			}
			if (o.checkDiagram && k < samples) {
				diagramChecks++;
				for (const p of o.checkDiagram(variant.circuit)) errors.push({ file: where, line: 0, message: `variant ${k}: diagram: ${p}`, fix: 'change the family so its circuits draw cleanly, or report the layout problem' });
			}
			for (const form of FORMS) {
				const formRng = makeRng(`${seed}|${fam.id}|${k}|${form.id}`);
				const drafts = draftItems(fam, variant, ctx, form.id, formRng, makeRng(`${seed}|${fam.id}|${k}|complaints`));
				let made = 0;
				let tried = 0;
				for (;;) {
					if (made >= form.take) break;
					let src: ItemSource;
					try {
						const next = drafts.next();
						if (next.done) break;
						src = next.value;
					} catch (e) {
						if (!(e instanceof ItemError) && !isEngineError(e)) throw e;
						errors.push({ file: where, line: 0, message: `variant ${k}, form ${form.id}: ${(e as Error).message}`, fix: 'fix the family or the form' });
						break;
					}
					tried++;
					if (ids.has(src.id)) continue;
					try {
						const built = compileItem(ctx, src);
						const sig = itemSignature(built, ctx.hash);
						if (sigs.has(sig)) {
							duplicates++;
							continue;
						}
						sigs.add(sig);
						ids.add(built.id);
						items.push(built);
						made++;
					} catch (e) {
						if (e instanceof ItemError && e.key !== 'skill' && e.key !== 'kind') continue;
						if (e instanceof ItemError || isEngineError(e)) {
							errors.push({ file: where, line: 0, message: `variant ${k}, ${src.id}: ${(e as Error).message}`, fix: e instanceof ItemError ? e.fix : 'fix the faults or names the family lists' });
							break;
						}
						throw e;
					}
				}
				if (made === 0 && tried > 0) skipped++;
			}
		}
	}

	const kinds: Record<string, number> = Object.fromEntries(KINDS.map((k) => [k, 0]));
	const areas: Record<string, number> = Object.fromEntries(AREAS.map((a) => [a.id, 0]));
	for (const it of items) {
		kinds[it.kind]++;
		areas[it.area] = (areas[it.area] ?? 0) + 1;
	}
	return {
		items,
		errors,
		stats: { items: items.length, families: families.length, kinds, areas, errors: errors.length, skipped, duplicates, diagramChecks }
	};
}
