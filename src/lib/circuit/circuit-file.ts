/**
 * The entry points for circuit file text: parse (throwing) and check (listing problems).
 */
import { CircuitFileError, type Problem } from './errors';
import type { Circuit } from './model';
import { buildCircuit } from './validate';

/**
 * Parses and validates circuit file text (YAML 1.2) in one pass.
 * @throws CircuitFileError listing every problem, each with its 1-based line and key.
 */
export function parseCircuit(text: string): Circuit {
	const { circuit, problems } = buildCircuit(text);
	if (!circuit) throw new CircuitFileError(problems);
	return circuit;
}

/** Every problem in circuit file text, sorted by line; [] for a good file. Never throws. */
export function checkCircuitText(text: string): Problem[] {
	return buildCircuit(text).problems;
}
