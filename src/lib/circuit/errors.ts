/**
 * Typed errors of the circuit engine. Every error names the line, part, pin or fault that is wrong,
 * so a caller can show it to a person without a stack trace.
 */

/** One problem found in a circuit file: `line` is 1-based in the YAML text (0 when no line applies). */
export type Problem = { line: number; key: string; message: string };

/** Formats one problem as the command line prints it: `line N: key: message`. */
export function formatProblem(p: Problem): string {
	return `line ${p.line}: ${p.key}: ${p.message}`;
}

/**
 * Thrown by `parseCircuit` when a circuit file has problems. `problems` lists every one found in a
 * single pass, sorted by line; `message` is the problems joined, one per line as `line N: key: message`.
 */
export class CircuitFileError extends Error {
	problems: Problem[];
	constructor(problems: Problem[]) {
		super(problems.map(formatProblem).join('\n'));
		this.name = 'CircuitFileError';
		this.problems = problems;
	}
}

/** Thrown for a fault that cannot be read or does not fit the circuit; `fault` is the text or target given. */
export class FaultError extends Error {
	fault: string;
	constructor(fault: string, message: string) {
		super(message);
		this.name = 'FaultError';
		this.fault = fault;
	}
}

/** Thrown for observations that cannot be read or name a missing state, part or point. */
export class ObservationError extends Error {
	constructor(message: string) {
		super(message);
		this.name = 'ObservationError';
	}
}

/** Thrown for bad solve options: an unknown state, lamp point, element or what-if target. */
export class SolveOptionError extends Error {
	option: string;
	constructor(option: string, message: string) {
		super(message);
		this.name = 'SolveOptionError';
		this.option = option;
	}
}

/**
 * Thrown by `settledNetwork` and `tracePath` when the configuration is a dead short: 0 Ω elements
 * alone join nodes that sources hold at different voltages. `elements` are the 0 Ω elements on the
 * shortest loop that closes it.
 */
export class DeadShortError extends Error {
	elements: string[];
	constructor(elements: string[]) {
		super(`dead short through ${elements.join(', ')}: 0 ohm elements join nodes held at different volts`);
		this.name = 'DeadShortError';
		this.elements = elements;
	}
}
