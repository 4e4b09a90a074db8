/**
 * Command line for circuit files (spec "The command line"):
 *   npm run circuit -- solve FILE [--state NAME] [--fault KIND:TARGET[:OHMS]] [--lamp POINT[:B+]]
 *   npm run circuit -- paths FILE --state NAME --through ELEMENT [--fault ...]
 *   npm run circuit -- diagnose FILE --observe "STATE: PART=STATUS, POINT=READS; STATE: ..."
 *   npm run circuit -- check FILE
 * Results go to standard output as JSON. Bad input exits 1 with every problem on standard error,
 * one per line as `line N: key: message` (line 0 when the problem is not in the file).
 */
import { readFileSync } from 'node:fs';
import {
	CircuitFileError,
	DeadShortError,
	checkCircuitText,
	diagnose,
	formatProblem,
	parseCircuit,
	parseObservations,
	solveCircuit,
	tracePath,
	type Problem
} from '../src/lib/circuit/index';

const USAGE = 'use: solve FILE [--state NAME] [--fault KIND:TARGET[:OHMS]] [--lamp POINT[:B+]] | paths FILE --state NAME --through ELEMENT [--fault F] | diagnose FILE --observe "STATE: PART=STATUS, ..." | check FILE';

const FLAGS: Record<string, string[]> = {
	solve: ['--state', '--fault', '--lamp'],
	paths: ['--state', '--through', '--fault'],
	diagnose: ['--observe'],
	check: []
};

class UsageError extends Error {
	problems: Problem[];
	constructor(problems: Problem[]) {
		super(problems.map(formatProblem).join('\n'));
		this.problems = problems;
	}
}

function usage(key: string, message: string): never {
	throw new UsageError([{ line: 0, key, message }]);
}

function parseArgs(argv: string[]): { command: string; file: string; flags: Record<string, string> } {
	const [command, file, ...rest] = argv;
	if (!command) usage('command', `no command given; ${USAGE}`);
	if (!(command in FLAGS)) usage('command', `unknown command "${command}"; ${USAGE}`);
	if (!file || file.startsWith('--')) usage('FILE', `${command} needs a circuit file; ${USAGE}`);
	const flags: Record<string, string> = {};
	for (let i = 0; i < rest.length; i++) {
		const a = rest[i];
		if (!FLAGS[command].includes(a)) usage(a, `unknown option "${a}" for ${command}; it takes ${FLAGS[command].join(', ') || 'no options'}`);
		const v = rest[i + 1];
		if (v === undefined || v.startsWith('--')) usage(a, `${a} needs a value`);
		if (a in flags) usage(a, `${a} is given twice`);
		flags[a] = v;
		i++;
	}
	if (command === 'paths' && !flags['--through']) usage('--through', 'paths needs --through ELEMENT');
	if (command === 'diagnose' && !flags['--observe']) usage('--observe', 'diagnose needs --observe "STATE: PART=STATUS, POINT=READS"');
	return { command, file, flags };
}

function readText(file: string): string {
	try {
		return readFileSync(file, 'utf8');
	} catch (e) {
		const code = (e as NodeJS.ErrnoException).code;
		const why = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder' : 'it cannot be read';
		usage('FILE', `cannot read "${file}": ${why}; check the path`);
	}
}

function main(argv: string[]): number {
	const { command, file, flags } = parseArgs(argv);
	const text = readText(file);
	if (command === 'check') {
		const problems = checkCircuitText(text);
		if (problems.length) throw new CircuitFileError(problems);
		return 0;
	}
	const c = parseCircuit(text);
	if (command === 'solve') {
		const r = solveCircuit(c, { state: flags['--state'], fault: flags['--fault'], lamp: flags['--lamp'] });
		process.stdout.write(JSON.stringify(r, null, 2) + '\n');
		return 'error' in r ? 1 : 0;
	}
	if (command === 'paths') {
		try {
			const p = tracePath(c, { state: flags['--state'], fault: flags['--fault'], through: flags['--through'] });
			process.stdout.write(JSON.stringify(p, null, 2) + '\n');
			return 0;
		} catch (e) {
			if (!(e instanceof DeadShortError)) throw e;
			const out = { state: flags['--state'] ?? null, fault: flags['--fault'] ?? null, error: 'dead-short', elements: e.elements };
			process.stdout.write(JSON.stringify(out, null, 2) + '\n');
			return 1;
		}
	}
	const d = diagnose(c, parseObservations(flags['--observe']));
	process.stdout.write(JSON.stringify(d, null, 2) + '\n');
	return 0;
}

function report(e: unknown): void {
	if (e instanceof CircuitFileError || e instanceof UsageError) {
		for (const p of e.problems) process.stderr.write(formatProblem(p) + '\n');
		return;
	}
	const err = e as { name?: string; message?: string; option?: string; fault?: string };
	const key =
		err.name === 'FaultError' ? 'fault' : err.name === 'ObservationError' ? 'observe' : err.name === 'SolveOptionError' ? (err.option ?? 'option') : 'error';
	const message = (err.message ?? String(e)).split('\n')[0];
	process.stderr.write(formatProblem({ line: 0, key, message }) + '\n');
}

try {
	process.exitCode = main(process.argv.slice(2));
} catch (e) {
	report(e);
	process.exitCode = 1;
}
