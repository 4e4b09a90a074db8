/**
 * npm run diagram -- FILE [--state NAME] [--fault KIND:TARGET[:OHMS]] [--highlight path:ELEMENT] [--wire-ids]
 *
 * Writes one standalone SVG of the circuit file to standard output. Switches are drawn in the state's
 * positions, relays pulled in when the solve energizes them; `--highlight path:ELEMENT` (repeatable)
 * outlines the current path through ELEMENT; `--fault` marks the faulted element and solves with it.
 * Bad input: one clear line per problem on standard error, exit code 1, never a stack trace.
 */
import { readFileSync } from 'node:fs';
import { parseFault, solveCircuit, tracePath, formatFault, type Circuit, type Fault } from '../src/lib/circuit/index';
import { layoutCircuit, readDiagramCircuit, renderSvg, type OverlaySet } from '../src/lib/diagram/index';

const USAGE = 'usage: npm run diagram -- FILE [--state NAME] [--fault KIND:TARGET[:OHMS]] [--highlight path:ELEMENT] [--wire-ids]';

class UsageError extends Error {}

type Args = { file: string; state: string | null; fault: string | null; highlights: string[]; wireIds: boolean };

function readArgs(argv: string[]): Args {
	const args: Args = { file: '', state: null, fault: null, highlights: [], wireIds: false };
	for (let i = 0; i < argv.length; i++) {
		const a = argv[i];
		const value = () => {
			const v = argv[++i];
			if (v === undefined || v.startsWith('--')) throw new UsageError(`${a} needs a value; ${USAGE}`);
			return v;
		};
		if (a === '--state') args.state = value();
		else if (a === '--fault') args.fault = value();
		else if (a === '--highlight') args.highlights.push(value());
		else if (a === '--wire-ids') args.wireIds = true;
		else if (a.startsWith('--')) throw new UsageError(`unknown option ${a}; ${USAGE}`);
		else if (!args.file) args.file = a;
		else throw new UsageError(`only one FILE, got "${args.file}" and "${a}"; ${USAGE}`);
	}
	if (!args.file) throw new UsageError(`no circuit file given; ${USAGE}`);
	return args;
}

/** The element a fault sits on, as drawn: a wire id, a part id, `K1.coil`, a cavity `C1.3`. */
function faultElements(f: Fault): string[] {
	const t = f.target;
	if (f.kind === 'short-between') return t.split(',');
	const m = /^([^.]+)\.(87a?|coil)$/.exec(t);
	if (m) return [m[2] === 'coil' ? t : `${m[1]}.contact`];
	return [t];
}

function main(): number {
	const args = readArgs(process.argv.slice(2));
	let text: string;
	try {
		text = readFileSync(args.file, 'utf8');
	} catch {
		throw new UsageError(`cannot read ${args.file}: check the path`);
	}
	const { circuit, diagram } = readDiagramCircuit(text);
	if (args.state !== null && !(args.state in diagram.states)) {
		const names = Object.keys(diagram.states);
		throw new UsageError(`unknown state "${args.state}"; ${names.length ? `the file has: ${names.join(', ')}` : 'the file has no states'}`);
	}
	const fault = args.fault ? parseFault(args.fault) : null;
	const overlays: OverlaySet[] = [];
	let energized = new Set<string>();
	let blown = new Set<string>();
	const solved = solveCircuit(circuit as Circuit, { state: args.state, fault });
	if (!('error' in solved)) {
		energized = new Set(Object.entries(solved.parts).filter(([, p]) => p.status === 'energized').map(([id]) => id));
		blown = new Set(Object.entries(solved.parts).filter(([, p]) => p.status === 'blown' || p.status === 'tripped').map(([id]) => id));
	}
	for (const h of args.highlights) {
		const m = /^path:(.+)$/.exec(h);
		if (!m) throw new UsageError(`--highlight takes path:ELEMENT (e.g. path:M1), got "${h}"`);
		const { elements } = tracePath(circuit, { state: args.state, fault, through: m[1] });
		overlays.push({ name: `path through ${m[1]}`, elements });
	}
	if (fault) overlays.push({ name: `fault ${formatFault(fault)}`, elements: faultElements(fault), style: 3 });
	const drawing = layoutCircuit(diagram, { state: args.state, energized, blown, showWireIds: args.wireIds });
	process.stdout.write(renderSvg(drawing, { overlays }));
	return 0;
}

try {
	process.exitCode = main();
} catch (e) {
	const message = e instanceof Error ? e.message : String(e);
	// One line per problem, prefixed so a person knows which tool spoke.
	for (const line of message.split('\n')) process.stderr.write(`diagram: ${line}\n`);
	process.exitCode = 1;
}
