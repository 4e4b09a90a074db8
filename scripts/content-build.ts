/**
 * The item bank build, file half: reads every .md file under content/items and content/circuits/*.yaml, builds
 * every markdown item and every family's variants (buildBank), checks diagrams on samples of every
 * family, and prints one JSON line of counts. Errors go to stderr, one per line: file, line, what is
 * wrong, what to do. Exits 1 when there are errors.
 *
 *   npm run content:build -- --check [--variants N] [--seed TEXT]
 *   npm run content:build [--variants N] [--seed TEXT]   (also writes the bank to the app's database)
 */
import { buildBank } from '../src/lib/items/bank';
import { checkDiagram } from '../src/lib/items/diagram-check';
import { readContent } from '../src/lib/server/content/files';


async function main(): Promise<number> {
	const args = process.argv.slice(2);
	const known = new Set(['--check', '--variants', '--seed']);
	for (let i = 0; i < args.length; i++) {
		if (!known.has(args[i])) {
			process.stderr.write(`unknown option "${args[i]}"; use --check, --variants N or --seed TEXT\n`);
			return 1;
		}
		if (args[i] !== '--check') i++;
	}
	const opt = (name: string) => {
		const i = args.indexOf(name);
		return i >= 0 ? args[i + 1] : undefined;
	};
	const variants = opt('--variants') === undefined ? undefined : Number(opt('--variants'));
	if (variants !== undefined && !(Number.isInteger(variants) && variants > 0)) {
		process.stderr.write('--variants needs a whole number above 0, e.g. --variants 24\n');
		return 1;
	}
	const { files, circuits } = readContent();
	const t0 = performance.now();
	const cpu0 = process.cpuUsage();
	const r = buildBank({ files, circuits, seed: opt('--seed'), variantsPerFamily: variants, checkDiagram });
	const ms = performance.now() - t0;
	const cpu = process.cpuUsage(cpu0);
	const cpuMs = (cpu.user + cpu.system) / 1000;
	for (const e of r.errors) process.stderr.write(`${e.file}:${e.line}: ${e.message}; ${e.fix}\n`);
	process.stderr.write(`built ${r.stats.items} items in ${(ms / 1000).toFixed(2)} s wall, ${(cpuMs / 1000).toFixed(2)} s CPU (${Math.round((r.stats.items / cpuMs) * 1000)} items/s of CPU); ${r.stats.skipped} forms skipped, ${r.stats.duplicates} duplicates dropped, ${r.stats.diagramChecks} diagrams checked\n`);
	const s = r.stats;
	process.stdout.write(JSON.stringify({ items: s.items, families: s.families, kinds: s.kinds, areas: s.areas, errors: s.errors }) + '\n');
	if (s.errors > 0) return 1;
	if (!args.includes('--check')) {
		// Without --check the bank is written to the app's database (DATABASE_URL, or DB_* as npm start uses).
		const { writeBankToDatabase } = await import('../src/lib/server/seed/bank');
		// Only the default build (no --variants, no --seed) is the shipped bank in full; then family items it
		// no longer makes are retired.
		const full = variants === undefined && opt('--seed') === undefined;
		const { FAMILIES } = await import('../src/lib/items/families');
		const w = await writeBankToDatabase(r.items, files, full ? FAMILIES.map((f) => f.id) : undefined);
		process.stderr.write(`database: ${w.newItems} new items, ${w.newVersions} new versions (${w.keyChanges} with a changed key, back in review), ${w.unchanged} unchanged; ${w.newFamilies} new families, ${w.familiesBackToReview} families back in review; ${w.retired} family items no longer built retired\n`);
	}
	return 0;
}

try {
	process.exitCode = await main();
} catch (e) {
	process.stderr.write(`content build failed: ${(e as Error).message}\n`);
	process.exitCode = 1;
}
